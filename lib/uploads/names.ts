/**
 * A file name as the uploader gave it, kept for display and download only: path parts, control
 * characters and anything that could address another place are dropped. Storage never uses it.
 */
export function displayFileName(raw: string | null | undefined, fallback = "upload"): string {
  const lastPart = String(raw ?? "").split(/[\\/]/).pop() ?? "";
  const cleaned = lastPart
    .replace(/[\u0000-\u001f\u007f]/g, "")
    .replace(/["<>|:*?]/g, "_")
    .replace(/^\.+/, "")
    .trim()
    .slice(0, 120);
  return cleaned.length > 0 ? cleaned : fallback;
}

/** The storage key of a piece of evidence: made only of ids we generated, never of user input. */
export function evidenceStorageKey(orgId: string, evidenceId: string, extension: string): string {
  for (const [field, value] of [["orgId", orgId], ["evidenceId", evidenceId], ["extension", extension]] as const) {
    if (!/^[A-Za-z0-9-]{1,64}$/.test(value)) throw new RangeError(`${field} must be a generated id`);
  }
  return `evidence/${orgId}/${evidenceId}.${extension}`;
}

/** A name for downloading: the display name with the extension of the stored content. */
export function downloadName(displayName: string, extension: string): string {
  const base = displayFileName(displayName).replace(/\.[A-Za-z0-9]{1,5}$/, "");
  return `${base}.${extension}`;
}
