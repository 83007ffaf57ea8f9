import { InputError } from "@/lib/errors";
import { LINE_KINDS, type LineKind, type LineRef, type SequenceLine } from "./types";

export interface GraphNode {
  index: number;
  line: SequenceLine;
  kind: LineKind;
  /** Prerequisite ids, duplicates removed, in the order first listed. */
  dependsOn: string[];
}

export interface LineGraph {
  nodes: GraphNode[];
  byId: Map<string, GraphNode>;
  /** id → ids of the lines that depend on it. */
  dependents: Map<string, string[]>;
}

export function refOf(node: GraphNode): LineRef {
  return { id: node.line.id, label: node.line.label, kind: node.kind };
}

/** Checks the lines and indexes them; every fault names the line and field at fault. */
export function buildGraph(lines: readonly SequenceLine[]): LineGraph {
  if (!Array.isArray(lines as unknown)) throw new InputError("lines", "lines must be a list");
  const nodes: GraphNode[] = [];
  const byId = new Map<string, GraphNode>();
  lines.forEach((line, index) => {
    const at = `lines.${index}`;
    if (line === null || typeof line !== "object") throw new InputError(at, "each line must be an object");
    if (typeof line.id !== "string" || line.id === "") throw new InputError(`${at}.id`, "id is required");
    if (byId.has(line.id)) throw new InputError(`${at}.id`, `two lines share the id "${line.id}"`);
    if (typeof line.label !== "string" || line.label.trim() === "") {
      throw new InputError(`${at}.label`, "label is required");
    }
    if (typeof line.met !== "boolean") throw new InputError(`${at}.met`, "met must be true or false");
    if (!Array.isArray(line.dependsOn as unknown)) throw new InputError(`${at}.dependsOn`, "dependsOn must be a list of line ids");
    const kind = line.kind ?? "fitting";
    if (!LINE_KINDS.includes(kind)) {
      throw new InputError(`${at}.kind`, `kind must be one of ${LINE_KINDS.join(", ")}`);
    }
    const node: GraphNode = { index, line, kind, dependsOn: [...new Set(line.dependsOn)] };
    nodes.push(node);
    byId.set(line.id, node);
  });

  const dependents = new Map<string, string[]>(nodes.map((node) => [node.line.id, []]));
  for (const node of nodes) {
    node.line.dependsOn.forEach((dependencyId, position) => {
      if (typeof dependencyId !== "string" || !byId.has(dependencyId)) {
        throw new InputError(
          `lines.${node.index}.dependsOn.${position}`,
          `"${node.line.label}" depends on an unknown line "${String(dependencyId)}"`,
        );
      }
    });
    for (const dependencyId of node.dependsOn) dependents.get(dependencyId)?.push(node.line.id);
  }
  return { nodes, byId, dependents };
}

/** The node of a known id (the graph was checked, so a miss is a programming error). */
export function nodeOf(graph: LineGraph, id: string): GraphNode {
  const node = graph.byId.get(id);
  if (node === undefined) throw new InputError("lines", `unknown line "${id}"`);
  return node;
}
