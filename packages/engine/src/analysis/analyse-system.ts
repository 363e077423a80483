/**
 * The design analysis of one system (ENGINEERING.md, "Design analysis"):
 * every inlet alone, every inlet's worst set of design operators, pipe
 * velocities for the carrying and noise checks, the producer at the design
 * case with its margin, named scenarios, commissioning predictions and the
 * bill of materials. Never throws: what cannot be solved is listed in
 * `failures` with the element at fault.
 */
import { DEFAULT_DISCHARGE_COEFFICIENT } from '../elements/tool-law.js';
import { connectivityFindings } from '../network/connectivity.js';
import { defaultElementLaws } from '../network/default-element-laws.js';
import type { ElementLaws } from '../network/element-laws.js';
import { buildNetworkGraph } from '../network/graph.js';
import type { SystemModel } from '../network/model.js';
import type {
  AnalysisFailure,
  AnalysisOptions,
  InletAnalysis,
  InletPoint,
  ProducerPoint,
  SystemAnalysis,
  WorstCase,
} from './analysis-types.js';
import { billOfMaterials } from './bill-of-materials.js';
import { CaseRunner, type CaseView } from './case-runner.js';
import { commissioningPredictions, DEFAULT_TEST_ORIFICE_M } from './commissioning.js';
import { operatorCount } from './operators.js';
import { buildPathTree } from './path-tree.js';
import { pipeVelocities } from './pipe-velocities.js';
import { demandAndMargin, producerPoints } from './producer-point.js';
import { scenarioResults } from './scenarios.js';
import { SetEvaluator } from './set-evaluator.js';
import { inletBasis, type InletBasis } from './shared-path-estimate.js';
import { DEFAULT_EXACT_SET_LIMIT, DEFAULT_EXACT_TOTAL_LIMIT, DEFAULT_VERIFY_SETS, worstCases } from './worst-case.js';

/** Options beyond the JSON-able ones: the element laws (tests) and search tuning. */
export interface AnalysisInternals {
  laws?: ElementLaws;
  /** Largest C(n, k) solved exhaustively (default 5,000). */
  exactTotalLimit?: number;
  /** Sets per inlet solved exactly in greedy-swap mode (default 2). */
  verifySets?: number;
}

export function analyseSystem(model: SystemModel, options: AnalysisOptions & AnalysisInternals = {}): SystemAnalysis {
  try {
    return analyse(model, options);
  } catch (error) {
    // A defect, not an input problem: still answer in the typed shape.
    return emptyAnalysis(model, options, `the analysis stopped: ${error instanceof Error ? error.message : String(error)}`);
  }
}

function analyse(model: SystemModel, options: AnalysisOptions & AnalysisInternals): SystemAnalysis {
  const laws = options.laws ?? defaultElementLaws;
  const orifice = {
    diameterM: positive(options.testOrificeDiameterM) ?? positive(model.design?.testOrificeDiameterM) ?? DEFAULT_TEST_ORIFICE_M,
    dischargeCoefficient: positive(options.testOrificeDischargeCoefficient) ?? DEFAULT_DISCHARGE_COEFFICIENT,
  };
  const graph = buildNetworkGraph(model, { laws, testOrifice: orifice });
  const topology = connectivityFindings(model, graph.topology);
  const tree = buildPathTree(graph);
  const runner = new CaseRunner(graph, tree);
  const operators = operatorCount(model, options);
  const skip = options.skip ?? {};
  const failures: AnalysisFailure[] = [];
  const ambient = graph.ambientPa;

  const inletByName = new Map((model.inlets ?? []).map((i) => [i.name, i]));
  const need = (inlet: string): number | null => {
    const v = inletByName.get(inlet)?.tool?.requiredVacuumPa ?? model.design?.defaultToolVacuumPa;
    return v !== undefined && Number.isFinite(v) ? v : null;
  };

  // 1. Every inlet alone, tool working: the single-operator case, and the
  //    basis for ranking partners.
  const allNames = (model.inlets ?? []).map((i) => i.name);
  const loneByName = new Map<string, { point: InletPoint; view: CaseView }>();
  for (const name of allNames) {
    const res = runner.solve([{ inlet: name, toolState: 'working' }]);
    const point = res.ok ? runner.inletPoint(res.view, name, 'working') : null;
    if (res.ok && point) {
      loneByName.set(name, { point, view: res.view });
    } else if (!res.ok) {
      failures.push({ stage: 'single-operator', subject: name, openInlets: [name], cause: res.failure.cause, element: res.failure.element, message: res.failure.message });
    }
  }
  // The universe for design sets: inlets that work alone.
  const names = allNames.filter((n) => loneByName.has(n));
  const nodes = names.map((n) => graph.topology.inlets.get(n)!.node);
  const lone = names.map((n) => loneByName.get(n)!.point);
  const loneViews = names.map((n) => loneByName.get(n)!.view);
  const required = names.map(need);

  // 2. Worst set of k per inlet.
  const k = Math.min(operators.count, Math.max(1, names.length));
  const evaluator = new SetEvaluator(runner, names);
  let worst: (WorstCase | null)[] = names.map(() => null);
  if (!skip.worstCase && names.length > 0) {
    const bases: (InletBasis | null)[] = names.map((n, i) => inletBasis(graph, tree, nodes[i]!, runner.pathOf(n), lone[i]!.massFlowKgPerS, loneViews[i]!));
    const out = worstCases({
      evaluator,
      tree,
      nodes,
      lone,
      bases,
      k,
      exactSetLimit: options.exactSetLimit ?? DEFAULT_EXACT_SET_LIMIT,
      exactTotalLimit: options.exactTotalLimit ?? DEFAULT_EXACT_TOTAL_LIMIT,
      verify: options.verifySets ?? DEFAULT_VERIFY_SETS,
      required,
    });
    worst = out.results;
    for (const f of out.failures) {
      failures.push({
        stage: 'worst-case',
        subject: names[f.members[0]!]!,
        openInlets: f.members.map((i) => names[i]!),
        cause: f.failure.cause,
        element: f.failure.element,
        message: f.failure.message,
      });
    }
  }

  // 3. The design case: the worst set of the inlet left with the least margin.
  let critical = -1;
  let criticalMargin = Infinity;
  worst.forEach((wc, i) => {
    if (!wc) return;
    const margin = wc.toolVacuumPa - (required[i] ?? 0);
    if (margin < criticalMargin) {
      criticalMargin = margin;
      critical = i;
    }
  });
  let producers: ProducerPoint[] = [];
  let designCase: SystemAnalysis['designCase'] = null;
  if (critical >= 0) {
    const openings = worst[critical]!.openInlets.map((inlet) => ({ inlet, toolState: 'working' as const }));
    designCase = { criticalInlet: names[critical]!, openInlets: openings.map((o) => o.inlet) };
    const res = runner.solve(openings);
    if (res.ok) {
      producers = producerPoints(runner, res.view);
      if (producers.length === 1) {
        const d = demandAndMargin(runner, openings, need, producers[0]!.name, producers[0]!.inletPressurePa);
        if (d.ok) {
          producers[0]!.marginFraction = d.marginFraction;
          producers[0]!.demand = { flowStdM3PerS: d.flowStdM3PerS, vacuumPa: d.vacuumPa };
        } else if (d.infeasible) {
          // No margin to give: the producer cannot bring the design case's tools to their need.
          failures.push({
            stage: 'demand',
            subject: producers[0]!.name,
            openInlets: designCase.openInlets,
            cause: 'infeasible-demand',
            element: { kind: 'producer', name: producers[0]!.name },
            message: d.reason,
          });
        }
      }
    } else {
      failures.push({ stage: 'design', subject: names[critical]!, openInlets: designCase.openInlets, cause: res.failure.cause, element: res.failure.element, message: res.failure.message });
    }
  }

  // 4. Pipe velocities.
  const velocities = pipeVelocities({ runner, names, lone, loneViews, k, withMax: !skip.velocities });
  failures.push(...velocities.failures);

  // 5. Commissioning predictions.
  let commissioning: SystemAnalysis['commissioning'] = null;
  if (!skip.commissioning && names.length > 0) {
    const orificeEvaluator = new SetEvaluator(runner, names, 'working', 'orifice');
    const c = commissioningPredictions(orificeEvaluator, worst, orifice, options.commissioningAlone === true);
    commissioning = c.commissioning;
    failures.push(...c.failures);
  }

  // 6. Named scenarios.
  const scenarios = skip.scenarios ? { scenarios: [], failures: [] } : scenarioResults(runner, model.scenarios ?? []);
  failures.push(...scenarios.failures);

  const inlets: InletAnalysis[] = allNames.map((name) => {
    const i = names.indexOf(name);
    return { name, worstCase: i >= 0 ? worst[i]! : null, alone: loneByName.get(name)?.point ?? null };
  });

  return {
    // Impossible site air is reported in `failures`; the numbers stay finite.
    ambient: { pressurePa: finiteOr0(ambient), temperatureK: finiteOr0(graph.temperatureK) },
    operators,
    designCase,
    producer: producers[0] ?? null,
    producers,
    inlets,
    pipes: velocities.pipes,
    scenarios: scenarios.scenarios,
    billOfMaterials: billOfMaterials(model, operators.count),
    commissioning,
    failures,
    topology,
    effort: { ...runner.effort },
  };
}

function finiteOr0(x: number | undefined): number {
  return x !== undefined && Number.isFinite(x) ? x : 0;
}

function positive(x: number | undefined): number | undefined {
  return x !== undefined && Number.isFinite(x) && x > 0 ? x : undefined;
}

function emptyAnalysis(model: SystemModel, options: AnalysisOptions, message: string): SystemAnalysis {
  const operators = operatorCount(model, options);
  return {
    ambient: { pressurePa: finiteOr0(model.site?.ambientPressurePa), temperatureK: finiteOr0(model.site?.temperatureK) },
    operators,
    designCase: null,
    producer: null,
    producers: [],
    inlets: (model.inlets ?? []).map((i) => ({ name: i.name, worstCase: null, alone: null })),
    pipes: [],
    scenarios: [],
    billOfMaterials: billOfMaterials(model, operators.count),
    commissioning: null,
    failures: [{ stage: 'analysis', subject: model.name, openInlets: [], cause: 'invalid-element', message }],
    topology: [],
    effort: { solves: 0, newtonIterations: 0, elementEvaluations: 0 },
  };
}
