import { join } from "node:path";
import { expect, test } from "@playwright/test";
import { e2eDatabase, storageFor } from "./support";

const MESSY_CSV = join(process.cwd(), "imports/samples/vehicles-messy.csv");
// The vehicles and platforms the messy register brings (invented names); removed again after the
// test so later spec files see the register as seeded.
const IMPORTED = ["MC-101", "MC-102", "GF-201", "RG-402", "GF-203", "SD-303"];
const NEW_MAKES = ["Korrawa", "Veltari", "Ostrovan"];

test.describe("a manager imports the messy register", () => {
  test.use({ storageState: storageFor("manager") });

  test.afterAll(async () => {
    const client = e2eDatabase();
    try {
      const marks = IMPORTED.map(() => "?").join(", ");
      await client.execute({ sql: `delete from vehicles where fleet_number in (${marks})`, args: IMPORTED });
      await client.execute({ sql: `delete from platforms where ratings_missing = 1 and make in (${NEW_MAKES.map(() => "?").join(", ")})`, args: NEW_MAKES });
    } finally {
      client.close();
    }
  });

  test("uploads with progress, corrects one column, sees every bad row, imports the good rows and finds them", async ({ page }) => {
    await page.goto("/imports");
    await expect(page.getByRole("heading", { name: "Import vehicles" })).toBeVisible();
    await expect(page.getByRole("link", { name: "Download template" })).toHaveAttribute("href", "/api/imports/template");

    // Hold the server's answer a moment so the progress bar can be seen with its percentage.
    await page.route(
      "**/api/vehicles/import",
      async (route) => {
        await new Promise((resolve) => setTimeout(resolve, 800));
        await route.continue();
      },
      { times: 1 },
    );
    await page.getByLabel("Register file").setInputFiles(MESSY_CSV);
    const progress = page.getByRole("progressbar", { name: "Checking: upload" });
    await expect(progress).toBeVisible();
    await expect(page.getByTestId("upload-progress")).toContainText("%");

    // Automatic matching, shown as a table the user can correct.
    const mapping = page.getByTestId("mapping-table");
    await expect(mapping).toBeVisible();
    await expect(page.getByLabel('Field for column "Fleet #"')).toHaveValue("fleetNumber");
    await expect(page.getByLabel('Field for column "Chassis No."')).toHaveValue("vin");
    await expect(page.getByLabel('Field for column "Base"')).toHaveValue("depot");
    await expect(page.getByLabel('Field for column "Fuel card"')).toHaveValue("");
    await expect(page.getByTestId("unknown-columns")).toContainText("Fuel card");

    // Preview of the first rows, the quoted line break kept inside its cell.
    await expect(page.getByTestId("preview-table")).toContainText("MC-101");
    await expect(page.getByTestId("preview-table")).toContainText("Bull bar, winch and dual battery");

    // The dry run lists every bad row: none of this organisation's depots is named in the file.
    const errors = page.getByTestId("row-errors");
    await expect(errors).toContainText('Depot "Mulga Creek" is not a depot of this organisation');
    await expect(page.getByTestId("unknown-depots")).toContainText('choose Not imported for the column "Base"');
    await expect(errors).toContainText("A VIN has 17 characters; this one has 16.");
    await expect(errors).toContainText("Odometer is -1,250 km; it cannot be negative");
    await expect(errors).toContainText("Row 9 repeats row 5 exactly; only row 5 is imported");
    await expect(errors.locator("tbody tr")).toHaveCount(9);
    await expect(page.getByTestId("count-errors")).toContainText("9");

    // Correct one column: the depot names are not ours, so that column is not imported.
    await page.getByLabel('Field for column "Base"').selectOption("");
    await expect(page.getByTestId("mapping-dirty")).toBeVisible();
    await expect(page.getByRole("button", { name: "Check again first" })).toBeDisabled();
    await page.getByRole("button", { name: "Check again", exact: true }).click();
    await expect(page.getByTestId("mapping-dirty")).toHaveCount(0);
    await expect(errors.locator("tbody tr")).toHaveCount(3);
    await expect(errors.locator("tbody tr").first()).toContainText("6");
    await expect(errors.locator("tbody tr").first()).toContainText("Chassis No.");
    await expect(page.getByTestId("count-create")).toContainText("6");
    await expect(page.getByTestId("new-platforms")).toContainText("Ostrovan Pindan 6");
    await expect(page.getByTestId("new-platforms")).toContainText("Ratings missing");

    // All or nothing cannot go ahead with bad rows; the good rows can.
    await page.getByLabel(/All or nothing/).check();
    await expect(page.getByRole("button", { name: "Import 6 rows" })).toBeDisabled();
    await page.getByLabel(/Import the good rows/).check();
    await page.getByRole("button", { name: "Import 6 rows" }).click();

    const outcome = page.getByTestId("import-outcome");
    await expect(outcome).toBeVisible();
    await expect(page.getByTestId("result-created")).toContainText("6");
    await expect(page.getByTestId("result-updated")).toContainText("0");
    await expect(page.getByTestId("result-unchanged")).toContainText("0");
    await expect(page.getByTestId("result-errors")).toContainText("3");
    await expect(page.getByTestId("result-rows").getByRole("link", { name: "MC-102" })).toHaveAttribute("href", /^\/vehicles\/[0-9a-f-]{36}$/);

    // The register finds them.
    await outcome.getByRole("link", { name: "find MC-101 in the register" }).click();
    await expect(page).toHaveURL(/\/vehicles\?q=MC-101/);
    await expect(page.getByRole("link", { name: "MC-101", exact: true })).toBeVisible();
    await page.goto("/vehicles?q=SD-303");
    await expect(page.getByRole("link", { name: "SD-303", exact: true })).toBeVisible();

    // What the database holds: the vehicles, and the new platforms marked ratings missing.
    const client = e2eDatabase();
    try {
      const stored = await client.execute({
        sql: "select v.fleet_number, v.odometer_km, p.make, p.ratings_missing from vehicles v join platforms p on p.id = v.platform_id where v.fleet_number in ('MC-101', 'MC-102', 'RG-402') order by v.fleet_number",
        args: [],
      });
      expect(stored.rows.map((r) => [r.fleet_number, r.odometer_km, r.make, Number(r.ratings_missing)])).toEqual([
        ["MC-101", 84210, "Korrawa", 1],
        ["MC-102", 79155, "Korrawa", 1],
        ["RG-402", 1020, "Ostrovan", 1],
      ]);
    } finally {
      client.close();
    }

    // The history shows the import with its original file.
    await page.goto("/imports");
    const history = page.getByTestId("import-history");
    await expect(history.locator("tbody tr").first()).toContainText("Imported");
    await expect(history.locator("tbody tr").first()).toContainText("Tomas Reyburn");
    const download = page.waitForEvent("download");
    await history.getByRole("link", { name: "vehicles-messy.csv" }).first().click();
    expect((await download).suggestedFilename()).toBe("vehicles-messy.csv");
  });

  test("importing the same file again changes nothing and says so", async ({ page }) => {
    await page.goto("/imports");
    await page.getByLabel("Register file").setInputFiles(MESSY_CSV);
    // The corrected matching from the last import is offered for the same column layout.
    await expect(page.getByText("The matching saved from your last import of this column layout is used.")).toBeVisible();
    await expect(page.getByLabel('Field for column "Base"')).toHaveValue("");
    await expect(page.getByTestId("count-unchanged")).toContainText("6");
    await expect(page.getByTestId("count-create")).toContainText("0");
    await page.getByRole("button", { name: "Import 6 rows" }).click();
    await expect(page.getByTestId("import-outcome")).toContainText("Nothing needed changing: the register already matches the file.");
    await expect(page.getByTestId("result-unchanged")).toContainText("6");
  });
});

test.describe("roles without the register's import", () => {
  for (const role of ["driver", "contractor", "finance"] as const) {
    test.describe(role, () => {
      test.use({ storageState: storageFor(role) });

      test(`${role} gets the not-allowed page and 403 from the import API`, async ({ page, request }) => {
        const response = await page.goto("/imports");
        expect(response?.status()).toBe(403);
        await expect(page.getByRole("heading", { name: "Your role cannot open this page" })).toBeVisible();
        await expect(page.getByRole("link", { name: "Import", exact: true })).toHaveCount(0);
        expect((await request.get("/api/imports/template")).status()).toBe(403);
        expect((await request.get("/api/imports")).status()).toBe(403);
      });
    });
  }
});
