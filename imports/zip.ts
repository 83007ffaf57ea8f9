import { inflateRawSync } from "node:zlib";
import { ImportFileError } from "./errors";

/**
 * A small reader for the ZIP central directory (the layout is the PKWARE application note's).
 * XLSX files are ZIP archives; we look at what the directory promises before any library
 * inflates a byte, so a ZIP bomb is refused for the cost of reading a few kilobytes.
 */

export interface ZipEntry {
  name: string;
  /** 0 = stored, 8 = deflate; anything else is refused. */
  method: number;
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
  encrypted: boolean;
}

export interface ZipLimits {
  /** Refuse when the entries together would inflate to more than this. */
  maxUncompressedBytes: number;
  /** Refuse when an entry, or the whole archive, inflates more than this many times over. */
  maxRatio: number;
  /** Below this many inflated bytes the ratio is not checked: small files compress wildly and are harmless. */
  ratioFloorBytes: number;
  maxEntries: number;
}

export const DEFAULT_ZIP_LIMITS: Readonly<ZipLimits> = {
  maxUncompressedBytes: 100 * 1024 * 1024,
  maxRatio: 200,
  ratioFloorBytes: 1024 * 1024,
  maxEntries: 2000,
};

const LOCAL_HEADER_SIG = 0x04034b50;
const CENTRAL_HEADER_SIG = 0x02014b50;
const END_OF_DIRECTORY_SIG = 0x06054b50;
const ZIP64_LOCATOR_SIG = 0x07064b50;
const ZIP64_END_SIG = 0x06064b50;
const END_OF_DIRECTORY_SIZE = 22;
const MAX_COMMENT = 0xffff;

export function looksLikeZip(buffer: Buffer): boolean {
  return buffer.length >= 4 && buffer.readUInt32LE(0) === LOCAL_HEADER_SIG;
}

function corrupt(detail: string): ImportFileError {
  return new ImportFileError("corrupt", `The workbook is damaged (${detail}). Save it again from your spreadsheet program and retry.`);
}

/** Reads a little-endian unsigned 64-bit value as a Number (exact up to 2^53, plenty for a size test). */
function readUInt64(buffer: Buffer, offset: number): number {
  const low = buffer.readUInt32LE(offset);
  const high = buffer.readUInt32LE(offset + 4);
  return high * 0x1_0000_0000 + low;
}

function findEndOfDirectory(buffer: Buffer): number {
  const lowest = Math.max(0, buffer.length - END_OF_DIRECTORY_SIZE - MAX_COMMENT);
  for (let at = buffer.length - END_OF_DIRECTORY_SIZE; at >= lowest; at--) {
    if (buffer.readUInt32LE(at) === END_OF_DIRECTORY_SIG) return at;
  }
  return -1;
}

interface Directory {
  entryCount: number;
  offset: number;
  size: number;
}

function readDirectoryLocation(buffer: Buffer, eocd: number): Directory {
  let entryCount = buffer.readUInt16LE(eocd + 10);
  let size = buffer.readUInt32LE(eocd + 12);
  let offset = buffer.readUInt32LE(eocd + 16);
  const usesZip64 = entryCount === 0xffff || size === 0xffffffff || offset === 0xffffffff;
  const locator = eocd - 20;
  if (usesZip64 || (locator >= 0 && buffer.readUInt32LE(locator) === ZIP64_LOCATOR_SIG)) {
    if (locator < 0 || buffer.readUInt32LE(locator) !== ZIP64_LOCATOR_SIG) throw corrupt("ZIP64 locator missing");
    const end64 = readUInt64(buffer, locator + 8);
    if (end64 + 56 > buffer.length || buffer.readUInt32LE(end64) !== ZIP64_END_SIG) throw corrupt("ZIP64 directory missing");
    entryCount = readUInt64(buffer, end64 + 32);
    size = readUInt64(buffer, end64 + 40);
    offset = readUInt64(buffer, end64 + 48);
  }
  if (offset + size > buffer.length) throw corrupt("the file is cut short");
  return { entryCount, offset, size };
}

/** Sizes of 0xFFFFFFFF mean "see the ZIP64 extra field"; read them from there. */
function applyZip64Extra(buffer: Buffer, start: number, length: number, entry: ZipEntry): void {
  const needUncompressed = entry.uncompressedSize === 0xffffffff;
  const needCompressed = entry.compressedSize === 0xffffffff;
  const needOffset = entry.localHeaderOffset === 0xffffffff;
  if (!needUncompressed && !needCompressed && !needOffset) return;
  let at = start;
  const end = start + length;
  while (at + 4 <= end) {
    const id = buffer.readUInt16LE(at);
    const size = buffer.readUInt16LE(at + 2);
    if (id === 0x0001) {
      let field = at + 4;
      const fieldEnd = field + size;
      if (needUncompressed && field + 8 <= fieldEnd) {
        entry.uncompressedSize = readUInt64(buffer, field);
        field += 8;
      }
      if (needCompressed && field + 8 <= fieldEnd) {
        entry.compressedSize = readUInt64(buffer, field);
        field += 8;
      }
      if (needOffset && field + 8 <= fieldEnd) entry.localHeaderOffset = readUInt64(buffer, field);
      return;
    }
    at += 4 + size;
  }
  throw corrupt("ZIP64 sizes missing");
}

/** Lists the archive's entries from its central directory, never inflating anything. */
export function readZipDirectory(buffer: Buffer, maxEntries = DEFAULT_ZIP_LIMITS.maxEntries): ZipEntry[] {
  if (buffer.length < END_OF_DIRECTORY_SIZE) throw corrupt("the file is cut short");
  const eocd = findEndOfDirectory(buffer);
  if (eocd < 0) throw corrupt("the file is cut short or is not a complete ZIP archive");
  const directory = readDirectoryLocation(buffer, eocd);
  if (directory.entryCount > maxEntries) {
    throw new ImportFileError("too_expanded", `The workbook holds ${directory.entryCount} parts; a spreadsheet needs far fewer. It was not opened.`);
  }
  const entries: ZipEntry[] = [];
  let at = directory.offset;
  const end = directory.offset + directory.size;
  for (let i = 0; i < directory.entryCount; i++) {
    if (at + 46 > end || buffer.readUInt32LE(at) !== CENTRAL_HEADER_SIG) throw corrupt("its table of contents is broken");
    const flags = buffer.readUInt16LE(at + 8);
    const nameLength = buffer.readUInt16LE(at + 28);
    const extraLength = buffer.readUInt16LE(at + 30);
    const commentLength = buffer.readUInt16LE(at + 32);
    const nameStart = at + 46;
    if (nameStart + nameLength + extraLength + commentLength > end) throw corrupt("its table of contents is broken");
    const entry: ZipEntry = {
      name: buffer.toString("utf8", nameStart, nameStart + nameLength),
      method: buffer.readUInt16LE(at + 10),
      compressedSize: buffer.readUInt32LE(at + 20),
      uncompressedSize: buffer.readUInt32LE(at + 24),
      localHeaderOffset: buffer.readUInt32LE(at + 42),
      encrypted: (flags & 0x1) !== 0,
    };
    applyZip64Extra(buffer, nameStart + nameLength, extraLength, entry);
    entries.push(entry);
    at = nameStart + nameLength + extraLength + commentLength;
  }
  return entries;
}

function formatMegabytes(bytes: number): string {
  return `${Math.round(bytes / (1024 * 1024)).toLocaleString("en-AU")} MB`;
}

/**
 * Refuses an archive whose directory promises too much: too many bytes once inflated, or a
 * compression ratio no real spreadsheet reaches. Returns the entries when it is acceptable.
 */
export function checkZipExpansion(buffer: Buffer, limits: ZipLimits = DEFAULT_ZIP_LIMITS): ZipEntry[] {
  const entries = readZipDirectory(buffer, limits.maxEntries);
  let totalUncompressed = 0;
  let totalCompressed = 0;
  for (const entry of entries) {
    if (entry.encrypted) throw corrupt("part of it is encrypted");
    if (entry.method !== 0 && entry.method !== 8) throw corrupt(`it uses a compression method (${entry.method}) spreadsheets do not use`);
    if (entry.localHeaderOffset + 30 > buffer.length || entry.localHeaderOffset + entry.compressedSize > buffer.length) {
      throw corrupt("the file is cut short");
    }
    totalUncompressed += entry.uncompressedSize;
    totalCompressed += entry.compressedSize;
  }
  // Size first: it is the plainer reason.
  if (totalUncompressed > limits.maxUncompressedBytes) {
    throw tooExpanded(`it would unpack to ${formatMegabytes(totalUncompressed)}; the limit is ${formatMegabytes(limits.maxUncompressedBytes)}`);
  }
  const ratio = (inflated: number, deflated: number) => inflated / Math.max(1, deflated);
  for (const entry of entries) {
    if (entry.uncompressedSize >= limits.ratioFloorBytes && ratio(entry.uncompressedSize, entry.compressedSize) > limits.maxRatio) {
      throw tooExpanded(`one part would grow ${Math.round(ratio(entry.uncompressedSize, entry.compressedSize))} times when opened`);
    }
  }
  if (totalUncompressed >= limits.ratioFloorBytes && ratio(totalUncompressed, totalCompressed) > limits.maxRatio) {
    throw tooExpanded(`it would grow ${Math.round(ratio(totalUncompressed, totalCompressed))} times when opened`);
  }
  return entries;
}

function tooExpanded(detail: string): ImportFileError {
  return new ImportFileError("too_expanded", `The workbook was not opened: ${detail}. No real vehicle register is that large.`);
}

/**
 * The directory could lie (claim small sizes for data that inflates to gigabytes). After the
 * directory passed, inflate each entry with a hard cap of its own claimed size, so no entry can
 * produce more than the directory promised, and the total stays within the checked limit.
 */
export function verifyZipEntrySizes(buffer: Buffer, entries: readonly ZipEntry[]): void {
  for (const entry of entries) {
    const local = entry.localHeaderOffset;
    if (buffer.readUInt32LE(local) !== LOCAL_HEADER_SIG) throw corrupt("a part is missing");
    const dataStart = local + 30 + buffer.readUInt16LE(local + 26) + buffer.readUInt16LE(local + 28);
    const dataEnd = dataStart + entry.compressedSize;
    if (dataEnd > buffer.length) throw corrupt("the file is cut short");
    if (entry.method === 0) {
      if (entry.compressedSize !== entry.uncompressedSize) throw corrupt("a stored part has the wrong size");
      continue;
    }
    let inflated: Buffer;
    try {
      // One byte of headroom: output longer than claimed hits the cap and throws.
      inflated = inflateRawSync(buffer.subarray(dataStart, dataEnd), { maxOutputLength: entry.uncompressedSize + 1 });
    } catch (error) {
      if (error instanceof RangeError || (error as { code?: string }).code === "ERR_BUFFER_TOO_LARGE") {
        throw tooExpanded(`a part unpacks to more than its declared ${entry.uncompressedSize.toLocaleString("en-AU")} bytes`);
      }
      throw corrupt("a part cannot be unpacked");
    }
    if (inflated.length > entry.uncompressedSize) {
      throw tooExpanded(`a part unpacks to more than its declared ${entry.uncompressedSize.toLocaleString("en-AU")} bytes`);
    }
  }
}
