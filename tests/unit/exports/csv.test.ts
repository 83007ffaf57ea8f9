import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { ledgerTable, tableToCsv, varianceTable } from "@/lib/exports";
import { UTF8_BOM } from "@/lib/spreadsheet";
import { entry } from "./fixtures";

function parse(csv: string): string[][] {
  expect(csv.startsWith(UTF8_BOM)).toBe(true);
  const result = Papa.parse<string[]>(csv.slice(UTF8_BOM.length), { newline: "\r\n" });
  expect(result.errors).toEqual([]);
  return result.data;
}

describe("tableToCsv on the ledger", () => {
  it("neutralises formula-like text cells with a leading apostrophe", () => {
    const csv = tableToCsv(
      ledgerTable([
        entry({ description: "=SUM(1+1)" }),
        entry({ description: "@cmd" }),
        entry({ description: "+61 8 5550 0000" }),
        entry({ description: "-2+3" }),
        entry({ description: "\tpadded" }),
        entry({ description: "\rline" }),
      ]),
    );
    const descriptions = parse(csv)
      .slice(1, 7)
      .map((r) => r[6]);
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236: cells starting =, +, -, @, tab, CR get a leading '
    expect(descriptions).toEqual(["'=SUM(1+1)", "'@cmd", "'+61 8 5550 0000", "'-2+3", "'\tpadded", "'\rline"]);
  });

  it("quotes a field with a quote and doubles the quote", () => {
    const csv = tableToCsv(ledgerTable([entry({ description: 'a"b' })]));
    // OWASP CSV Injection / RFC 4180: a"b is written "a""b"
    expect(csv.split("\r\n")[1]).toContain(',"a""b",');
  });

  it("neutralises a formula in a cost centre, depot and reference as well", () => {
    const csv = tableToCsv(ledgerTable([entry({ costCentre: "=HYPERLINK(1)", depotName: "@depot", reference: "-1+1" })]));
    const row = parse(csv)[1]!;
    // OWASP CSV Injection; CWE-1236
    expect(row.slice(2, 4)).toEqual(["'=HYPERLINK(1)", "'@depot"]);
    expect(row[7]).toBe("'-1+1");
  });

  it("writes amounts as plain numbers in dollars, a credit as a negative number, and the day as YYYY-MM-DD", () => {
    const csv = tableToCsv(
      ledgerTable([entry({ amountExGstCents: 123_450, gstCents: 12_345 }), entry({ source: "adjustment", amountExGstCents: -2_000, gstCents: -200 })]),
    );
    const [header, first, credit, totals] = parse(csv);
    expect(header?.[0]).toBe("Date");
    expect(first?.[0]).toBe("2026-03-14");
    expect(first?.slice(9)).toEqual(["1234.5", "123.45", "1357.95"]);
    // a true negative number is data, not text: it stays a number, unescaped
    expect(credit?.slice(9)).toEqual(["-20", "-2", "-22"]);
    expect(totals?.slice(9)).toEqual(["1214.5", "121.45", "1335.95"]);
    expect(totals?.[6]).toBe("Total of 2 entries");
  });
});

describe("tableToCsv on the fleet variance", () => {
  it("lists each vehicle with its counts and totals, and neutralises names", () => {
    const csv = tableToCsv(
      varianceTable([
        {
          fleetNumber: "RL-001",
          depotName: "Ochre Well",
          platformName: "=cmd|' /C calc'!A0",
          editionName: "Remote clinic fit-out, edition 2",
          status: "gaps",
          summary: { meets: 10, short: 2, offSpec: 1, unproven: 0, concession: 1, prohibitedFitted: 0, extra: 3 },
          costToCloseCents: 245_000,
          massToCloseKg: 41.5,
        },
        { fleetNumber: "RL-002", depotName: null, platformName: "Yendor Terrus 4", editionName: null, status: "no_edition", summary: null, costToCloseCents: 0, massToCloseKg: 0 },
      ]),
    );
    const [, first, second, totals] = parse(csv);
    // OWASP CSV Injection; CWE-1236
    expect(first?.[2]).toBe("'=cmd|' /C calc'!A0");
    expect(first?.slice(4)).toEqual(["Has gaps", "10", "2", "1", "0", "1", "0", "3", "2450", "41.5"]);
    expect(second?.slice(4, 6)).toEqual(["No standard assigned", ""]);
    expect(totals?.slice(0, 6)).toEqual(["2 vehicles", "", "", "", "0 of 1 meet", "10"]);
  });
});
