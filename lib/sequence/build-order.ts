import { assertAcyclic } from "./cycles";
import { buildGraph, nodeOf, refOf, type GraphNode, type LineGraph } from "./graph";
import type { LineKind, LineRef, SequenceLine } from "./types";

export interface PlannedLine {
  id: string;
  label: string;
  category: string;
  kind: LineKind;
  /** 0 for lines that can start now; a line's stage is one more than its latest prerequisite's. */
  stage: number;
  /** True while a prerequisite is not yet met. */
  blocked: boolean;
  /** The prerequisites not yet met (met prerequisites never block). */
  blockedBy: LineRef[];
  /** Engineering lines, not yet signed off, that this line waits on directly or through other open lines. */
  awaitingSignOff: LineRef[];
}

export interface BuildStage {
  index: number;
  /** Lines that can be worked on side by side once the earlier stages are done, in input order. */
  lines: PlannedLine[];
}

/** A line marked met although something it depends on is not: fitted out of order, worth a look. */
export interface OutOfOrderLine {
  id: string;
  label: string;
  unmetPrerequisites: LineRef[];
}

export interface BuildOrder {
  stages: BuildStage[];
  metOutOfOrder: OutOfOrderLine[];
}

function openPrerequisites(graph: LineGraph, node: GraphNode): GraphNode[] {
  return node.dependsOn.map((id) => nodeOf(graph, id)).filter((prerequisite) => !prerequisite.line.met);
}

/** Unmet engineering lines reachable from `node` through unmet prerequisites, in input order. */
function awaitingSignOff(graph: LineGraph, node: GraphNode): LineRef[] {
  const seen = new Set<string>();
  const found: GraphNode[] = [];
  const pending = openPrerequisites(graph, node);
  while (pending.length > 0) {
    const next = pending.pop()!;
    if (seen.has(next.line.id)) continue;
    seen.add(next.line.id);
    if (next.kind === "engineering") found.push(next);
    pending.push(...openPrerequisites(graph, next));
  }
  return found.sort((a, b) => a.index - b.index).map(refOf);
}

/**
 * The order the remaining (not met) lines can be fitted in, as stages of lines that can run in
 * parallel: Kahn's topological sort (Kahn 1962), taken a whole layer at a time so every line sits
 * in the earliest stage its prerequisites allow. Throws DependencyCycleError when lines depend
 * on each other in a circle, and InputError on unknown dependency ids.
 */
export function buildOrder(lines: readonly SequenceLine[]): BuildOrder {
  const graph = buildGraph(lines);
  assertAcyclic(graph);

  const open = graph.nodes.filter((node) => !node.line.met);
  const waitingOn = new Map<string, number>(open.map((node) => [node.line.id, openPrerequisites(graph, node).length]));
  const stageOf = new Map<string, number>();
  let layer = open.filter((node) => waitingOn.get(node.line.id) === 0);
  for (let stage = 0; layer.length > 0; stage += 1) {
    const nextLayer: GraphNode[] = [];
    for (const node of layer) {
      stageOf.set(node.line.id, stage);
      for (const dependentId of graph.dependents.get(node.line.id) ?? []) {
        const left = waitingOn.get(dependentId);
        if (left === undefined) continue; // a met line: not part of the remaining work
        waitingOn.set(dependentId, left - 1);
        if (left - 1 === 0) nextLayer.push(nodeOf(graph, dependentId));
      }
    }
    layer = nextLayer.sort((a, b) => a.index - b.index);
  }

  const stages: BuildStage[] = [];
  for (const node of open) {
    const stage = stageOf.get(node.line.id) ?? 0;
    const blockedBy = openPrerequisites(graph, node).map(refOf);
    const planned: PlannedLine = {
      id: node.line.id,
      label: node.line.label,
      category: node.line.category,
      kind: node.kind,
      stage,
      blocked: blockedBy.length > 0,
      blockedBy,
      awaitingSignOff: awaitingSignOff(graph, node),
    };
    while (stages.length <= stage) stages.push({ index: stages.length, lines: [] });
    stages[stage]!.lines.push(planned);
  }

  const metOutOfOrder = graph.nodes
    .filter((node) => node.line.met)
    .map((node) => ({ node, unmet: openPrerequisites(graph, node) }))
    .filter(({ unmet }) => unmet.length > 0)
    .map(({ node, unmet }) => ({ id: node.line.id, label: node.line.label, unmetPrerequisites: unmet.map(refOf) }));

  return { stages, metOutOfOrder };
}
