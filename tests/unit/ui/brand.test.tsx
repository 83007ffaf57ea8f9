import { existsSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Logo, LogoMark } from "@/components/brand";
import { attr, openTags, textOf } from "./html";
import { readColorTokens, scalePattern } from "./tokens";

const root = fileURLToPath(new URL("../../../", import.meta.url));
const tokens = readColorTokens();
const paletteHex = new Set([...tokens].filter(([n]) => scalePattern.test(n)).map(([, v]) => v));

function hexColours(text: string): string[] {
  return [...text.matchAll(/#[0-9a-fA-F]{6}\b/g)].map((m) => m[0].toLowerCase());
}

describe("web app manifest", () => {
  const manifest = JSON.parse(readFileSync(`${root}public/manifest.webmanifest`, "utf8")) as {
    name: string;
    short_name: string;
    theme_color: string;
    background_color: string;
    start_url: string;
    display: string;
    icons: { src: string; type: string; sizes: string }[];
  };

  it("names Rigline and takes its colours from the palette", () => {
    expect(manifest.name).toBe("Rigline");
    expect(manifest.short_name).toBe("Rigline");
    expect(manifest.theme_color).toBe(tokens.get("night-800"));
    expect(manifest.background_color).toBe(tokens.get("surface"));
    expect(manifest.start_url).toBe("/");
    expect(manifest.display).toBe("standalone");
  });

  it("points at the SVG icon that is shipped in public/", () => {
    const svg = manifest.icons.find((i) => i.type === "image/svg+xml");
    expect(svg?.src).toBe("/icon.svg");
    expect(svg?.sizes).toBe("any");
    expect(existsSync(`${root}public/icon.svg`)).toBe(true);
  });
});

describe("logo", () => {
  it("draws the favicon and the colour mark only in palette colours", () => {
    const icon = readFileSync(`${root}public/icon.svg`, "utf8");
    expect(icon).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    const iconColours = hexColours(icon);
    expect(iconColours.length).toBeGreaterThanOrEqual(4);
    for (const c of iconColours) expect(paletteHex.has(c), c).toBe(true);

    const mark = renderToStaticMarkup(<LogoMark />);
    const markColours = hexColours(mark);
    expect(markColours.length).toBeGreaterThanOrEqual(4);
    for (const c of markColours) expect(paletteHex.has(c), c).toBe(true);
    // The favicon is the same drawing as the component: same colours, same shapes.
    expect(new Set(iconColours)).toEqual(new Set(markColours));
    const shapes = (svg: string) => [...svg.matchAll(/\sd="([^"]+)"/g)].map((m) => m[1]);
    expect(shapes(icon)).toEqual(shapes(mark));
    const circle = (svg: string) =>
      /<circle[^>]*>/.exec(svg)?.[0].match(/c[xy]="[^"]+"|r="[^"]+"/g);
    expect(circle(icon)).toEqual(circle(mark));
  });

  it("in mono uses only the current text colour", () => {
    const mark = renderToStaticMarkup(<LogoMark mono />);
    expect(hexColours(mark)).toEqual([]);
    expect(mark).toContain('fill="currentColor"');
  });

  it("shows the wordmark beside a decorative mark, or names the mark when alone", () => {
    const full = renderToStaticMarkup(<Logo />);
    expect(textOf(full)).toBe("Rigline");
    expect(attr(openTags(full, "svg")[0] as string, "aria-hidden")).toBe("true");

    const markOnly = renderToStaticMarkup(<Logo wordmark={false} size={24} />);
    const svg = openTags(markOnly, "svg")[0] as string;
    expect(attr(svg, "role")).toBe("img");
    expect(attr(svg, "aria-label")).toBe("Rigline");
    expect(attr(svg, "width")).toBe("24");
  });

  it("gives each mark on a page its own clip and mask ids", () => {
    const html = renderToStaticMarkup(
      <>
        <LogoMark />
        <LogoMark mono />
      </>,
    );
    const ids = [...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
    // Colour mark: its clip; mono mark: its clip and the mask that cuts the track out.
    expect(ids).toHaveLength(3);
    expect(new Set(ids).size).toBe(3);
    for (const id of ids) expect(html).toContain(`url(#${id})`);
  });
});
