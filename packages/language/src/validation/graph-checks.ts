import type { ValidationAcceptor } from 'langium';
import type { Inlet, Pipe, System } from '../generated/ast.js';
import { isCleanout, isInlet, isPipe, isPlant, isProducerUnit } from '../generated/ast.js';
import { StructureCodes } from './codes.js';

/**
 * The shape of the piping, from the names alone: every pipe and inlet must
 * have a path to a producer; a pipe that serves no inlet is a dead leg that
 * fills with debris; loops are legal but worth knowing about.
 */
export function checkSystemGraph(system: System, accept: ValidationAcceptor): void {
  const pipes = system.members.filter(isPipe);
  const inlets = system.members.filter(isInlet);
  const cleanouts = system.members.filter(isCleanout);
  const producerPoints = system.members
    .filter((m) => isPlant(m) && m.equipment.some(isProducerUnit))
    .map((m) => (m as { name: string }).name);

  const farEnd = (pipe: Pipe) => pipe.to?.name ?? pipe.into?.$refText;
  const neighbours = new Map<string, string[]>();
  const link = (a: string, b: string) => {
    if (!neighbours.has(a)) neighbours.set(a, []);
    neighbours.get(a)!.push(b);
  };
  const sets = new DisjointSets();
  for (const pipe of pipes) {
    const from = pipe.from?.$refText;
    const to = farEnd(pipe);
    if (!from || !to || from === to) continue;
    link(from, to);
    link(to, from);
    if (!sets.union(from, to)) {
      accept('info', `Pipe '${pipe.name}' closes a loop: air can reach '${to}' two ways. Loops are solved exactly; check that this is intended.`, {
        node: pipe,
        property: 'name',
        code: StructureCodes.loop,
      });
    }
  }

  const reached = new Set<string>(producerPoints);
  const queue = [...producerPoints];
  while (queue.length > 0) {
    const point = queue.pop()!;
    for (const next of neighbours.get(point) ?? []) {
      if (!reached.has(next)) {
        reached.add(next);
        queue.push(next);
      }
    }
  }
  if (producerPoints.length === 0) return; // reported once as no-producer

  for (const pipe of pipes) {
    const from = pipe.from?.$refText;
    if (from && pipe.from?.ref && !reached.has(from)) {
      accept('error', `Pipe '${pipe.name}' has no path to a producer: nothing connects '${from}' to a plant.`, {
        node: pipe,
        property: 'from',
        code: StructureCodes.noPath,
      });
    }
  }
  for (const inlet of inlets) {
    const point = inletPoint(inlet);
    if (point && !reached.has(point)) {
      accept('error', `Inlet '${inlet.name}' has no path to a producer.`, {
        node: inlet,
        property: 'name',
        code: StructureCodes.noPath,
      });
    }
  }

  // A dead leg: a pipe whose far end leads nowhere and that carries no inlet.
  const pipesWithInlets = new Set(inlets.map((i) => i.pipe?.$refText).filter(Boolean));
  const pointsWithInlets = new Set(inlets.map((i) => i.at?.$refText).filter(Boolean));
  const pointsWithCleanouts = new Set(cleanouts.map((c) => c.at?.$refText).filter(Boolean));
  for (const pipe of pipes) {
    const to = farEnd(pipe);
    if (!to || pipe.into || pipesWithInlets.has(pipe.name)) continue;
    const connections = neighbours.get(to)?.length ?? 0;
    if (connections <= 1 && !pointsWithInlets.has(to)) {
      const capped = pointsWithCleanouts.has(to) ? ' (a cleanout is not an inlet)' : '';
      accept('warning', `Pipe '${pipe.name}' serves no inlet: its end '${to}' leads nowhere${capped}. Remove it or add an inlet.`, {
        node: pipe,
        property: 'name',
        code: StructureCodes.danglingPipe,
      });
    }
  }
}

function inletPoint(inlet: Inlet): string | undefined {
  if (inlet.at) return inlet.at.$refText;
  return inlet.pipe?.ref?.from?.$refText;
}

/** Union-find over point names; union returns false when both were already joined. */
class DisjointSets {
  private readonly parent = new Map<string, string>();

  private find(x: string): string {
    let root = x;
    while (this.parent.has(root) && this.parent.get(root) !== root) root = this.parent.get(root)!;
    let node = x;
    while (node !== root) {
      const next = this.parent.get(node) ?? root;
      this.parent.set(node, root);
      node = next;
    }
    if (!this.parent.has(root)) this.parent.set(root, root);
    return root;
  }

  union(a: string, b: string): boolean {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
}
