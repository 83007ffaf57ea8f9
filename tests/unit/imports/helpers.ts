import { readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { crc32, deflateRawSync } from "node:zlib";
import ExcelJS from "exceljs";

/** Test helpers: fixture files, hand-built ZIP archives, and workbooks written with exceljs. */

export const FIXTURES = fileURLToPath(new URL("./fixtures/", import.meta.url));
export const SAMPLES = fileURLToPath(new URL("../../../imports/samples/", import.meta.url));

export function fixture(name: string): Buffer {
  return readFileSync(join(FIXTURES, name));
}

export function sample(name: string): Buffer {
  return readFileSync(join(SAMPLES, name));
}

export interface ZipPart {
  name: string;
  data: Buffer;
  /** Sizes written into the central directory instead of the true ones (to craft lies). */
  claimUncompressed?: number;
  claimCompressed?: number;
  store?: boolean;
}

/**
 * A minimal ZIP writer (local headers, deflated data, central directory, end record) following
 * the PKWARE application note's layout, so tests can craft archives no library would write.
 */
export function makeZip(parts: readonly ZipPart[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const part of parts) {
    const name = Buffer.from(part.name, "utf8");
    const body = part.store ? part.data : deflateRawSync(part.data);
    const method = part.store ? 0 : 8;
    const crc = crc32(part.data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0, 6);
    local.writeUInt16LE(method, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(part.claimCompressed ?? body.length, 18);
    local.writeUInt32LE(part.claimUncompressed ?? part.data.length, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(0, 28);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0, 8);
    central.writeUInt16LE(method, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(part.claimCompressed ?? body.length, 20);
    central.writeUInt32LE(part.claimUncompressed ?? part.data.length, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, body);
    centrals.push(central, name);
    offset += local.length + name.length + body.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(parts.length, 8);
  end.writeUInt16LE(parts.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

/** The parts every workbook needs, enough for the directory check to call it an XLSX. */
export const WORKBOOK_SKELETON: readonly ZipPart[] = [
  { name: "[Content_Types].xml", data: Buffer.from('<?xml version="1.0"?><Types/>') },
  { name: "xl/workbook.xml", data: Buffer.from('<?xml version="1.0"?><workbook/>') },
];

/** Writes a one-sheet workbook whose rows are given as arrays (null leaves a cell empty). */
export async function workbookOf(
  rows: readonly (readonly ExcelJS.CellValue[])[],
  setup?: (workbook: ExcelJS.Workbook, sheet: ExcelJS.Worksheet) => void,
): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet("Sheet1");
  rows.forEach((values, index) => {
    const row = sheet.getRow(index + 1);
    values.forEach((value, column) => {
      if (value !== null && value !== undefined) row.getCell(column + 1).value = value;
    });
  });
  setup?.(workbook, sheet);
  const written = await workbook.xlsx.writeBuffer();
  return Buffer.from(written as unknown as Uint8Array);
}

export function csv(text: string): Buffer {
  return Buffer.from(text, "utf8");
}
