import { formatQuantity, type SuppressedFinding, type SystemAnalysis, type SystemModel } from '@vacnet/engine';

/**
 * A few lines on an analysed system for the text output: design operators,
 * the producer's operating point and margin, the inlet that fares worst,
 * and what the file accepts. Units are the system's display units.
 */
export function describeSystem(path: string, model: SystemModel, analysis: SystemAnalysis, accepted: readonly SuppressedFinding[]): string[] {
  const units = model.displayUnits;
  const vacuum = (pa: number) => formatQuantity(pa, 'pressure', units, 3);
  const flow = (m3s: number) => formatQuantity(m3s, 'flow', units, 3, { flowBasis: 'standard' });
  const power = (w: number) => formatQuantity(w, 'power', units, 3);
  const lines = [`${path}: "${model.name}"`];

  const operators = analysis.operators;
  lines.push(`  design operators: ${operators.count} (${OPERATOR_SOURCE[operators.source]})`);

  const producer = analysis.producer;
  if (producer) {
    const margin = producer.marginFraction === null ? 'margin unknown (no tool states the vacuum it needs)' : `margin ${percent(producer.marginFraction)} on flow`;
    const shaft = producer.shaftPowerW === null ? '' : `, shaft ${power(producer.shaftPowerW)}`;
    lines.push(`  producer ${producer.name}: ${flow(producer.flowStdM3PerS)} at ${vacuum(producer.vacuumPa)}, ${margin}; air power ${power(producer.airPowerW)}${shaft}`);
  } else {
    lines.push('  producer: no operating point (see the findings above)');
  }

  const worst = worstInlet(analysis);
  if (worst?.worstCase) {
    const needs = worst.worstCase.requiredToolVacuumPa;
    const need = needs === null ? '' : ` (needs ${vacuum(needs)})`;
    const partners = worst.worstCase.openInlets.filter((n) => n !== worst.name);
    const others = partners.length > 0 ? ` with ${partners.join(', ')} also open` : ' alone';
    lines.push(`  worst inlet ${worst.name}: ${vacuum(worst.worstCase.toolVacuumPa)} at the tool${need}, ${flow(worst.worstCase.flowStdM3PerS)}${others} (${worst.worstCase.method} search)`);
  }
  lines.push(...describeAccepted(accepted));
  return lines;
}

/**
 * One line per acceptance as written: an element's acceptance names its
 * element; a system-wide one is said once with the number of findings it covers.
 */
function describeAccepted(accepted: readonly SuppressedFinding[]): string[] {
  const lines: string[] = [];
  const systemWide = new Map<string, { reason: string; count: number }>();
  for (const a of accepted) {
    if (a.scope === 'system') {
      const key = `${a.finding.code}\u0000${a.reason}`;
      const entry = systemWide.get(key) ?? { reason: a.reason, count: 0 };
      entry.count++;
      systemWide.set(key, entry);
    } else {
      lines.push(`  accepted ${a.finding.code} on ${a.finding.element.name}: "${a.reason}"`);
    }
  }
  for (const [key, { reason, count }] of systemWide) {
    const code = key.split('\u0000')[0];
    lines.push(`  accepted ${code} throughout (${count} finding${count === 1 ? '' : 's'}): "${reason}"`);
  }
  return lines;
}

const OPERATOR_SOURCE: Record<SystemAnalysis['operators']['source'], string> = {
  options: 'as asked',
  stated: 'as stated',
  areas: 'from the floor areas and cleaning window',
  default: 'none stated; one assumed',
};

/** The design case's critical inlet: the one whose tool is left with the least vacuum over what it needs (the engine's choice). */
function worstInlet(analysis: SystemAnalysis): SystemAnalysis['inlets'][number] | undefined {
  const name = analysis.designCase?.criticalInlet;
  return name === undefined ? undefined : analysis.inlets.find((inlet) => inlet.name === name && inlet.worstCase);
}

function percent(fraction: number): string {
  return `${Math.round(fraction * 100)} %`;
}
