import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { formatCents, parseMoneyToCents } from "@/lib/money";

describe("formatCents", () => {
  it("writes Australian dollars with grouped thousands", () => {
    expect(formatCents(123450)).toBe("$1,234.50");
    expect(formatCents(0)).toBe("$0.00");
    expect(formatCents(5)).toBe("$0.05");
    expect(formatCents(100000000)).toBe("$1,000,000.00");
    expect(formatCents(-500)).toBe("-$5.00");
    expect(() => formatCents(1.5)).toThrow(InputError);
  });

  it("agrees with the en-AU currency format", () => {
    // The Unicode CLDR en-AU currency pattern, as the runtime implements it
    const cldr = new Intl.NumberFormat("en-AU", { style: "currency", currency: "AUD" });
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e13 }), (cents) => {
        expect(formatCents(cents)).toBe(cldr.format(cents / 100));
      }),
    );
  });
});

describe("parseMoneyToCents", () => {
  it("reads dollar amounts", () => {
    expect(parseMoneyToCents("1,234.50")).toBe(123450);
    expect(parseMoneyToCents("$1,234.50")).toBe(123450);
    expect(parseMoneyToCents("1234.5")).toBe(123450);
    expect(parseMoneyToCents(" 82.50 ")).toBe(8250);
    expect(parseMoneyToCents("-20")).toBe(-2000);
    expect(parseMoneyToCents("-$0.05")).toBe(-5);
    expect(Object.is(parseMoneyToCents("-0"), 0)).toBe(true);
  });

  it.each(["", "abc", "12.345", "1,23.00", "1,2345", "1e3", "$", "--1", "1.2.3", ".50", "12 34", "NaN", "$-5"])(
    "refuses %j",
    (text) => {
      expect(() => parseMoneyToCents(text, "lines.0.price")).toThrow(
        expect.objectContaining({ name: "InputError", field: "lines.0.price" }),
      );
    },
  );

  it("refuses amounts too large to hold exactly", () => {
    expect(() => parseMoneyToCents("90,071,992,547,409.92")).toThrow(InputError);
  });

  it("reads back what formatCents writes", () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e14, max: 1e14 }), (cents) => {
        expect(parseMoneyToCents(formatCents(cents))).toBe(cents);
      }),
    );
  });
});
