import type { AstNode } from 'langium';
import type { HoseKind, Inlet, InletAnalysis, PipeAnalysis, ProducerPoint, ScenarioAnalysis, SystemAnalysis, SystemModel, ToolLaw } from '@vacnet/engine';
import type { DocumentAnalysis } from '../engine-bridge/analysis-cache.js';
import { display, nameList, type Display } from './analysis-text.js';

// How each value is computed, in a few lines with the sources the engine names (see its element laws).
const HOW_PIPE =
  'Isothermal compressible flow with friction and fitting losses, p1² − p2² = (ṁ/A)² R T [f L/D + ΣK + 2 ln(p1/p2)] (Crane Technical Paper 410; Shapiro 1953, ch. 6), f by Churchill (1977).';
const HOW_NETWORK = 'Each case is solved for the pressure at every node by damped Newton iteration until the air into each node balances the air out (to 1e-9 of the flow).';
const HOW_VELOCITY = 'Velocity v = ṁ R T / (p A) at the pressure of the pipe end it is taken at.';
const HOW_PRODUCER =
  'Producer curve interpolated by PCHIP (Fritsch and Carlson 1980). Demand: the producer inlet held at the vacuum where the critical tool gets exactly what it needs (regula falsi, Illinois variant). Margin: curve flow at the demand vacuum over the demand flow, minus one.';

/**
 * The computed values of an element in markdown: what the analysis found and
 * how, in a few lines. Undefined for elements the analysis says nothing about.
 */
export function elementHover(node: AstNode, state: DocumentAnalysis): string | undefined {
  const analysis = state.result?.analysis;
  const model = state.model;
  if (!analysis || !model) return undefined;
  const text = display(model.displayUnits);
  const name = (node as { name?: unknown }).name;
  switch (node.$type) {
    case 'Inlet': {
      const inlet = analysis.inlets.find((i) => i.name === name);
      const modelInlet = model.inlets.find((i) => i.name === name);
      return inlet && modelInlet ? inletHover(inlet, modelInlet, analysis, text) : undefined;
    }
    case 'Pipe': {
      const pipe = analysis.pipes.find((p) => p.name === name);
      return pipe ? pipeHover(pipe, text) : undefined;
    }
    case 'Plant':
    case 'ProducerModel': {
      const points = analysis.producers.filter((p) => (node.$type === 'Plant' ? p.name.startsWith(`${String(name)}.`) : usesModel(model, p.name, String(name))));
      return points.length > 0 ? points.map((p) => producerHover(p, text)).join('\n\n') : undefined;
    }
    case 'Scenario': {
      const scenario = analysis.scenarios.find((s) => s.name === name);
      return scenario ? scenarioHover(scenario, text) : undefined;
    }
    case 'HoseKind':
    case 'ToolKind':
      return kindHover(node.$type, String(name), model, analysis, text);
    default:
      return undefined;
  }
}

function inletHover(inlet: InletAnalysis, modelInlet: Inlet, analysis: SystemAnalysis, text: Display): string {
  const lines: string[] = [`**Computed for inlet \`${inlet.name}\`** (${text.units === 'si' ? 'SI' : 'imperial'} units)`];
  const wc = inlet.worstCase;
  if (wc) {
    const others = wc.openInlets.filter((n) => n !== inlet.name);
    const need = wc.requiredToolVacuumPa !== null ? ` (needs ${text.pressure(wc.requiredToolVacuumPa)})` : '';
    lines.push(
      `- Worst case, ${others.length > 0 ? `with ${nameList(others)} also open` : 'alone'}: ${text.pressure(wc.toolVacuumPa)} at the tool${need}, ${text.pressure(wc.inletVacuumPa)} at the inlet valve, hose loss ${text.pressure(wc.hoseLossPa)}, ${text.flow(wc.flowStdM3PerS)}, tool air power ${text.power(wc.toolAirPowerW)}.`,
    );
  } else {
    lines.push('- Worst case: not computed (see the findings).');
  }
  if (inlet.alone) {
    const a = inlet.alone;
    lines.push(`- Alone: ${text.pressure(a.toolVacuumPa)} at the tool, ${text.pressure(a.inletVacuumPa)} at the valve, ${text.flow(a.flowStdM3PerS)}.`);
  }
  const k = analysis.operators.count;
  const how = [
    HOW_NETWORK,
    `Hose \`${modelInlet.hose.name}\`: ${hoseLaw(modelInlet.hose)}`,
    `Tool \`${modelInlet.tool.name}\`: ${toolLaw(modelInlet.tool.working)}`,
  ];
  if (wc) {
    how.push(
      wc.method === 'exact'
        ? `Worst case: exact — every set of ${k} design operator${k === 1 ? '' : 's'} that includes this inlet was solved (${wc.setsEvaluated} sets).`
        : `Worst case: greedy-swap — partners ranked by the path they share with this inlet and by the air they draw alone; the sets rated worst were solved exactly (${wc.setsEvaluated} sets).`,
    );
  }
  return `${lines.join('\n')}\n\n_How:_ ${how.join(' ')}`;
}

function pipeHover(pipe: PipeAnalysis, text: Display): string {
  const lines = [`**Computed for pipe \`${pipe.name}\`**: inside diameter ${text.length(pipe.insideDiameterM)}, ${text.length(pipe.lengthM)} long, serves ${pipe.servedInlets.length} inlet${pipe.servedInlets.length === 1 ? '' : 's'}.`];
  if (pipe.minVelocityMPerS !== null) {
    lines.push(`- Lowest velocity, one operator${pipe.minVelocityInlet ? ` at \`${pipe.minVelocityInlet}\`` : ''} (tool working): ${text.velocity(pipe.minVelocityMPerS)} at the upstream end.`);
  }
  if (pipe.maxVelocityMPerS !== null) {
    lines.push(`- Highest velocity, ${nameList(pipe.maxVelocityInlets)} open with tools lifted: ${text.velocity(pipe.maxVelocityMPerS)} at the producer-side end${pipe.lossPa !== null ? `; loss along the pipe ${text.pressure(pipe.lossPa)}` : ''}.`);
  }
  return `${lines.join('\n')}\n\n_How:_ ${HOW_PIPE} ${HOW_VELOCITY}`;
}

function producerHover(p: ProducerPoint, text: Display): string {
  const lines = [`**Computed for producer \`${p.name}\`** in the design case: ${text.flow(p.flowStdM3PerS)} (${text.flow(p.inletFlowM3PerS, 'actual')} at its inlet) at ${text.pressure(p.vacuumPa)}.`];
  if (p.demand && p.marginFraction !== null) {
    lines.push(`- Demand ${text.flow(p.demand.flowStdM3PerS)} at ${text.pressure(p.demand.vacuumPa)}; margin ${text.percent(p.marginFraction)}.`);
  }
  lines.push(`- Air power ${text.power(p.airPowerW)} (isothermal)${p.shaftPowerW !== null ? `; shaft power ${text.power(p.shaftPowerW)}` : ''}.`);
  if (p.limited) lines.push(p.limited === 'relief' ? '- Held on its vacuum relief.' : '- Runs beyond the end of its curve.');
  return `${lines.join('\n')}\n\n_How:_ ${HOW_PRODUCER}`;
}

function scenarioHover(s: ScenarioAnalysis, text: Display): string {
  if (!s.ok) return `**Scenario \`${s.name}\`**: no flow solution (see the findings).`;
  const lines = [`**Computed for scenario \`${s.name}\`**${s.producer ? `: producer at ${text.flow(s.producer.flowStdM3PerS)}, ${text.pressure(s.producer.vacuumPa)}` : ''}.`];
  for (const i of s.inlets) lines.push(`- \`${i.name}\` (${i.toolState}): ${text.pressure(i.toolVacuumPa)} at the tool, ${text.flow(i.flowStdM3PerS)}.`);
  return `${lines.join('\n')}\n\n_How:_ ${HOW_NETWORK}`;
}

function kindHover(type: 'HoseKind' | 'ToolKind', name: string, model: SystemModel, analysis: SystemAnalysis, text: Display): string | undefined {
  const users = model.inlets.filter((i) => (type === 'HoseKind' ? i.hose.name : i.tool.name) === name);
  if (users.length === 0) return undefined;
  const vacua = users
    .map((u) => analysis.inlets.find((i) => i.name === u.name)?.worstCase?.toolVacuumPa)
    .filter((v): v is number => v !== undefined && Number.isFinite(v));
  const range = vacua.length > 0 ? `; tool vacuum in their worst cases ${text.pressure(Math.min(...vacua))} to ${text.pressure(Math.max(...vacua))}` : '';
  const law = type === 'HoseKind' ? hoseLaw(users[0]!.hose) : toolLaw(users[0]!.tool.working);
  return `**In this system**: used at ${users.length} inlet${users.length === 1 ? '' : 's'}${range}.\n\n_How:_ ${law}`;
}

function hoseLaw(hose: HoseKind): string {
  return hose.measuredLoss
    ? 'the pipe law with a friction multiplier calibrated so the hose loses its measured loss at its measured flow.'
    : `the pipe law with the hose's roughness (${hose.roughnessM !== undefined ? 'as stated' : '0.3 mm by default, inside the ASHRAE range for flexible duct'}).`;
}

function toolLaw(law: ToolLaw): string {
  return law.kind === 'orifice'
    ? `an equivalent sharp-edged orifice (Cd ${law.dischargeCoefficient}), isentropic nozzle flow from room air, choked below a pressure ratio of 0.528 (Shapiro 1953, ch. 4).`
    : 'its measured flow against vacuum, interpolated between the points.';
}

function usesModel(model: SystemModel, producerName: string, modelName: string): boolean {
  return model.producers.some((p) => p.name === producerName && p.model.name === modelName);
}
