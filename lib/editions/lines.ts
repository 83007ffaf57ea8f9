import { InputError } from "@/lib/errors";
import { checkEditionLine, type EditionLine } from "@/lib/variance";

/** A checked edition: its lines by id and by key. */
export type IndexedEdition = {
  byId: Map<string, EditionLine>;
  byKey: Map<string, EditionLine>;
};

/**
 * Checks every line of one edition and indexes it. Ids and keys must be unique within the
 * edition. With `resolveDependencies`, every dependsOn id must be a line of the same edition.
 */
export function indexEdition(
  field: string,
  lines: readonly EditionLine[],
  { resolveDependencies }: { resolveDependencies: boolean },
): IndexedEdition {
  if (!Array.isArray(lines as unknown)) throw new InputError(field, `${field} must be a list of lines`);
  const byId = new Map<string, EditionLine>();
  const byKey = new Map<string, EditionLine>();
  lines.forEach((line, i) => {
    checkEditionLine(`${field}.${i}`, line);
    if (byId.has(line.id)) throw new InputError(`${field}.${i}.id`, `line id ${line.id} appears twice`);
    if (byKey.has(line.key)) {
      throw new InputError(`${field}.${i}.key`, `line key ${line.key} appears twice in one edition`);
    }
    byId.set(line.id, line);
    byKey.set(line.key, line);
  });
  if (resolveDependencies) {
    lines.forEach((line, i) =>
      line.dependsOn.forEach((dep, j) => {
        if (!byId.has(dep)) {
          throw new InputError(
            `${field}.${i}.dependsOn.${j}`,
            `Line ${line.code} "${line.title}" depends on ${dep}, which is not a line of this edition`,
          );
        }
      }),
    );
  }
  return { byId, byKey };
}

/** "FR-01 "Front protection bar"" — how a line is named in a message. */
export function lineLabel(line: Pick<EditionLine, "code" | "title">): string {
  return `${line.code} "${line.title}"`;
}
