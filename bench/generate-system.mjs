// Synthetic systems for the benchmarks: a plant, a horizontal main, risers
// up from the main, a branch on every floor of a riser and inlets on each
// branch, with an inline catalog at the top of the file. The same network is
// also written as JSON, so the language can be compared with JSON.parse on
// identical content.

/** Inlets on each branch, branches (floors) on each riser: an office-like layout. */
const INLETS_PER_BRANCH = 2;
const FLOORS_PER_RISER = 10;
const INLETS_PER_RISER = INLETS_PER_BRANCH * FLOORS_PER_RISER;

const CATALOG_TEXT = `// Catalog for a synthetic benchmark system.
spec steel-10 material steel schedule 10 roughness 45 um conductive
hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm conductive
tool carpet-wide working orifice 7/8 in lifted orifice 1-1/4 in needs 5 inHg
tool crevice working orifice 5/8 in lifted orifice 3/4 in needs 4 inHg
producer exh-big {
  curve { at 0 scfm 15 inHg 20 kW  at 300 scfm 13 inHg 28 kW  at 600 scfm 10 inHg 34 kW  at 900 scfm 6 inHg 38 kW }
  efficiency 60 %
}
separator cyclone-36 loss 2 inH2O at 600 scfm
filter bag-60 clean 3 inH2O at 600 scfm loaded 8 inH2O at 600 scfm
`;

const q = (value, unit) => ({ value, unit });

const CATALOG_JSON = {
  specs: [{ name: 'steel-10', material: 'steel', schedule: 10, roughness: q(45, 'um'), conductive: true }],
  hoses: [{ name: 'std-50', length: q(50, 'ft'), bore: q('1-1/2', 'in'), roughness: q(0.3, 'mm'), conductive: true }],
  tools: [
    { name: 'carpet-wide', working: { orifice: q('7/8', 'in') }, lifted: { orifice: q('1-1/4', 'in') }, needs: q(5, 'inHg') },
    { name: 'crevice', working: { orifice: q('5/8', 'in') }, lifted: { orifice: q('3/4', 'in') }, needs: q(4, 'inHg') },
  ],
  producers: [
    {
      name: 'exh-big',
      curve: [
        { flow: q(0, 'scfm'), vacuum: q(15, 'inHg'), power: q(20, 'kW') },
        { flow: q(300, 'scfm'), vacuum: q(13, 'inHg'), power: q(28, 'kW') },
        { flow: q(600, 'scfm'), vacuum: q(10, 'inHg'), power: q(34, 'kW') },
        { flow: q(900, 'scfm'), vacuum: q(6, 'inHg'), power: q(38, 'kW') },
      ],
      efficiency: q(60, '%'),
    },
  ],
  separators: [{ name: 'cyclone-36', loss: q(2, 'inH2O'), at: q(600, 'scfm') }],
  filters: [{ name: 'bag-60', clean: { loss: q(3, 'inH2O'), at: q(600, 'scfm') }, loaded: { loss: q(8, 'inH2O'), at: q(600, 'scfm') } }],
};

/**
 * A system with `inlets` inlets.
 * Returns { text, json, counts: { inlets, pipes, bytes, jsonBytes } }.
 */
export function generateSystem(inlets) {
  const lines = [CATALOG_TEXT, `system "Synthetic ${inlets}-inlet building" {`];
  const system = {
    title: `Synthetic ${inlets}-inlet building`,
    site: { elevation: q(40, 'ft'), temperature: q(68, 'degF') },
    operators: 4,
    debris: 'general',
    defaults: { hose: 'std-50', tool: 'carpet-wide' },
    plant: { name: 'plant-1', producer: 'exh-big', exhaust: { loss: q(1, 'inH2O'), at: q(600, 'scfm') }, filter: 'bag-60', separator: { model: 'cyclone-36', placement: 'outdoors' } },
    pipes: [],
    inlets: [],
    cleanouts: [],
  };
  lines.push(
    '  site elevation 40 ft temperature 68 degF',
    '  operators 4',
    '  debris general',
    '  defaults hose std-50 tool carpet-wide',
    '',
    '  plant plant-1 { producer exh-big exhaust 1 inH2O at 600 scfm  filter bag-60  separator cyclone-36 outdoors }',
  );

  const pipe = (p) => {
    system.pipes.push(p);
    let line = `  pipe ${p.name} from ${p.from} to ${p.to} spec ${p.spec} size ${p.size.value} ${p.size.unit} length ${p.length.value} ${p.length.unit} ${p.orientation}`;
    for (const bend of p.bends ?? []) line += ` bend ${bend.angle.value} ${bend.angle.unit} radius ${bend.radius.value} ${bend.radius.unit}`;
    if (p.joins) line += ` joins ${p.joins.kind} ${p.joins.angle.value} ${p.joins.angle.unit}`;
    lines.push(line);
  };

  const risers = Math.ceil(inlets / INLETS_PER_RISER);
  let placed = 0;
  let previous = 'plant-1';
  for (let r = 1; r <= risers; r++) {
    lines.push('', `  // riser ${r}`);
    const junction = `m-${r}`;
    pipe({ name: `main-${r}`, from: previous, to: junction, spec: 'steel-10', size: q(4, 'in'), length: q(20, 'ft'), orientation: 'horizontal' });
    lines.push(`  cleanout at ${junction}`);
    system.cleanouts.push({ at: junction });
    previous = junction;
    let floorPoint = junction;
    for (let f = 1; f <= FLOORS_PER_RISER && placed < inlets; f++) {
      const riserPoint = `r${r}-${f}`;
      pipe({
        name: `riser-${r}-${f}`, from: floorPoint, to: riserPoint, spec: 'steel-10', size: q(3, 'in'), length: q(12, 'ft'), orientation: 'up',
        ...(f === 1 ? { joins: { kind: 'wye', angle: q(45, 'deg') } } : {}),
      });
      floorPoint = riserPoint;
      const branch = `br-${r}-${f}`;
      pipe({
        name: branch, from: riserPoint, to: `b${r}-${f}`, spec: 'steel-10', size: q(2, 'in'), length: q(40, 'ft'), orientation: 'horizontal',
        bends: [{ angle: q(90, 'deg'), radius: q(1.5, 'D') }], joins: { kind: 'wye', angle: q(45, 'deg') },
      });
      for (let i = 0; i < INLETS_PER_BRANCH && placed < inlets; i++, placed++) {
        const inlet = { name: `I${r}-${f}-${i + 1}`, pipe: branch, at: q(10 + 20 * i, 'ft'), room: `Room ${r}.${f}.${i + 1}` };
        // Every fifth inlet serves small rooms with a crevice tool.
        if (placed % 5 === 4) inlet.tool = 'crevice';
        system.inlets.push(inlet);
        lines.push(`  inlet ${inlet.name} on ${branch} at ${inlet.at.value} ft${inlet.tool ? ` tool ${inlet.tool}` : ''} room "${inlet.room}"`);
      }
    }
  }
  lines.push('}', '');
  const text = lines.join('\n');
  const json = JSON.stringify({ catalog: CATALOG_JSON, system });
  return { text, json, counts: { inlets: placed, pipes: system.pipes.length, bytes: Buffer.byteLength(text), jsonBytes: Buffer.byteLength(json) } };
}
