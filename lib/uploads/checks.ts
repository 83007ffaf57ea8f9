/**
 * Checks on an uploaded file before anything is stored: its size against the limit, and its
 * type read from its first bytes (magic numbers), never from its name or the browser's word.
 */
export const EVIDENCE_MAX_BYTES = 10 * 1024 * 1024;

export const IMAGE_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export const DOCUMENT_TYPES = ["application/pdf"] as const;
export type AcceptedType = (typeof IMAGE_TYPES)[number] | (typeof DOCUMENT_TYPES)[number];

export type EvidenceUploadKind = "photo" | "certificate" | "weighbridge_ticket" | "engineering_signoff";

/** Photos must be images; certificates, sign-offs and weighbridge tickets may be a PDF or a photo of the paper. */
export const ACCEPTED_TYPES: Readonly<Record<EvidenceUploadKind, readonly AcceptedType[]>> = {
  photo: IMAGE_TYPES,
  certificate: [...DOCUMENT_TYPES, ...IMAGE_TYPES],
  weighbridge_ticket: [...DOCUMENT_TYPES, ...IMAGE_TYPES],
  engineering_signoff: [...DOCUMENT_TYPES, ...IMAGE_TYPES],
};

export const TYPE_WORDS: Readonly<Record<AcceptedType, string>> = {
  "image/jpeg": "JPEG photo",
  "image/png": "PNG image",
  "image/webp": "WebP image",
  "application/pdf": "PDF",
};

export const EXTENSIONS: Readonly<Record<AcceptedType, string>> = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
  "application/pdf": "pdf",
};

export type UploadRefusal = { ok: false; status: 413 | 415 | 422; code: "too_large" | "unsupported_type" | "empty"; message: string };
export type UploadAccepted = { ok: true; type: AcceptedType; isImage: boolean };

export function isImageType(type: string): type is (typeof IMAGE_TYPES)[number] {
  return (IMAGE_TYPES as readonly string[]).includes(type);
}

/** Size before type: an oversized file is refused without reading it further. */
export function checkUploadSize(sizeBytes: number, maxBytes = EVIDENCE_MAX_BYTES): UploadRefusal | null {
  if (!Number.isFinite(sizeBytes) || sizeBytes < 0) throw new RangeError("sizeBytes must be a byte count");
  if (sizeBytes === 0) return { ok: false, status: 422, code: "empty", message: "The file is empty" };
  if (sizeBytes > maxBytes) {
    return {
      ok: false,
      status: 413,
      code: "too_large",
      message: `The file is ${formatBytes(sizeBytes)}; the limit is ${formatBytes(maxBytes)}`,
    };
  }
  return null;
}

/** Whether the type found in the file's bytes (undefined: not recognised) is accepted for this kind. */
export function checkUploadType(detectedType: string | undefined, kind: EvidenceUploadKind): UploadAccepted | UploadRefusal {
  const accepted = ACCEPTED_TYPES[kind];
  const words = acceptedTypesInWords(kind);
  if (!detectedType || !(accepted as readonly string[]).includes(detectedType)) {
    return {
      ok: false,
      status: 415,
      code: "unsupported_type",
      message: detectedType
        ? `This file's content is ${detectedType}, which is not accepted here; send ${words}`
        : `This file's content is not ${words}, whatever its name says`,
    };
  }
  return { ok: true, type: detectedType as AcceptedType, isImage: isImageType(detectedType) };
}

/** The file input's `accept` list for a kind: its types and their usual file-name endings. */
export function acceptAttribute(kind: EvidenceUploadKind): string {
  const types = ACCEPTED_TYPES[kind];
  const endings = types.flatMap((t) => (t === "image/jpeg" ? [".jpg", ".jpeg"] : [`.${EXTENSIONS[t]}`]));
  return [...types, ...endings].join(",");
}

/** The accepted types of a kind in words: "a PDF, JPEG photo, PNG image or WebP image". */
export function acceptedTypesInWords(kind: EvidenceUploadKind): string {
  const words = ACCEPTED_TYPES[kind].map((t) => TYPE_WORDS[t]);
  return words.length === 1 ? `a ${words[0]}` : `a ${words.slice(0, -1).join(", ")} or ${words[words.length - 1]}`;
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MiB`;
}
