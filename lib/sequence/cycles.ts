import { InputError } from "@/lib/errors";
import { buildGraph, nodeOf, type LineGraph } from "./graph";
import type { SequenceLine } from "./types";

/** One cycle, in dependency order: each line depends on the next, the last on the first. */
export interface DependencyCycle {
  ids: string[];
  labels: string[];
}

/** Lines that depend on each other in a circle can never be fitted; the editor must break it. */
export class DependencyCycleError extends InputError {
  readonly cycles: DependencyCycle[];

  constructor(field: string, cycles: DependencyCycle[]) {
    const described = cycles.map((cycle) => [...cycle.labels, cycle.labels[0]].join(" → ")).join("; ");
    super(field, `These lines depend on each other in a circle (each needs the next): ${described}`);
    this.name = "DependencyCycleError";
    this.cycles = cycles;
  }
}

/** Strongly connected components by Tarjan's algorithm, iterative so deep chains cannot overflow. */
function stronglyConnected(graph: LineGraph): string[][] {
  const indexOf = new Map<string, number>();
  const lowOf = new Map<string, number>();
  const onStack = new Set<string>();
  const stack: string[] = [];
  const components: string[][] = [];
  let counter = 0;

  for (const root of graph.nodes) {
    if (indexOf.has(root.line.id)) continue;
    const work: Array<{ id: string; next: number }> = [{ id: root.line.id, next: 0 }];
    indexOf.set(root.line.id, counter);
    lowOf.set(root.line.id, counter);
    counter += 1;
    stack.push(root.line.id);
    onStack.add(root.line.id);

    while (work.length > 0) {
      const frame = work[work.length - 1]!;
      const edges = nodeOf(graph, frame.id).dependsOn;
      if (frame.next < edges.length) {
        const to = edges[frame.next]!;
        frame.next += 1;
        if (!indexOf.has(to)) {
          indexOf.set(to, counter);
          lowOf.set(to, counter);
          counter += 1;
          stack.push(to);
          onStack.add(to);
          work.push({ id: to, next: 0 });
        } else if (onStack.has(to)) {
          lowOf.set(frame.id, Math.min(lowOf.get(frame.id)!, indexOf.get(to)!));
        }
        continue;
      }
      work.pop();
      const parent = work[work.length - 1];
      if (parent !== undefined) lowOf.set(parent.id, Math.min(lowOf.get(parent.id)!, lowOf.get(frame.id)!));
      if (lowOf.get(frame.id) === indexOf.get(frame.id)) {
        const component: string[] = [];
        let member: string | undefined;
        do {
          member = stack.pop()!;
          onStack.delete(member);
          component.push(member);
        } while (member !== frame.id);
        components.push(component);
      }
    }
  }
  return components;
}

/** The shortest way round from `start` back to itself inside one component (breadth first). */
function shortestCycle(graph: LineGraph, start: string, members: Set<string>): string[] {
  const cameFrom = new Map<string, string>();
  const queue: string[] = [start];
  for (let head = 0; head < queue.length; head += 1) {
    const id = queue[head]!;
    for (const to of nodeOf(graph, id).dependsOn) {
      if (!members.has(to)) continue;
      if (to === start) {
        const path = [id];
        for (let at = id; at !== start; ) {
          at = cameFrom.get(at)!;
          path.push(at);
        }
        return path.reverse();
      }
      if (!cameFrom.has(to)) {
        cameFrom.set(to, id);
        queue.push(to);
      }
    }
  }
  return [start];
}

/** One cycle per knot of mutually dependent lines, each starting at its first line in input order. */
export function cyclesOf(graph: LineGraph): DependencyCycle[] {
  const cycles: Array<{ first: number; cycle: DependencyCycle }> = [];
  for (const component of stronglyConnected(graph)) {
    const only = component[0]!;
    const selfLoop = component.length === 1 && nodeOf(graph, only).dependsOn.includes(only);
    if (component.length === 1 && !selfLoop) continue;
    const members = new Set(component);
    const start = component.reduce((a, b) => (nodeOf(graph, a).index <= nodeOf(graph, b).index ? a : b));
    const ids = shortestCycle(graph, start, members);
    cycles.push({
      first: nodeOf(graph, start).index,
      cycle: { ids, labels: ids.map((id) => nodeOf(graph, id).line.label) },
    });
  }
  return cycles.sort((a, b) => a.first - b.first).map((entry) => entry.cycle);
}

/** Throws DependencyCycleError naming every cycle, pointing at the first cycle's first line. */
export function assertAcyclic(graph: LineGraph): void {
  const cycles = cyclesOf(graph);
  const first = cycles[0];
  if (first === undefined) return;
  const index = nodeOf(graph, first.ids[0]!).index;
  throw new DependencyCycleError(`lines.${index}.dependsOn`, cycles);
}

/** The cycles among the lines (empty when there are none), each as its lines by label in order. */
export function detectCycles(lines: readonly SequenceLine[]): DependencyCycle[] {
  return cyclesOf(buildGraph(lines));
}

/** The error to show the editor, or null when the lines have no cycle. */
export function dependencyCycleError(lines: readonly SequenceLine[]): DependencyCycleError | null {
  try {
    assertAcyclic(buildGraph(lines));
    return null;
  } catch (error) {
    if (error instanceof DependencyCycleError) return error;
    throw error;
  }
}
