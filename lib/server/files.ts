/**
 * One way to send a file: exports, originals, evidence, photos and statements all answer with
 * the same headers. Files people uploaded are never sniffed by the browser, never cached by a
 * shared cache, and when shown inline they run in a sandbox (no scripts, no requests).
 */

export type FileDownload = {
  body: Uint8Array | Buffer | string;
  contentType: string;
  filename: string;
  /** "inline" shows a photo or PDF in the browser; "attachment" saves it. */
  disposition?: "inline" | "attachment";
  /** Private caching for this long (immutable stored files); otherwise never cached. */
  maxAgeSeconds?: number;
  /** SHA-256 of the bytes, as the entity tag. */
  sha256?: string;
  headers?: Record<string, string>;
};

/** `Content-Disposition` with an ASCII fallback and the exact name (RFC 6266 / RFC 5987). */
export function contentDisposition(disposition: "inline" | "attachment", filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  const exact = encodeURIComponent(filename);
  return exact === ascii ? `${disposition}; filename="${ascii}"` : `${disposition}; filename="${ascii}"; filename*=UTF-8''${exact}`;
}

export function fileResponse(file: FileDownload): Response {
  const body = typeof file.body === "string" ? file.body : new Uint8Array(file.body);
  const disposition = file.disposition ?? "attachment";
  const headers: Record<string, string> = {
    "content-type": file.contentType,
    "content-disposition": contentDisposition(disposition, file.filename),
    "cache-control": file.maxAgeSeconds ? `private, max-age=${file.maxAgeSeconds}` : "private, no-store",
    "x-content-type-options": "nosniff",
    ...(typeof body === "string" ? {} : { "content-length": String(body.byteLength) }),
    ...(disposition === "inline" ? { "content-security-policy": "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox" } : {}),
    ...(file.sha256 ? { etag: `"${file.sha256}"` } : {}),
    ...file.headers,
  };
  return new Response(body, { status: 200, headers });
}
