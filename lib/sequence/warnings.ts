import { assertAcyclic } from "./cycles";
import { buildGraph, nodeOf, refOf, type GraphNode, type LineGraph } from "./graph";
import type { LineRef, SequenceLine } from "./types";

export type SequenceWarningCode =
  /** Suspension or steering work with no wheel alignment line after it. */
  | "alignment-missing"
  /** An engineering line that no other line depends on, so it gates nothing. */
  | "engineering-gates-nothing";

export interface SequenceWarning {
  code: SequenceWarningCode;
  line: LineRef;
  message: string;
}

/** Categories whose work changes wheel geometry (common practice: an alignment follows). */
function changesGeometry(node: GraphNode): boolean {
  const category = node.line.category.toLowerCase();
  return node.kind !== "alignment" && (category.includes("suspension") || category.includes("steering"));
}

/** True when some alignment line depends on `node`, directly or through other lines. */
function followedByAlignment(graph: LineGraph, node: GraphNode): boolean {
  const seen = new Set<string>();
  const pending = [...(graph.dependents.get(node.line.id) ?? [])];
  while (pending.length > 0) {
    const id = pending.pop()!;
    if (seen.has(id)) continue;
    seen.add(id);
    if (nodeOf(graph, id).kind === "alignment") return true;
    pending.push(...(graph.dependents.get(id) ?? []));
  }
  return false;
}

/**
 * Steps of the trade an edition should not forget (common practice): a wheel alignment follows
 * any suspension or steering change, and engineering advice comes before the work it concerns,
 * so an engineering line should have lines depending on it.
 */
export function sequenceWarnings(lines: readonly SequenceLine[]): SequenceWarning[] {
  const graph = buildGraph(lines);
  assertAcyclic(graph);
  const warnings: SequenceWarning[] = [];
  for (const node of graph.nodes) {
    if (changesGeometry(node) && !followedByAlignment(graph, node)) {
      warnings.push({
        code: "alignment-missing",
        line: refOf(node),
        message: `No wheel alignment line depends on "${node.line.label}"; add one after the suspension or steering work.`,
      });
    }
    if (node.kind === "engineering" && (graph.dependents.get(node.line.id) ?? []).length === 0) {
      warnings.push({
        code: "engineering-gates-nothing",
        line: refOf(node),
        message: `No line depends on the engineering step "${node.line.label}"; make the work it covers depend on it.`,
      });
    }
  }
  return warnings;
}
