/**
 * Bill of materials from the model: pipe length by spec and nominal size,
 * fittings by kind and size, inlets, cleanouts, hoses, tools and equipment.
 *
 * Hoses and tools are carried by the operators, not fixed at inlets: the
 * bill counts, per hose or tool kind, enough for the design operators to
 * work at once on inlets of that kind (the smaller of k and the number of
 * inlets served by that kind). Our reading of common practice.
 */
import type { SystemModel } from '../network/model.js';
import type { BillOfMaterials } from './analysis-types.js';

// The order String.prototype.localeCompare gives, from one collator made once (localeCompare builds one per call).
const TEXT_ORDER = new Intl.Collator();

// Angles group to 1e-4 rad (0.006 deg) and radius ratios to 0.01 (our choice: written values repeat exactly).
const ANGLE_KEY_DIGITS = 4;

export function billOfMaterials(model: SystemModel, operators: number): BillOfMaterials {
  const pipes = new Map<string, BillOfMaterials['pipes'][number]>();
  const fittings = new Map<string, BillOfMaterials['fittings'][number]>();
  const addFitting = (f: BillOfMaterials['fittings'][number]) => {
    const key = [f.kind, f.spec, f.nominalSizeM, f.angleRad?.toFixed(ANGLE_KEY_DIGITS), f.radiusRatio?.toFixed(2)].join('|');
    const cur = fittings.get(key);
    if (cur) cur.count += f.count;
    else fittings.set(key, { ...f });
  };
  for (const p of model.pipes ?? []) {
    const key = `${p.spec.name}|${p.nominalSizeM}`;
    const cur = pipes.get(key);
    const len = Number.isFinite(p.lengthM) && p.lengthM > 0 ? p.lengthM : 0;
    if (cur) {
      cur.lengthM += len;
      cur.runs++;
    } else {
      pipes.set(key, {
        spec: p.spec.name,
        material: p.spec.material,
        nominalSizeM: p.nominalSizeM,
        insideDiameterM: p.insideDiameterM,
        lengthM: len,
        runs: 1,
      });
    }
    for (const f of p.fittings ?? []) {
      if (f.kind === 'bend') {
        addFitting({ kind: 'bend', spec: p.spec.name, nominalSizeM: p.nominalSizeM, angleRad: f.angleRad, radiusRatio: f.radiusRatio, count: Math.max(0, f.count) });
      } else {
        const r: BillOfMaterials['fittings'][number] = { kind: 'reducer', spec: p.spec.name, nominalSizeM: p.nominalSizeM, count: 1 };
        if (f.angleRad !== undefined) r.angleRad = f.angleRad;
        addFitting(r);
      }
    }
    if (p.joins) {
      const j: BillOfMaterials['fittings'][number] = { kind: p.joins.kind, spec: p.spec.name, nominalSizeM: p.nominalSizeM, count: 1 };
      if (p.joins.kind === 'wye') j.angleRad = p.joins.angleRad;
      addFitting(j);
    }
  }
  const k = Math.max(1, Math.floor(operators));
  const perKind = <T>(items: T[], key: (t: T) => string) => {
    const m = new Map<string, { item: T; count: number }>();
    for (const it of items) {
      const kk = key(it);
      const cur = m.get(kk);
      if (cur) cur.count++;
      else m.set(kk, { item: it, count: 1 });
    }
    return [...m.values()];
  };
  const inlets = model.inlets ?? [];
  const hoses = perKind(inlets.filter((i) => i.hose).map((i) => i.hose), (h) => h.name).map(({ item, count }) => ({
    kind: item.name,
    lengthM: item.lengthM,
    boreM: item.boreM,
    count: Math.min(k, count),
  }));
  const tools = perKind(inlets.filter((i) => i.tool).map((i) => i.tool), (t) => t.name).map(({ item, count }) => ({ kind: item.name, count: Math.min(k, count) }));
  const models = <T extends { model: { name: string } }>(units: T[]) =>
    perKind(units, (u) => u.model.name).map(({ item, count }) => ({ model: item.model.name, count }));
  const byName = (a: { spec: string; nominalSizeM: number }, b: { spec: string; nominalSizeM: number }) =>
    TEXT_ORDER.compare(a.spec, b.spec) || a.nominalSizeM - b.nominalSizeM;
  return {
    pipes: [...pipes.values()].sort(byName),
    fittings: [...fittings.values()].sort((a, b) => TEXT_ORDER.compare(a.kind, b.kind) || byName(a, b) || (a.angleRad ?? 0) - (b.angleRad ?? 0)),
    inlets: inlets.length,
    cleanouts: (model.cleanouts ?? []).length,
    hoses,
    tools,
    producers: models(model.producers ?? []),
    separators: models(model.separators ?? []),
    filters: models(model.filters ?? []),
  };
}
