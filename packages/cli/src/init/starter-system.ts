import type { UnitSystem } from '@vacnet/engine';

/** Catalog item names the starter system refers to. */
export interface StarterItems {
  spec: string;
  hose: string;
  tool: string;
  producer: string;
  separator?: string;
}

export interface StarterOptions {
  name: string;
  operators: number;
  units: UnitSystem;
  /** The `use` path of the catalog, relative to the system file (forward slashes). */
  catalogPath?: string;
  items: StarterItems;
}

/**
 * A starter system for `vacnet init`: a plant room and one zone per
 * operator, each zone its own main from the plant with two inlets (one on
 * the main, one up a riser). A riser serves one inlet, so one operator: 2 in
 * (50 mm) carries debris with the tool working and stays under the noise
 * limit with it lifted. A main serves both inlets of its zone, so with two
 * or more design operators both may be open on it: 2-1/2 in (63 mm) keeps
 * two lifted tools under the limit and still carries fine dust for one (the
 * trade examples/harbour-offices.vacnet explains). Every
 * inlet gets the catalog's hose and tool; cleanouts sit where the cleanout
 * rule asks for them (base of each riser, far end of each run). A layout to
 * edit, not a design.
 */
export function starterSystem(options: StarterOptions): string {
  const { units, items } = options;
  const si = units === 'si';
  const operators = Math.max(1, Math.floor(options.operators));
  const zones = operators;
  const size = si ? '50 mm' : '2 in';
  const mainSize = operators === 1 ? size : si ? '63 mm' : '2-1/2 in';
  const length = (feet: number, metres: number) => (si ? `${metres} m` : `${feet} ft`);
  const lines: string[] = [];
  lines.push('// Written by `vacnet init`: a starting point to edit. Check it with `vacnet check`.');
  if (options.catalogPath) lines.push(`use ${JSON.stringify(options.catalogPath)}`);
  lines.push('');
  lines.push(`system ${JSON.stringify(options.name)} {`);
  lines.push(`  units ${units}`);
  lines.push(`  operators ${operators}`);
  lines.push('  // Office dust, lint and paper: the very fine light dust band [ACGIH Industrial Ventilation].');
  lines.push('  debris fine');
  lines.push(`  defaults hose ${items.hose} tool ${items.tool}`);
  lines.push('');
  lines.push(`  plant plant-room { producer ${items.producer}${items.separator ? ` separator ${items.separator} indoors` : ''} }`);
  for (let z = 0; z < zones; z++) {
    const zone = String.fromCharCode(97 + (z % 26)) + (z >= 26 ? String(Math.floor(z / 26)) : '');
    const upper = zone.toUpperCase();
    lines.push('');
    lines.push(`  // Zone ${upper}: a main along the corridor and a riser to the floor above.`);
    lines.push(`  pipe main-${zone} from plant-room to ${zone}-1 spec ${items.spec} size ${mainSize} length ${length(40, 12)} horizontal`);
    lines.push(`  pipe riser-${zone} from ${zone}-1 to ${zone}-2 spec ${items.spec} size ${size} length ${length(12, 3.5)} up joins sweep`);
    lines.push(`  inlet ${upper}1 on main-${zone} at ${length(20, 6)} room "Zone ${upper}, ground floor"`);
    lines.push(`  inlet ${upper}2 at ${zone}-2 room "Zone ${upper}, first floor"`);
    lines.push(`  cleanout at ${zone}-1`);
  }
  lines.push('}');
  return lines.join('\n') + '\n';
}
