import fc from "fast-check";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { neutraliseCell, neutraliseValue, toCsv, UTF8_BOM, type CsvColumn } from "@/lib/spreadsheet";

interface CostRow {
  fleetNumber: string;
  note: string;
  amountCents: number;
  capital: boolean;
}

const columns: CsvColumn<CostRow>[] = [
  { header: "Fleet number", key: "fleetNumber" },
  { header: "Note", key: "note" },
  { header: "Amount ($)", value: (row) => row.amountCents / 100 },
  { header: "Capital", key: "capital" },
];

function row(note: string, amountCents = 12345): CostRow {
  return { fleetNumber: "RL-014", note, amountCents, capital: false };
}

function secondLine(csv: string): string {
  return csv.split("\r\n")[1] ?? "";
}

describe("neutraliseCell", () => {
  it.each([
    // OWASP CSV Injection; CWE-1236 (S)
    ["=SUM(1+1)", "'=SUM(1+1)"],
    ["@cmd", "'@cmd"],
    ["+61 8 5550 0000", "'+61 8 5550 0000"],
    ["-2+3", "'-2+3"],
    ["\tpadded", "'\tpadded"],
    ["\rline", "'\rline"],
  ])("%j → %j", (text, expected) => {
    // OWASP CSV Injection (S): leading =, +, -, @, tab, CR are prefixed with '
    expect(neutraliseCell(text)).toBe(expected);
  });

  it("leaves other text alone, including formula characters later in the text", () => {
    expect(neutraliseCell("Rear bar, 2 × spare")).toBe("Rear bar, 2 × spare");
    expect(neutraliseCell("a=b")).toBe("a=b");
    expect(neutraliseCell("")).toBe("");
  });
});

describe("neutraliseValue", () => {
  it("keeps numbers, including negative ones, as numbers and escapes text", () => {
    expect(neutraliseValue(-12.5)).toBe(-12.5);
    // OWASP CSV Injection (S): a text cell starting with "-" is escaped
    expect(neutraliseValue("-12.5")).toBe("'-12.5");
    expect(neutraliseValue(true)).toBe(true);
    expect(neutraliseValue(undefined)).toBeNull();
    expect(() => neutraliseValue(Number.POSITIVE_INFINITY, "rows.2.amount")).toThrow(
      expect.objectContaining({ field: "rows.2.amount" }),
    );
    expect(() => neutraliseValue(new Date(Number.NaN))).toThrow(InputError);
  });
});

describe("toCsv", () => {
  it("writes the OWASP cases as expected", () => {
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236 (S)
    expect(secondLine(toCsv([row("=SUM(1+1)")], columns))).toBe("RL-014,'=SUM(1+1),123.45,false");
    expect(secondLine(toCsv([row("@cmd")], columns))).toBe("RL-014,'@cmd,123.45,false");
    // RFC 4180 quoting with embedded quotes doubled (S)
    expect(secondLine(toCsv([row('a"b')], columns))).toBe('RL-014,"a""b",123.45,false');
  });

  it("escapes a leading tab and quotes a field holding a carriage return", () => {
    // OWASP CSV Injection (S): tab (0x09) and CR (0x0D); RFC 4180: a line break is quoted
    expect(secondLine(toCsv([row("\tlead")], columns))).toBe("RL-014,'\tlead,123.45,false");
    const csv = toCsv([row("\rlead")], columns);
    expect(csv).toContain(`RL-014,"'\rlead",123.45,false`);
  });

  it("leaves numbers untouched, negative numbers too", () => {
    const csv = toCsv([row("Credit for returned winch", -4500)], columns);
    expect(secondLine(csv)).toBe("RL-014,Credit for returned winch,-45,false");
  });

  it("quotes commas and line breaks, separates records with CRLF, neutralises headers", () => {
    const csv = toCsv([row("Bar, spare\nand carrier"), row("Snorkel")], [
      ...columns,
      { header: "=HEADER", value: () => null },
    ]);
    expect(csv).toBe(
      [
        "Fleet number,Note,Amount ($),Capital,'=HEADER",
        'RL-014,"Bar, spare\nand carrier",123.45,false,',
        "RL-014,Snorkel,123.45,false,",
      ].join("\r\n"),
    );
  });

  it("writes the header alone for no rows, and a BOM when asked", () => {
    expect(toCsv([], columns)).toBe("Fleet number,Note,Amount ($),Capital");
    const withBom = toCsv([row("Snorkel")], columns, { bom: true });
    expect(withBom.startsWith(UTF8_BOM)).toBe(true);
    expect(withBom.charCodeAt(0)).toBe(0xfeff);
    expect(toCsv([row("Snorkel")], columns).charCodeAt(0)).not.toBe(0xfeff);
  });

  it("writes dates as ISO text", () => {
    const csv = toCsv([{ at: new Date(Date.UTC(2031, 2, 4, 5, 6, 7)) }], [{ header: "At", key: "at" }]);
    expect(secondLine(csv)).toBe("2031-03-04T05:06:07.000Z");
  });

  it("refuses cells it cannot write, naming the cell", () => {
    expect(() => toCsv([row("ok", Number.NaN)], columns)).toThrow(expect.objectContaining({ field: "rows.0.2" }));
    expect(() => toCsv([row("ok")], [])).toThrow(InputError);
  });

  it("reads back through papaparse as the neutralised text, numbers as numbers", () => {
    const cell = fc.oneof(
      fc.string({ unit: "grapheme", maxLength: 20 }),
      fc.constantFrom("=1+1", "+x", "-y", "@z", "\tt", "\rr", 'q"q', "a,b", "line\r\nbreak"),
    );
    fc.assert(
      fc.property(
        fc.array(fc.record({ text: cell, amount: fc.integer({ min: -1e9, max: 1e9 }) }), { minLength: 1, maxLength: 8 }),
        fc.boolean(),
        (rows, bom) => {
          const csv = toCsv(rows, [
            { header: "Text", key: "text" },
            { header: "Amount", key: "amount" },
          ], { bom });
          const parsed = Papa.parse<string[]>(csv, { newline: "\r\n" });
          expect(parsed.errors).toEqual([]);
          expect(parsed.data).toEqual([
            ["Text", "Amount"],
            ...rows.map((r) => [neutraliseCell(r.text), String(r.amount)]),
          ]);
          const typed = Papa.parse<unknown[]>(csv, { newline: "\r\n", dynamicTyping: true });
          expect(typed.data.slice(1).map((cells) => cells[1])).toEqual(rows.map((r) => r.amount));
        },
      ),
    );
  });
});
