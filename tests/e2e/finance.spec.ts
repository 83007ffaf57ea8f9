import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import ExcelJS from "exceljs";
import { readFile } from "node:fs/promises";
import Papa from "papaparse";
import { e2eDatabase, storageFor } from "./support";

const aud = (cents: number) => (cents / 100).toLocaleString("en-AU", { style: "currency", currency: "AUD" });

/** 1 July – 30 June of the financial year today falls in, as YYYY-MM-DD. */
function thisFinancialYear(now = new Date()) {
  const start = now.getUTCMonth() >= 6 ? now.getUTCFullYear() : now.getUTCFullYear() - 1;
  return { from: `${start}-07-01`, to: `${start + 1}-06-30`, label: `FY ${start}–${String((start + 1) % 100).padStart(2, "0")}` };
}

async function query<T>(sql: string, args: (string | number)[]): Promise<T[]> {
  const client = e2eDatabase();
  try {
    return (await client.execute({ sql, args })).rows as unknown as T[];
  } finally {
    client.close();
  }
}

const MIRRABEL = "(select id from organisations where slug = 'mirrabel-health')";

/** The busiest cost centre and category of this financial year, and what they add up to. */
async function busiestFilter() {
  const fy = thisFinancialYear();
  const fromMs = Date.parse(`${fy.from}T00:00:00Z`);
  const toMs = Date.parse(`${fy.to}T00:00:00Z`) + 86_400_000;
  const [top] = await query<{ cost_centre: string; category: string; n: number }>(
    `select cost_centre, category, count(*) as n from costs where org_id = ${MIRRABEL} and incurred_on >= ? and incurred_on < ? group by 1, 2 order by 3 desc limit 1`,
    [fromMs, toMs],
  );
  const [sums] = await query<{ n: number; ex: number; gst: number }>(
    `select count(*) as n, sum(amount_ex_gst_cents) as ex, sum(gst_cents) as gst from costs where org_id = ${MIRRABEL} and cost_centre = ? and category = ? and incurred_on >= ? and incurred_on < ?`,
    [top!.cost_centre, top!.category, fromMs, toMs],
  );
  return { ...fy, costCentre: top!.cost_centre, category: top!.category, entries: Number(sums!.n), exGstCents: Number(sums!.ex), gstCents: Number(sums!.gst) };
}

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`);
}

test.describe("finance", () => {
  test.use({ storageState: storageFor("finance"), acceptDownloads: true });

  test("filters the ledger by cost centre, category and period, and the totals and chart table agree", async ({ page }) => {
    const expected = await busiestFilter();
    await page.goto("/");
    await page.getByRole("navigation").getByRole("link", { name: "Costs" }).first().click();
    await expect(page.getByRole("heading", { level: 1, name: "Costs" })).toBeVisible();
    const form = page.getByRole("search", { name: "Filter the ledger" });
    await form.getByLabel("Cost centre").selectOption(expected.costCentre);
    await form.getByLabel("Category").selectOption(expected.category);
    await form.getByRole("button", { name: "Show costs" }).click();
    await expect(page).toHaveURL(new RegExp(`costCentre=${expected.costCentre}.*category=${expected.category}`));
    await form.getByRole("link", { name: `This financial year (${expected.label})` }).click();
    await expect(page).toHaveURL(new RegExp(`from=${expected.from}&to=${expected.to}`));
    // The filters stay in the form after the reload.
    await expect(form.getByLabel("Cost centre")).toHaveValue(expected.costCentre);

    await expect(page.getByTestId("total-entries")).toHaveText(String(expected.entries));
    await expect(page.getByTestId("total-ex-gst")).toHaveText(aud(expected.exGstCents));
    await expect(page.getByTestId("total-gst")).toHaveText(aud(expected.gstCents));
    const rows = page.getByTestId("ledger-row");
    await expect(rows.first()).toBeVisible();
    expect(await rows.count()).toBe(Math.min(25, expected.entries));
    for (const text of await rows.allInnerTexts()) expect(text).toContain(expected.costCentre);

    const chart = page.getByTestId("chart-spend-by-month");
    await expect(chart.getByRole("heading", { name: "Spend by month" })).toBeVisible();
    await expect(chart.locator("svg.recharts-surface").first()).toBeVisible();
    await expect(chart.locator(".recharts-bar-rectangle").first()).toBeVisible();
    await chart.getByText("Show these numbers as a table").click();
    await expect(chart.getByRole("region", { name: "Spend by month, as a table" })).toBeVisible();
    await expect(chart.getByTestId("spend-table-total")).toHaveText(aud(expected.exGstCents));
  });

  test("downloads the filtered ledger as CSV and XLSX, and both hold the same entries", async ({ page }) => {
    const expected = await busiestFilter();
    await page.goto(`/costs?costCentre=${expected.costCentre}&category=${expected.category}&from=${expected.from}&to=${expected.to}`);

    const [csvDownload] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-csv").click()]);
    expect(csvDownload.suggestedFilename()).toBe(`rigline-costs-${expected.from}-to-${expected.to}.csv`);
    const csvText = (await readFile((await csvDownload.path())!)).toString("utf8");
    expect(csvText.charCodeAt(0)).toBe(0xfeff);
    const csv = Papa.parse<string[]>(csvText.slice(1), { newline: "\r\n" }).data;
    expect(csv[0]).toEqual(["Date", "Fleet no.", "Cost centre", "Depot", "Category", "Capital or operating", "Description", "Reference", "Source", "Ex GST ($)", "GST ($)", "Total incl. GST ($)"]);
    expect(csv).toHaveLength(expected.entries + 2);
    for (const row of csv.slice(1, -1)) {
      expect(row[2]).toBe(expected.costCentre);
      expect(row[0]! >= expected.from && row[0]! <= expected.to).toBe(true);
      expect(Number.isFinite(Number(row[9]))).toBe(true);
    }
    const csvTotal = csv[csv.length - 1]!;
    expect(csvTotal[6]).toBe(`Total of ${expected.entries} ${expected.entries === 1 ? "entry" : "entries"}`);
    expect(Math.round(Number(csvTotal[9]) * 100)).toBe(expected.exGstCents);

    const [xlsxDownload] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-xlsx").click()]);
    expect(xlsxDownload.suggestedFilename()).toBe(`rigline-costs-${expected.from}-to-${expected.to}.xlsx`);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await readFile((await xlsxDownload.path())!)) as unknown as ArrayBuffer);
    const sheet = workbook.worksheets[0]!;
    expect(sheet.views[0]).toMatchObject({ state: "frozen", ySplit: 1 });
    expect(sheet.rowCount).toBe(expected.entries + 2);
    let sumCents = 0;
    for (let r = 2; r <= expected.entries + 1; r++) {
      const row = sheet.getRow(r);
      expect(row.getCell(1).type).toBe(ExcelJS.ValueType.Date);
      expect(row.getCell(10).type).toBe(ExcelJS.ValueType.Number);
      sumCents += Math.round((row.getCell(10).value as number) * 100);
      // The same entry on the same line of both files.
      expect(row.getCell(7).value).toBe(csv[r - 1]![6]);
      expect(Math.round((row.getCell(10).value as number) * 100)).toBe(Math.round(Number(csv[r - 1]![9]) * 100));
    }
    expect(sumCents).toBe(expected.exGstCents);
  });

  test("enters an invoice with GST worked out and finds it in the vehicle's costs", async ({ page }) => {
    await page.goto("/costs");
    await page.getByRole("link", { name: "Enter an invoice" }).click();
    await expect(page.getByRole("heading", { level: 1, name: "Enter an invoice" })).toBeVisible();
    await page.getByLabel("Vehicle").selectOption({ label: "MH-006" });
    await page.getByLabel("Category").selectOption({ label: "Recovery" });
    await page.getByLabel("Capital or operating").selectOption({ label: "Capital" });
    await page.getByLabel("What the invoice is for").fill("Recovery boards and long-handled shovel, browser test");
    await page.getByLabel("Invoice number").fill("INV-E2E-1");
    await page.getByLabel("Amount ($)").fill("12.35");
    // GST Act s 9-90 (P): $12.35 excl., one line → 1.235 → $1.24
    await expect(page.getByTestId("cost-preview")).toHaveText("Will book $12.35 ex GST + $1.24 GST = $13.59.");
    await page.getByRole("button", { name: "Book the cost" }).click();
    await expect(page.getByTestId("cost-status")).toContainText("Booked $13.59 incl. GST");
    // The form is cleared for the next invoice.
    await expect(page.getByLabel("What the invoice is for")).toHaveValue("");

    const [vehicle] = await query<{ id: string }>(`select id from vehicles where fleet_number = 'MH-006' and org_id = ${MIRRABEL}`, []);
    await page.goto(`/vehicles/${vehicle!.id}/costs`);
    const row = page.getByTestId("ledger-row").filter({ hasText: "Recovery boards and long-handled shovel, browser test" });
    await expect(row).toContainText("$12.35");
    await expect(row).toContainText("$1.24");
    await expect(row).toContainText("Ref. INV-E2E-1");
  });

  test("sees budgets against actual and the fleet over time, each chart with its table", async ({ page }) => {
    await page.goto("/budgets");
    const budget = page.getByTestId("chart-budget-actual");
    await expect(budget.locator("svg.recharts-surface").first()).toBeVisible();
    await budget.getByText("Show these numbers as a table").click();
    const table = budget.getByRole("region", { name: "Budget against actual, as a table" });
    await expect(table).toBeVisible();
    const rows = await page.getByTestId("budget-row").count();
    expect(rows).toBeGreaterThanOrEqual(12);
    expect(await table.locator("tbody tr").count()).toBe(rows);
    await expect(page.getByTestId("budget-table").getByText("Over budget").first()).toBeVisible();

    await page.getByRole("link", { name: "Fleet over time" }).click();
    for (const [id, name] of [
      ["chart-readiness", "Fleet readiness over time, as a table"],
      ["chart-variance", "Variance closing over time, as a table"],
    ] as const) {
      const figure = page.getByTestId(id);
      await expect(figure.locator("svg.recharts-surface").first()).toBeVisible();
      await figure.getByText("Show these numbers as a table").click();
      const weeks = figure.getByRole("region", { name }).locator("tbody tr");
      expect(await weeks.count()).toBeGreaterThan(20);
    }
    // The last row is today's figures, taken when the page was first opened today.
    const today = new Date();
    const lastDay = `${today.getUTCDate()} ${["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"][today.getUTCMonth()]} ${today.getUTCFullYear()}`;
    await expect(page.getByTestId("chart-readiness").locator("tbody tr").last()).toContainText(lastDay);

    const [variance] = await Promise.all([page.waitForEvent("download"), page.getByTestId("variance-export-csv").click()]);
    const text = (await readFile((await variance.path())!)).toString("utf8").slice(1);
    const lines = Papa.parse<string[]>(text, { newline: "\r\n" }).data;
    const [active] = await query<{ n: number }>(`select count(*) as n from vehicles where org_id = ${MIRRABEL} and state <> 'retired'`, []);
    expect(lines).toHaveLength(Number(active!.n) + 2);
    expect(lines[0]?.[4]).toBe("Status");
  });

  test("creates a token, pulls the export with it, revokes it and is refused after", async ({ page, playwright, baseURL }) => {
    await page.goto("/profile");
    await page.getByRole("link", { name: "API tokens" }).click();
    await expect(page.getByRole("heading", { level: 1, name: "API tokens" })).toBeVisible();
    const name = `Ledger pull ${Date.now()}`;
    await page.getByLabel("Token name").fill(name);
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = (await page.getByTestId("new-token-secret").innerText()).trim();
    expect(secret).toMatch(/^rgl_[A-Za-z0-9_-]{43}$/);
    const row = page.getByTestId("token-row").filter({ hasText: name });
    await expect(row).toContainText(secret.slice(0, 12));
    await expect(row).toContainText("Active");
    await expect(page.getByTestId("token-table")).not.toContainText(secret);

    const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${secret}` } });
    try {
      const ok = await api.get("/api/costs/export?format=csv&kind=capital");
      expect(ok.status()).toBe(200);
      expect(ok.headers()["content-type"]).toBe("text/csv; charset=utf-8");
      expect((await ok.text()).split("\r\n")[0]).toContain("Cost centre");
      // The token is finance's, so it may book but not manage people.
      expect((await api.get("/api/users")).status()).toBe(403);

      // The list now shows when it was last used.
      await page.reload();
      await expect(row).not.toContainText("Never");
      await row.getByRole("button", { name: `Revoke the token ${name}` }).click();
      await expect(row).toContainText("Revoked");
      const refused = await api.get("/api/costs/export?format=csv");
      expect(refused.status()).toBe(401);
      expect((await refused.json()).error.code).toBe("unauthenticated");
    } finally {
      await api.dispose();
    }
  });

  // axe-core scan (WCAG 2.1 A/AA rules): no serious or critical violations.
  for (const path of ["/costs", "/costs/new", "/budgets", "/costs/trends", "/profile/tokens"]) {
    test(`${path} has no serious accessibility violations`, async ({ page }) => {
      test.setTimeout(90_000);
      await page.goto(path);
      await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
      expect(await seriousViolations(page)).toEqual([]);
    });
  }
});

test.describe("a manager", () => {
  test.use({ storageState: storageFor("manager") });

  test("reads the ledger and exports it, but cannot enter invoices or change budgets", async ({ page }) => {
    await page.goto("/costs");
    await expect(page.getByTestId("ledger-row").first()).toBeVisible();
    await expect(page.getByRole("link", { name: "Enter an invoice" })).toHaveCount(0);
    expect((await page.goto("/costs/new"))?.status()).toBe(403);
    await page.goto("/budgets");
    await expect(page.getByTestId("budget-row").first()).toBeVisible();
    await expect(page.getByRole("button", { name: "Add budget" })).toHaveCount(0);
    expect((await page.request.get("/api/costs/export?format=xlsx")).status()).toBe(200);
  });
});

for (const role of ["driver", "contractor"] as const) {
  test.describe(`a ${role}`, () => {
    test.use({ storageState: storageFor(role) });

    test("is refused the cost pages and exports", async ({ page }) => {
      for (const path of ["/costs", "/budgets", "/costs/trends"]) expect((await page.goto(path))?.status(), path).toBe(403);
      await expect(page.getByRole("link", { name: "Costs" })).toHaveCount(0);
      for (const path of ["/api/costs?pageSize=1", "/api/costs/export?format=csv", "/api/variance/export?format=csv", "/api/budgets"]) {
        const response = await page.request.get(path);
        expect(response.status(), path).toBe(403);
        expect((await response.json()).error.code).toBe("forbidden");
      }
    });
  });
}
