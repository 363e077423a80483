import type { BillOfMaterials } from '@vacnet/engine';
import { nominalSizeText } from './nominal-size-text.js';
import type { QuantityText } from './quantity-text.js';

/** One line of the bill of materials. */
export interface MaterialRow {
  item: string;
  /** Make, size and the like. */
  description: string;
  /** `271.9 ft` or `11`. */
  quantity: string;
}

/** The bill of materials in groups, each a short table. */
export interface BillOfMaterialsModel {
  groups: { title: string; rows: MaterialRow[] }[];
}

const FITTING_NAMES: Readonly<Record<BillOfMaterials['fittings'][number]['kind'], string>> = {
  bend: 'Bend',
  reducer: 'Reducer',
  wye: 'Wye',
  tee: 'Tee',
  sweep: 'Sweep entry',
};

/**
 * The engine's bill of materials as text: pipe lengths by spec and size,
 * fittings, inlets and cleanouts, the hose and tool kits for the design
 * operators, and the plant.
 */
export function billOfMaterialsModel(bom: BillOfMaterials, text: QuantityText): BillOfMaterialsModel {
  const units = text.units;
  const groups: BillOfMaterialsModel['groups'] = [];
  const pipes = bom.pipes.map((p) => ({
    item: `Pipe, ${p.spec}`,
    description: `${p.material}, ${nominalSizeText(p.nominalSizeM, units)} (bore ${text.bore(p.insideDiameterM)}), ${p.runs} ${p.runs === 1 ? 'run' : 'runs'}`,
    quantity: text.length(p.lengthM),
  }));
  if (pipes.length > 0) groups.push({ title: 'Piping', rows: pipes });

  const fittings = bom.fittings.map((f) => {
    const details = [
      nominalSizeText(f.nominalSizeM, units),
      f.angleRad !== undefined ? text.angle(f.angleRad) : '',
      f.radiusRatio !== undefined ? `radius ${f.radiusRatio} D` : '',
    ].filter(Boolean);
    return { item: `${FITTING_NAMES[f.kind] ?? f.kind}, ${f.spec}`, description: details.join(', '), quantity: `${f.count}` };
  });
  if (fittings.length > 0) groups.push({ title: 'Fittings', rows: fittings });

  groups.push({
    title: 'Inlets and cleanouts',
    rows: [
      { item: 'Inlet valve', description: 'wall or pickup inlet', quantity: `${bom.inlets}` },
      { item: 'Cleanout', description: 'capped access for rodding', quantity: `${bom.cleanouts}` },
    ],
  });

  const kits = [
    ...bom.hoses.map((h) => ({ item: `Hose, ${h.kind}`, description: `${text.length(h.lengthM)}, bore ${text.bore(h.boreM)}`, quantity: `${h.count}` })),
    ...bom.tools.map((t) => ({ item: `Tool, ${t.kind}`, description: '', quantity: `${t.count}` })),
  ];
  if (kits.length > 0) groups.push({ title: 'Hose and tool kits (for the design operators)', rows: kits });

  const plant = [
    ...bom.producers.map((p) => ({ item: 'Producer', description: p.model, quantity: `${p.count}` })),
    ...bom.separators.map((s) => ({ item: 'Separator', description: s.model, quantity: `${s.count}` })),
    ...bom.filters.map((f) => ({ item: 'Filter', description: f.model, quantity: `${f.count}` })),
  ];
  if (plant.length > 0) groups.push({ title: 'Plant', rows: plant });
  return { groups };
}
