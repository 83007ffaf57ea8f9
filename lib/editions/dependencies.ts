import { InputError } from "@/lib/errors";
import { detectCycles } from "@/lib/sequence";
import { checkEditionLine, type EditionLine } from "@/lib/variance";
import { lineLabel } from "./lines";

/**
 * Checks an edition's dependency graph before it is saved or published (Rigline rule: a line may
 * depend only on lines of its own edition, and never, through any chain, on itself).
 */

export type CycleLine = { id: string; code: string; title: string };

/** A circle of dependencies: each line depends on the next, the last on the first. */
export class EditionCycleError extends InputError {
  readonly cycle: CycleLine[];

  constructor(field: string, cycle: CycleLine[]) {
    const first = cycle[0];
    const ring = [...cycle, ...(first ? [first] : [])].map(lineLabel).join(" → ");
    super(
      field,
      `These lines depend on each other in a circle, so none of them can be fitted first: ${ring}. Remove one of these dependencies.`,
    );
    this.name = "EditionCycleError";
    this.cycle = cycle;
  }
}

export type DependencyCheck = {
  /** Line ids in an order that fits every line after the lines it depends on (input order where free). */
  order: string[];
};

export type ValidateDependenciesOptions = {
  /** Lines of other editions, so a dependency on one of them is named as such. */
  otherEditionLines?: readonly Pick<EditionLine, "id" | "code" | "title">[];
};

export function validateDependencies(
  lines: readonly EditionLine[],
  options: ValidateDependenciesOptions = {},
): DependencyCheck {
  if (!Array.isArray(lines as unknown)) throw new InputError("lines", "lines must be a list");
  const indexOf = new Map<string, number>();
  lines.forEach((line, i) => {
    checkEditionLine(`lines.${i}`, line);
    if (indexOf.has(line.id)) throw new InputError(`lines.${i}.id`, `line id ${line.id} appears twice`);
    indexOf.set(line.id, i);
  });
  const elsewhere = new Map((options.otherEditionLines ?? []).map((l) => [l.id, l]));

  // Each line's dependencies as indexes, duplicates dropped.
  const deps: number[][] = lines.map((line, i) => {
    const seen = new Set<number>();
    line.dependsOn.forEach((dep, j) => {
      const at = indexOf.get(dep);
      if (at !== undefined) {
        seen.add(at);
        return;
      }
      const field = `lines.${i}.dependsOn.${j}`;
      const other = elsewhere.get(dep);
      if (other) {
        throw new InputError(
          field,
          `Line ${lineLabel(line)} depends on ${lineLabel(other)}, a line of another edition; a line may depend only on lines of its own edition.`,
        );
      }
      throw new InputError(field, `Line ${lineLabel(line)} depends on an unknown line (${dep}).`);
    });
    return [...seen];
  });

  // Circles are found by the sequence module; this module names their lines by code and title.
  const [cycle] = detectCycles(
    lines.map((line) => ({ id: line.id, label: lineLabel(line), category: line.category, dependsOn: line.dependsOn, met: false })),
  );
  if (cycle) {
    const first = indexOf.get(cycle.ids[0] as string) as number;
    throw new EditionCycleError(
      `lines.${first}.dependsOn`,
      cycle.ids.map((id) => {
        const l = lines[indexOf.get(id) as number] as EditionLine;
        return { id: l.id, code: l.code, title: l.title };
      }),
    );
  }

  // Depth-first search without recursion (long chains must not overflow the stack); the graph
  // has no circle, so every line is finished after the lines it depends on.
  // 0 = not seen, 1 = on the current path, 2 = done.
  const state = new Uint8Array(lines.length);
  const order: string[] = [];
  const path: number[] = [];
  const next: number[] = [];
  for (let root = 0; root < lines.length; root++) {
    if (state[root] !== 0) continue;
    path.push(root);
    next.push(0);
    state[root] = 1;
    while (path.length > 0) {
      const top = path.length - 1;
      const node = path[top] as number;
      const edges = deps[node] as number[];
      const k = next[top] as number;
      if (k < edges.length) {
        next[top] = k + 1;
        const to = edges[k] as number;
        if (state[to] === 0) {
          state[to] = 1;
          path.push(to);
          next.push(0);
        }
        continue;
      }
      state[node] = 2;
      order.push((lines[node] as EditionLine).id);
      path.pop();
      next.pop();
    }
  }
  return { order };
}
