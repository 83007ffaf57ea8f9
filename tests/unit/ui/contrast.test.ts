import { describe, expect, it } from "vitest";
import { readColorTokens, scalePattern } from "./tokens";

// WCAG 2.1 §1.4.3 contrast (minimum), relative luminance formula (P):
// L = 0.2126 R + 0.7152 G + 0.0722 B, each channel c = s/12.92 if s ≤ 0.04045 (WCAG 2.1 prints
// 0.03928; no 8-bit value lies between the two) else ((s + 0.055)/1.055)^2.4;
// contrast ratio = (L1 + 0.05)/(L2 + 0.05) with L1 the lighter.
function channel(byte: number): number {
  const s = byte / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}

function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const [r, g, b] = [m[1], m[2], m[3]].map((h) => channel(parseInt(h ?? "", 16))) as [
    number,
    number,
    number,
  ];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [
    number,
    number,
  ];
  return (hi + 0.05) / (lo + 0.05);
}

const tokens = readColorTokens();
const color = (name: string): string => {
  const v = tokens.get(name);
  if (v === undefined) throw new Error(`--color-${name} missing`);
  return v;
};

describe("WCAG contrast formula", () => {
  it("gives 21:1 for black on white", () => {
    // WCAG 2.1 §1.4.3 contrast (minimum), relative luminance formula (P): (1 + 0.05)/(0 + 0.05) = 21
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 10);
    expect(relativeLuminance("#ffffff")).toBeCloseTo(1, 12);
  });

  it("gives 4.54:1 for #767676 on white", () => {
    // WCAG 2.1 §1.4.3 contrast (minimum), relative luminance formula (P), hand-worked:
    // 0x76/255 = 0.462745 → ((0.462745 + 0.055)/1.055)^2.4 = 0.181164 for each channel, so
    // L = 0.181164; (1.05)/(0.231164) = 4.542. (Often quoted as the lightest grey that passes
    // AA on white — from memory.)
    expect(contrastRatio("#767676", "#ffffff")).toBeCloseTo(4.542, 3);
  });

  it("is symmetric and uses the linear segment for dark channels", () => {
    // WCAG 2.1 §1.4.3 contrast (minimum), relative luminance formula (P): 10/255 = 0.0392 ≤ 0.04045
    // → 0.0392157/12.92 = 0.0030353 per channel.
    expect(relativeLuminance("#0a0a0a")).toBeCloseTo(0.0030353, 6);
    expect(contrastRatio("#5d5140", "#fbf9f4")).toBeCloseTo(
      contrastRatio("#fbf9f4", "#5d5140"),
      12,
    );
  });
});

const surfaces = ["surface", "surface-raised", "surface-sunken"] as const;
const tones = ["ok", "warn", "danger", "info", "neutral", "accent"] as const;

// Body text needs 4.5:1 (WCAG 2.1 §1.4.3 contrast (minimum), P).
const textPairs: [fg: string, bg: string][] = [
  ...surfaces.flatMap((bg) =>
    ["ink", "muted", "accent", "accent-hover", "ok", "warn", "danger", "info", "neutral"].map(
      (fg) => [fg, bg] as [string, string],
    ),
  ),
  ["on-inverse", "surface-inverse"],
  ["muted-inverse", "surface-inverse"],
  ["on-accent", "accent"],
  ["on-accent", "accent-hover"],
  ["on-danger", "danger"],
  ["on-danger", "danger-hover"],
];
// Every tone's ink on its soft background, its solid on soft (pills draw text and shape there),
// and its on-colour on its solid: found by the naming convention in app/globals.css, so a new
// tone is checked without touching this test.
for (const name of tokens.keys()) {
  const soft = /^(.+)-soft$/.exec(name)?.[1];
  if (soft) {
    if (tokens.has(`${soft}-ink`)) textPairs.push([`${soft}-ink`, name]);
    for (const s of surfaces) if (tokens.has(`${soft}-ink`)) textPairs.push([`${soft}-ink`, s]);
  }
  const on = /^on-(.+)$/.exec(name)?.[1];
  if (on && tokens.has(on)) textPairs.push([name, on]);
}

// Control borders, focus rings and status shapes need 3:1 (WCAG 2.1 §1.4.11 non-text contrast, P).
const nonTextPairs: [fg: string, bg: string][] = [
  ...surfaces.map((bg) => ["line-strong", bg] as [string, string]),
  ...surfaces.map((bg) => ["focus", bg] as [string, string]),
  ...tones.filter((t) => tokens.has(`${t}-soft`)).map((t) => [t, `${t}-soft`] as [string, string]),
];

describe("semantic colour pairs", () => {
  it("are all defined from the palette scales", () => {
    const palette = new Set([...tokens].filter(([n]) => scalePattern.test(n)).map(([, v]) => v));
    palette.add("#ffffff");
    const semantic = [...tokens.keys()].filter(
      (n) => !scalePattern.test(n) && n !== "white" && n !== "black",
    );
    expect(semantic.length).toBeGreaterThan(30);
    for (const name of semantic)
      expect(palette.has(color(name)), `--color-${name} = ${color(name)}`).toBe(true);
  });

  it.each(textPairs)("%s on %s reaches 4.5:1", (fg, bg) => {
    // WCAG 2.1 §1.4.3 contrast (minimum), relative luminance formula (P)
    expect(contrastRatio(color(fg), color(bg))).toBeGreaterThanOrEqual(4.5);
  });

  it.each(nonTextPairs)("%s against %s reaches 3:1", (fg, bg) => {
    // WCAG 2.1 §1.4.11 non-text contrast (P), same luminance formula
    expect(contrastRatio(color(fg), color(bg))).toBeGreaterThanOrEqual(3);
  });

  it("keeps body ink far above the minimum for reading in full sun", () => {
    // WCAG 2.1 §1.4.6 contrast (enhanced) asks 7:1 (P): body ink meets it on every surface;
    // muted text (our own floor, 6.5:1) stays close to it.
    for (const bg of surfaces) {
      expect(contrastRatio(color("ink"), color(bg))).toBeGreaterThanOrEqual(7);
      expect(contrastRatio(color("muted"), color(bg))).toBeGreaterThanOrEqual(6.5);
    }
  });
});
