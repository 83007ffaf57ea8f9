import { InputError } from "@/lib/errors";
import type { EditionLine } from "@/lib/variance";
import { indexEdition } from "./lines";

/**
 * Copies an edition's lines for a new draft: every line gets a fresh id from `newId`, keeps its
 * key (so the editions can be compared and fitments carried over), and its dependsOn is remapped
 * to the new ids. Nothing is shared with the source, so editing the draft never touches the
 * published edition.
 */
export function copyEditionLines(lines: readonly EditionLine[], newId: () => string): EditionLine[] {
  if (typeof newId !== "function") throw new InputError("newId", "newId must be an id generator");
  const source = indexEdition("lines", lines, { resolveDependencies: true });
  const idFor = new Map<string, string>();
  const taken = new Set<string>();
  lines.forEach((line, i) => {
    const id = newId();
    if (typeof id !== "string" || id.trim() === "") {
      throw new InputError(`lines.${i}.id`, "the id generator gave an empty id");
    }
    if (taken.has(id) || source.byId.has(id)) {
      throw new InputError(`lines.${i}.id`, `the id generator gave ${id} twice`);
    }
    taken.add(id);
    idFor.set(line.id, id);
  });
  return lines.map((line) => ({
    ...line,
    id: idFor.get(line.id) as string,
    criteria: line.criteria.map((c) => ({ ...c, value: Array.isArray(c.value) ? [...c.value] : c.value })),
    evidenceNeeded: [...line.evidenceNeeded],
    dependsOn: line.dependsOn.map((dep) => idFor.get(dep) as string),
  }));
}
