import { z } from "zod";
import { InputError } from "@/lib/errors";
import { assertAcyclic } from "./cycles";
import { buildGraph, nodeOf, refOf, type GraphNode, type LineGraph } from "./graph";
import { sequenceLinesSchema, type LineRef, type SequenceLine } from "./types";

export type MissingReason =
  /** Not met, and not part of the same award. */
  | "not-included"
  /** An engineering line not yet signed off: being in the same award is not enough. */
  | "awaiting-sign-off";

export interface MissingPrerequisite extends LineRef {
  reason: MissingReason;
}

export interface RefusedLine {
  id: string;
  label: string;
  /** What must be met (or, for non-engineering lines, added to the award) first. */
  missing: MissingPrerequisite[];
}

export interface AwardCheck {
  /** True when every line asked for can be awarded together. */
  ok: boolean;
  refused: RefusedLine[];
  /** Lines asked for that are already met (nothing to award, reported for the record). */
  alreadyMet: LineRef[];
}

export const awardCheckInputSchema = z.object({
  lineIds: z.array(z.string({ error: "each entry is a line id" })).min(1, { error: "choose at least one line" }),
  lines: sequenceLinesSchema,
});

/**
 * What stands between `node` and being awarded with `included`: walking back through its
 * prerequisites, a met one is fine; a non-engineering one in the same award is fine if what it
 * needs is fine too; anything else is missing. Engineering advice comes before any spanner is
 * turned, so an engineering line gates its dependents until it is met.
 */
function missingFor(graph: LineGraph, node: GraphNode, included: Set<string>): MissingPrerequisite[] {
  const seen = new Set<string>([node.line.id]);
  const missing = new Map<string, MissingPrerequisite>();
  const pending = [...node.dependsOn];
  while (pending.length > 0) {
    const id = pending.pop()!;
    if (seen.has(id)) continue;
    seen.add(id);
    const prerequisite = nodeOf(graph, id);
    if (prerequisite.line.met) continue;
    if (prerequisite.kind === "engineering") {
      missing.set(id, { ...refOf(prerequisite), reason: "awaiting-sign-off" });
    } else if (included.has(id)) {
      pending.push(...prerequisite.dependsOn);
    } else {
      missing.set(id, { ...refOf(prerequisite), reason: "not-included" });
    }
  }
  return [...missing.values()].sort((a, b) => nodeOf(graph, a.id).index - nodeOf(graph, b.id).index);
}

/** Which of `lineIds` cannot be awarded together, and what each still waits on. */
export function canAward(lineIds: readonly string[], lines: readonly SequenceLine[]): AwardCheck {
  const graph = buildGraph(lines);
  assertAcyclic(graph);
  if (!Array.isArray(lineIds as unknown)) throw new InputError("lineIds", "lineIds must be a list of line ids");
  lineIds.forEach((id, position) => {
    if (typeof id !== "string" || !graph.byId.has(id)) {
      throw new InputError(`lineIds.${position}`, `unknown line "${String(id)}"`);
    }
  });
  const included = new Set(lineIds);
  const asked = graph.nodes.filter((node) => included.has(node.line.id));

  const refused: RefusedLine[] = [];
  const alreadyMet: LineRef[] = [];
  for (const node of asked) {
    if (node.line.met) {
      alreadyMet.push(refOf(node));
      continue;
    }
    const missing = missingFor(graph, node, included);
    if (missing.length > 0) refused.push({ id: node.line.id, label: node.line.label, missing });
  }
  return { ok: refused.length === 0, refused, alreadyMet };
}
