import { ImportFileError } from "./errors";
import { looksLikeZip } from "./zip";

/**
 * Tells a spreadsheet from anything else by its bytes, never by its name: a renamed photo is
 * still a photo.
 */

export type SpreadsheetFormat = "csv" | "xlsx";

/** Signatures of files people upload by mistake, named so the refusal can say what we saw. */
const KNOWN_BINARIES: readonly { name: string; bytes: readonly number[] }[] = [
  { name: "a PNG image", bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] },
  { name: "a JPEG image", bytes: [0xff, 0xd8, 0xff] },
  { name: "a GIF image", bytes: [0x47, 0x49, 0x46, 0x38] },
  { name: "a PDF document", bytes: [0x25, 0x50, 0x44, 0x46, 0x2d] },
  { name: "a gzip archive", bytes: [0x1f, 0x8b] },
  { name: "a 7-Zip archive", bytes: [0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c] },
  { name: "a RAR archive", bytes: [0x52, 0x61, 0x72, 0x21, 0x1a, 0x07] },
  // Compound File Binary: the pre-2007 .xls workbook (and old .doc).
  { name: "an old-style .xls workbook", bytes: [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1] },
];

const ASK_FOR_SPREADSHEET = "Upload the vehicle register as a CSV file or an Excel workbook (.xlsx).";

function startsWith(buffer: Buffer, bytes: readonly number[]): boolean {
  return buffer.length >= bytes.length && bytes.every((byte, i) => buffer[i] === byte);
}

function unsupported(what: string): ImportFileError {
  return new ImportFileError("unsupported_type", `This file is ${what}, not a spreadsheet. ${ASK_FOR_SPREADSHEET}`);
}

const UTF16LE_BOM = [0xff, 0xfe];
const UTF16BE_BOM = [0xfe, 0xff];

/**
 * "csv" for delimited text, "xlsx" for a ZIP archive; anything else throws `unsupported_type`.
 * Whether a ZIP really is a workbook is decided later, from its directory.
 */
export function detectFormat(buffer: Buffer): SpreadsheetFormat {
  if (looksLikeZip(buffer)) return "xlsx";
  for (const known of KNOWN_BINARIES) {
    if (startsWith(buffer, known.bytes)) {
      if (known.name.includes(".xls")) {
        throw new ImportFileError(
          "unsupported_type",
          "This is an old-style .xls workbook. Open it in your spreadsheet program, save it as .xlsx or CSV, and upload that.",
        );
      }
      throw unsupported(known.name);
    }
  }
  // An empty ZIP archive has only its end record.
  if (startsWith(buffer, [0x50, 0x4b, 0x05, 0x06])) throw unsupported("an empty ZIP archive");
  if (startsWith(buffer, UTF16LE_BOM) || startsWith(buffer, UTF16BE_BOM)) return "csv";
  if (looksBinary(buffer)) throw unsupported("binary data");
  return "csv";
}

/**
 * Text never holds NUL and rarely other C0 controls apart from tab, line feed, carriage return
 * and form feed; judge from the first 64 KiB.
 */
function looksBinary(buffer: Buffer): boolean {
  const sample = buffer.subarray(0, 64 * 1024);
  let controls = 0;
  for (const byte of sample) {
    if (byte === 0x00) return true;
    if (byte < 0x20 && byte !== 0x09 && byte !== 0x0a && byte !== 0x0d && byte !== 0x0c && byte !== 0x1a) controls++;
  }
  return sample.length > 0 && controls / sample.length > 0.01;
}

/**
 * Decodes delimited text. UTF-8 (with or without a byte order mark) is the norm; UTF-16 with a
 * mark is what spreadsheet programs write as "Unicode text"; a file that is not valid UTF-8 is
 * read as Windows-1252, the usual encoding of a CSV saved by a desktop spreadsheet program.
 */
export function decodeText(buffer: Buffer): string {
  if (startsWith(buffer, UTF16LE_BOM)) return new TextDecoder("utf-16le").decode(buffer.subarray(2));
  if (startsWith(buffer, UTF16BE_BOM)) return new TextDecoder("utf-16be").decode(buffer.subarray(2));
  const body = startsWith(buffer, [0xef, 0xbb, 0xbf]) ? buffer.subarray(3) : buffer;
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true }).decode(body);
  } catch {
    text = new TextDecoder("windows-1252").decode(body);
  }
  // A second mark can survive a re-save; it is never data.
  return text.startsWith("\uFEFF") ? text.slice(1) : text;
}
