import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { formatNumber, formatQuantity, pageItems, Pagination, Quantity } from "@/components/ui";
import { InputError } from "@/lib/errors";
import { attr, openTags, textOf } from "./html";

describe("formatNumber / formatQuantity", () => {
  it("groups thousands with commas and writes a decimal point (en-AU)", () => {
    // Australian number style: comma between thousands, point before decimals (common practice)
    expect(formatNumber(1234567.891, { digits: 2 })).toBe("1,234,567.89");
    expect(formatNumber(2150)).toBe("2,150");
    expect(formatNumber(999)).toBe("999");
  });

  it("rounds to the fixed digits and never prints minus zero", () => {
    // Invented inputs, hand-worked: 1284.45 → "1,284.5" (1 digit); -0.4 → 0 digits → "0".
    expect(formatNumber(1284.46, { digits: 1 })).toBe("1,284.5");
    expect(formatNumber(3, { digits: 2 })).toBe("3.00");
    expect(formatNumber(-0.4)).toBe("0");
    expect(formatNumber(-38)).toBe("-38");
  });

  it("marks positive changes with + when signed", () => {
    expect(formatNumber(412, { signed: true })).toBe("+412");
    expect(formatNumber(-38, { signed: true })).toBe("-38");
    expect(formatNumber(0, { signed: true })).toBe("0");
  });

  it("joins the unit with a no-break space, except for %", () => {
    expect(formatQuantity(2968, "kg")).toBe("2,968\u00a0kg");
    expect(formatQuantity(4.79, "%", { digits: 2 })).toBe("4.79%");
    expect(formatQuantity(12)).toBe("12");
  });

  it("throws InputError for a value that is not a finite number or bad digits", () => {
    expect(() => formatNumber(Number.NaN)).toThrow(InputError);
    expect(() => formatNumber(Number.POSITIVE_INFINITY)).toThrow(InputError);
    try {
      formatNumber(1, { digits: 1.5 });
      expect.unreachable("digits 1.5 must throw");
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("digits");
    }
    expect(() => formatNumber(1, { digits: 7 })).toThrow(InputError);
  });
});

describe("Quantity", () => {
  it("renders the formatted number in tabular figures with its unit", () => {
    const html = renderToStaticMarkup(<Quantity value={1703.25} unit="kg" digits={1} />);
    expect(textOf(html)).toBe("1,703.3\u00a0kg");
    const outer = openTags(html, "span")[0] as string;
    expect(attr(outer, "class")).toContain("tabular-nums");
    expect(attr(outer, "data-value")).toBe("1703.25");
  });

  it("shows a missing value as a dash that reads as 'no value'", () => {
    for (const value of [null, undefined, Number.NaN]) {
      const html = renderToStaticMarkup(<Quantity value={value} unit="kg" />);
      expect(textOf(html)).toBe("—no value");
      expect(html).toContain('aria-hidden="true">—');
    }
  });
});

describe("pageItems", () => {
  it("shows first, last, the current page and its neighbours, with gaps between", () => {
    expect(pageItems(5, 10)).toEqual([1, "gap", 4, 5, 6, "gap", 10]);
    expect(pageItems(1, 10)).toEqual([1, 2, "gap", 10]);
    expect(pageItems(10, 10)).toEqual([1, "gap", 9, 10]);
  });

  it("never hides a single page behind a gap", () => {
    expect(pageItems(4, 7)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    // Page 3 of 6: neighbours 2–4, then 5 alone between 4 and 6 is shown, not a gap.
    expect(pageItems(3, 6)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(pageItems(3, 8)).toEqual([1, 2, 3, 4, "gap", 8]);
  });

  it("clamps the page, handles none or one page, and rejects non-finite input", () => {
    expect(pageItems(99, 3)).toEqual([1, 2, 3]);
    expect(pageItems(-2, 3)).toEqual([1, 2, 3]);
    expect(pageItems(1, 1)).toEqual([1]);
    expect(pageItems(1, 0)).toEqual([]);
    expect(() => pageItems(Number.NaN, 3)).toThrow(InputError);
    expect(() => pageItems(1, Number.POSITIVE_INFINITY)).toThrow(InputError);
  });
});

describe("Pagination", () => {
  it("links every page, marks the current one and names the landmark", () => {
    const html = renderToStaticMarkup(
      <Pagination page={4} pageCount={12} hrefFor={(p) => `/vehicles?page=${p}`} />,
    );
    const nav = openTags(html, "nav")[0] as string;
    expect(attr(nav, "aria-label")).toBe("Pages");
    const links = openTags(html, "a");
    const current = links.filter((a) => attr(a, "aria-current") === "page");
    expect(current).toHaveLength(1);
    expect(attr(current[0] as string, "href")).toBe("/vehicles?page=4");
    expect(links.map((a) => attr(a, "href"))).toEqual([
      "/vehicles?page=3", // Previous
      "/vehicles?page=1",
      "/vehicles?page=2", // shown: only one page between 1 and 3
      "/vehicles?page=3",
      "/vehicles?page=4",
      "/vehicles?page=5",
      "/vehicles?page=12",
      "/vehicles?page=5", // Next
    ]);
    expect(textOf(html)).toContain("Previous");
    expect(textOf(html)).toContain("Next");
  });

  it("has no Previous link on the first page and renders nothing for one page", () => {
    const html = renderToStaticMarkup(
      <Pagination page={1} pageCount={3} hrefFor={(p) => `?page=${p}`} />,
    );
    expect(openTags(html, "a").some((a) => attr(a, "rel") === "prev")).toBe(false);
    expect(html).toMatch(/aria-disabled="true"[^>]*>Previous</);
    expect(
      renderToStaticMarkup(<Pagination page={1} pageCount={1} hrefFor={(p) => `?page=${p}`} />),
    ).toBe("");
  });
});
