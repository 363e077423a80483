import type { SystemAnalysis, SystemModel } from '@vacnet/engine';
import { marginBand, type MarginBand } from './margin-band.js';
import type { QuantityText } from './quantity-text.js';
import type { FindingCounts } from './report-model.js';

export interface ProducerSummary {
  name: string;
  /** The producer model (catalog name). */
  model: string;
  flow: string;
  vacuum: string;
  airPower: string;
  shaftPower: string | null;
  /** `+25 % on flow`, or why there is none. */
  margin: string;
  requiredMargin: string | null;
  /** Margin against the required margin: true met, false not met, null not judged. */
  marginMet: boolean | null;
  /** The producer runs past its curve or on its relief. */
  limited: string | null;
  si: { flowStdM3PerS: number; vacuumPa: number; airPowerW: number; shaftPowerW: number | null; marginFraction: number | null };
}

export interface WorstInletSummary {
  name: string;
  room: string | null;
  toolVacuum: string;
  need: string | null;
  /** Tool vacuum over need: `+0.12 inHg (+4 %)`. */
  margin: string | null;
  band: MarginBand;
  flow: string;
  /** The other inlets open in its worst case. */
  others: string[];
  si: { toolVacuumPa: number; requiredToolVacuumPa: number | null };
}

export interface SummaryModel {
  systemName: string | null;
  operators: number | null;
  inletCount: number;
  pipeCount: number;
  producer: ProducerSummary | null;
  /** Set when there are several producers: only the first is summarised. */
  producersNote: string | null;
  worstInlet: WorstInletSummary | null;
  counts: FindingCounts;
}

const LIMIT_TEXT = {
  'curve-end': 'runs past the end of its curve: the figures are extrapolated',
  relief: 'runs on its vacuum relief',
} as const;

/** The few figures a reviewer reads first. */
export function summaryModel(model: SystemModel | undefined, analysis: SystemAnalysis | undefined, counts: FindingCounts, text: QuantityText): SummaryModel {
  const summary: SummaryModel = {
    systemName: model?.name ?? null,
    operators: analysis?.operators.count ?? null,
    inletCount: model?.inlets?.length ?? 0,
    pipeCount: model?.pipes?.length ?? 0,
    producer: null,
    producersNote: null,
    worstInlet: null,
    counts,
  };
  if (!model || !analysis) return summary;

  const p = analysis.producer;
  if (p) {
    const required = model.design?.producerMarginFraction;
    const unit = model.producers?.find((u) => u.name === p.name);
    summary.producer = {
      name: p.name,
      model: unit?.model?.name ?? p.name,
      flow: text.flow(p.flowStdM3PerS),
      vacuum: text.vacuum(p.vacuumPa),
      airPower: text.power(p.airPowerW),
      shaftPower: p.shaftPowerW === null ? null : text.power(p.shaftPowerW),
      margin: p.marginFraction === null ? 'not known: no open tool states the vacuum it needs' : `${text.signedPercent(p.marginFraction)} on flow`,
      requiredMargin: required === undefined ? null : `${text.percent(required)} on flow`,
      marginMet: p.marginFraction === null || required === undefined ? null : p.marginFraction >= required,
      limited: p.limited ? LIMIT_TEXT[p.limited] : null,
      si: { flowStdM3PerS: p.flowStdM3PerS, vacuumPa: p.vacuumPa, airPowerW: p.airPowerW, shaftPowerW: p.shaftPowerW, marginFraction: p.marginFraction },
    };
    if (analysis.producers.length > 1) summary.producersNote = `The system has ${analysis.producers.length} producers; the first, ${p.name}, is shown.`;
  }

  const critical = analysis.designCase?.criticalInlet;
  const inlet = analysis.inlets.find((i) => i.name === critical);
  const wc = inlet?.worstCase;
  if (inlet && wc) {
    const need = wc.requiredToolVacuumPa;
    summary.worstInlet = {
      name: inlet.name,
      room: model.inlets?.find((i) => i.name === inlet.name)?.label ?? null,
      toolVacuum: text.vacuum(wc.toolVacuumPa),
      need: need === null ? null : text.vacuum(need),
      margin: need === null ? null : `${text.signedVacuum(wc.toolVacuumPa - need)} (${text.signedPercent(need > 0 ? (wc.toolVacuumPa - need) / need : null)})`,
      band: marginBand(wc.toolVacuumPa, need),
      flow: text.flow(wc.flowStdM3PerS),
      others: wc.openInlets.filter((n) => n !== inlet.name),
      si: { toolVacuumPa: wc.toolVacuumPa, requiredToolVacuumPa: need },
    };
  }
  return summary;
}
