import type { SystemAnalysis, SystemModel } from '@vacnet/engine';
import { nominalSizeText } from './nominal-size-text.js';
import type { QuantityText } from './quantity-text.js';

/** One inlet's line on the test sheet; the field reading is left blank for the commissioning engineer. */
export interface CommissioningRow {
  name: string;
  room: string;
  orifice: string;
  /** The gauge reading expected at the inlet valve with the orifice in it. */
  expectedGauge: string;
  flow: string;
  /** The other inlets that hold an orifice at the same time (its worst-case set). */
  withOrificesIn: string[];
  /** With the orifice alone, when the analysis predicted it. */
  expectedAlone: string | null;
  si: { gaugeVacuumPa: number; flowStdM3PerS: number };
}

export interface CommissioningSheet {
  orifice: string;
  dischargeCoefficient: number;
  /** How to take the readings. */
  procedure: string[];
  rows: CommissioningRow[];
}

/**
 * The commissioning test sheet: for each inlet, the vacuum a gauge at its
 * valve should read with the test orifice in the valve while the other
 * inlets of its worst case each hold an orifice too (a set-up that needs no
 * operators), and an empty column for what the gauge reads on site.
 */
export function commissioningSheet(model: SystemModel, analysis: SystemAnalysis, text: QuantityText): CommissioningSheet | null {
  const c = analysis.commissioning;
  if (!c) return null;
  const rooms = new Map((model.inlets ?? []).map((i) => [i.name, i.label ?? '']));
  const orifice = nominalSizeText(c.testOrificeDiameterM, model.displayUnits);
  return {
    orifice,
    dischargeCoefficient: c.dischargeCoefficient,
    procedure: [
      `Fit a ${orifice} sharp-edged test orifice and a vacuum gauge at the inlet valve under test.`,
      'Fit the same orifice in each inlet listed beside it, so that the design operators\u2019 air flows; leave every other inlet closed.',
      'Run the producer, let the reading settle, and write it down with the gauge\u2019s units. The expected values take the filter loaded, as the design case does; with a new, clean filter the readings run somewhat higher.',
      'A reading well below the expected value points to a leak, a blockage or an open inlet; well above, to a closed or blocked line upstream of the gauge.',
    ],
    rows: c.inlets.map((p) => ({
      name: p.name,
      room: rooms.get(p.name) ?? '',
      orifice,
      expectedGauge: text.vacuum(p.gaugeVacuumPa),
      flow: text.flow(p.flowStdM3PerS),
      withOrificesIn: p.openInlets.filter((n) => n !== p.name),
      expectedAlone: p.aloneGaugeVacuumPa === null ? null : text.vacuum(p.aloneGaugeVacuumPa),
      si: { gaugeVacuumPa: p.gaugeVacuumPa, flowStdM3PerS: p.flowStdM3PerS },
    })),
  };
}
