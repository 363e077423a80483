import type { SystemAnalysis, SystemModel } from '@vacnet/engine';
import { marginBand, MARGIN_BAND_TEXT, type MarginBand } from './margin-band.js';
import { NO_VALUE, type QuantityText } from './quantity-text.js';

/** One inlet in its worst case: the design operators open, this one among them, tools working. */
export interface InletRow {
  name: string;
  room: string;
  /** `std-50 hose, carpet tool`. */
  kit: string;
  toolVacuum: string;
  need: string;
  /** `+0.12 inHg (+4 %)`. */
  margin: string;
  band: MarginBand;
  bandText: string;
  flow: string;
  toolAirPower: string;
  inletVacuum: string;
  hoseLoss: string;
  /** The other inlets open in the worst case. */
  others: string[];
  /** `exact, 210 sets` or `ranked search with swaps, 40 sets`. */
  method: string;
  /** The design case's critical inlet. */
  critical: boolean;
  si: {
    toolVacuumPa: number | null;
    requiredToolVacuumPa: number | null;
    flowStdM3PerS: number | null;
    toolAirPowerW: number | null;
    inletVacuumPa: number | null;
    hoseLossPa: number | null;
  };
}

/** The inlet table, in the file's order. */
export function inletRows(model: SystemModel, analysis: SystemAnalysis, text: QuantityText): InletRow[] {
  const byName = new Map((model.inlets ?? []).map((i) => [i.name, i]));
  const critical = analysis.designCase?.criticalInlet;
  return analysis.inlets.map((a) => {
    const inlet = byName.get(a.name);
    const wc = a.worstCase;
    const need = wc?.requiredToolVacuumPa ?? inlet?.tool?.requiredVacuumPa ?? model.design?.defaultToolVacuumPa ?? null;
    const band = marginBand(wc?.toolVacuumPa, need);
    const kit = [inlet?.hose?.name ? `${inlet.hose.name} hose` : '', inlet?.tool?.name ? `${inlet.tool.name} tool` : ''].filter(Boolean).join(', ');
    return {
      name: a.name,
      room: inlet?.label ?? '',
      kit,
      toolVacuum: text.vacuum(wc?.toolVacuumPa),
      need: need === null ? 'not stated' : text.vacuum(need),
      margin:
        wc && need !== null && need > 0 ? `${text.signedVacuum(wc.toolVacuumPa - need)} (${text.signedPercent((wc.toolVacuumPa - need) / need)})` : NO_VALUE,
      band,
      bandText: MARGIN_BAND_TEXT[band].label,
      flow: text.flow(wc?.flowStdM3PerS),
      toolAirPower: text.power(wc?.toolAirPowerW),
      inletVacuum: text.vacuum(wc?.inletVacuumPa),
      hoseLoss: text.vacuum(wc?.hoseLossPa),
      others: wc ? wc.openInlets.filter((n) => n !== a.name) : [],
      method: wc ? `${wc.method === 'exact' ? 'exact' : 'ranked search with swaps'}, ${wc.setsEvaluated} ${wc.setsEvaluated === 1 ? 'set' : 'sets'}` : 'not solved',
      critical: a.name === critical,
      si: {
        toolVacuumPa: wc?.toolVacuumPa ?? null,
        requiredToolVacuumPa: need,
        flowStdM3PerS: wc?.flowStdM3PerS ?? null,
        toolAirPowerW: wc?.toolAirPowerW ?? null,
        inletVacuumPa: wc?.inletVacuumPa ?? null,
        hoseLossPa: wc?.hoseLossPa ?? null,
      },
    };
  });
}
