import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { e2eDatabase, idOf, storageFor } from "./support";

// The register waits on the server for each change of the URL; give a busy machine room.
const expect = baseExpect.configure({ timeout: 20_000 });
test.describe.configure({ timeout: 120_000 });

async function rows(page: Page) {
  return page.getByRole("region", { name: "Vehicles" }).locator("tbody tr");
}

/** Values of one column of the register, by its header text. */
async function columnValues(page: Page, header: string): Promise<string[]> {
  const table = page.getByRole("region", { name: "Vehicles" });
  await expect(table.locator("tbody tr").first()).toBeVisible();
  const headers = await table.locator("thead th").allInnerTexts();
  const index = headers.findIndex((h) => h.trim().toLowerCase() === header.toLowerCase());
  expect(index, `column ${header}`).toBeGreaterThanOrEqual(0);
  return table.locator(`tbody tr td:nth-child(${index + 1})`).allInnerTexts();
}

// axe-core scan (WCAG 2.1 A/AA rules): no serious or critical violations.
async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`);
}

async function query<T = Record<string, unknown>>(sql: string, args: (string | number)[] = []): Promise<T[]> {
  const client = e2eDatabase();
  try {
    return (await client.execute({ sql, args })).rows as unknown as T[];
  } finally {
    client.close();
  }
}

test.describe("the register, as a fleet manager", () => {
  test.use({ storageState: storageFor("manager") });

  test("searches, filters by depot, sorts, changes columns, and keeps it all after a reload", async ({ page }) => {
    await page.goto("/vehicles");
    await expect(page.getByRole("heading", { name: "Vehicles", level: 1 })).toBeVisible();
    await expect(page.getByTestId("register-count")).toContainText("of 40 vehicles");

    await page.getByLabel("Search fleet no., VIN or registration").fill("MH-03");
    await expect(page).toHaveURL(/q=MH-03/);
    await expect(await rows(page)).toHaveCount(10);

    await page.getByLabel("Depot", { exact: true }).selectOption({ label: "Ochre Well" });
    await expect(page).toHaveURL(/depotId=/);
    await expect.poll(async () => [...new Set(await columnValues(page, "Depot"))]).toEqual(["Ochre Well"]);
    const fleet = await columnValues(page, "Fleet no.");
    expect(fleet.length).toBeGreaterThan(1);
    expect(fleet.every((f) => f.startsWith("MH-03"))).toBe(true);

    const odometer = page.getByRole("columnheader", { name: "Odometer" });
    await odometer.getByRole("button").click();
    await expect(page).toHaveURL(/sort=odometerKm/);
    await odometer.getByRole("button").click();
    await expect(page).toHaveURL(/dir=desc/);
    await expect(odometer).toHaveAttribute("aria-sort", "descending");
    const km = (await columnValues(page, "Odometer")).map((t) => Number(t.replace(/[^\d]/g, "")));
    expect(km).toEqual([...km].sort((a, b) => b - a));

    await page.getByRole("button", { name: "Columns" }).click();
    const chooser = page.getByRole("dialog", { name: "Columns" });
    await chooser.getByLabel("VIN").check();
    await chooser.getByLabel("Platform").uncheck();
    await page.keyboard.press("Escape");
    await expect(page).toHaveURL(/cols=/);
    await expect(page.getByRole("columnheader", { name: "VIN" })).toBeVisible();
    await expect(page.getByRole("columnheader", { name: "Platform" })).toHaveCount(0);

    const url = page.url();
    const order = await columnValues(page, "Fleet no.");
    await page.reload();
    expect(page.url()).toBe(url);
    await expect(page.getByLabel("Search fleet no., VIN or registration")).toHaveValue("MH-03");
    await expect(page.getByLabel("Depot", { exact: true }).locator("option:checked")).toHaveText("Ochre Well");
    await expect(page.getByRole("columnheader", { name: "Odometer" })).toHaveAttribute("aria-sort", "descending");
    await expect(page.getByRole("columnheader", { name: "VIN" })).toBeVisible();
    await expect(page.getByRole("columnheader", { name: "Platform" })).toHaveCount(0);
    await expect.poll(async () => columnValues(page, "Fleet no.")).toEqual(order);
  });

  test("moves two vehicles to another depot in one go", async ({ page }) => {
    await page.goto("/vehicles?q=MH-03&sort=fleetNumber");
    const [a, b] = ["MH-032", "MH-035"];
    await page.getByLabel(`Choose ${a}`).check();
    await page.getByLabel(`Choose ${b}`).check();
    await expect(page.getByTestId("selected-count")).toHaveText("2 vehicles chosen");
    await page.getByRole("button", { name: "Move to depot" }).click();
    const dialog = page.getByRole("dialog", { name: "Move to another depot" });
    await dialog.getByLabel("Depot").selectOption({ label: "Tarrin Junction (TRJ)" });
    await dialog.getByRole("button", { name: "Move to depot" }).click();
    await expect(page.getByText("Moved 2 vehicles to Tarrin Junction")).toBeVisible();
    await expect(dialog).toHaveCount(0);
    await expect(page.getByTestId("selected-count")).toHaveCount(0);
    const moved = await query<{ fleet_number: string; code: string }>(
      "select v.fleet_number, d.code from vehicles v join depots d on d.id = v.depot_id where v.fleet_number in (?, ?) order by v.fleet_number",
      [a, b],
    );
    expect(moved.map((m) => [m.fleet_number, m.code])).toEqual([
      [a, "TRJ"],
      [b, "TRJ"],
    ]);
    const audits = await query("select a.id from audit_entries a join vehicles v on v.id = a.entity_id where a.action = 'vehicle.move_depot' and v.fleet_number in (?, ?)", [a, b]);
    expect(audits).toHaveLength(2);
    // The table shows the new depot once it has reloaded.
    const row = page.getByRole("row", { name: new RegExp(a) });
    await expect(row).toContainText("Tarrin Junction");
  });

  test("edits a vehicle: a bad VIN is refused beside the field, a good one saves", async ({ page }) => {
    const id = await idOf("vehicles", "fleet_number = ?", ["MH-036"]);
    const vin = (await query<{ vin: string }>("select vin from vehicles where id = ?", [id]))[0]!.vin;
    await page.goto(`/vehicles/${id}`);
    await page.getByRole("link", { name: "Edit vehicle" }).click();
    await expect(page.getByRole("heading", { name: "Edit MH-036" })).toBeVisible();
    const vinField = page.getByLabel("VIN", { exact: true });
    await vinField.fill("7RMQ" + vin.slice(4));
    await page.getByLabel("Odometer (km)").fill("123456");
    await page.getByRole("button", { name: "Save vehicle" }).click();
    await expect(vinField).toHaveAttribute("aria-invalid", "true");
    await expect(vinField).toHaveAccessibleDescription(/Position 4 is the letter Q, which a VIN never uses/);
    await expect(page.getByLabel("Odometer (km)")).toHaveValue("123456");
    const [unchanged] = await query<{ odometer_km: number }>("select odometer_km from vehicles where id = ?", [id]);
    expect(unchanged!.odometer_km).not.toBe(123456);

    await vinField.fill(vin);
    await expect(page.getByTestId("vin-check-digit")).toContainText("not required outside North America");
    await page.getByRole("button", { name: "Save vehicle" }).click();
    await expect(page).toHaveURL(new RegExp(`/vehicles/${id}$`));
    await expect(page.getByText("123,456")).toBeVisible();
  });

  test("grounds a vehicle and returns it to service, a reason each time", async ({ page }) => {
    const id = await idOf("vehicles", "fleet_number = ?", ["MH-038"]);
    await page.goto(`/vehicles/${id}`);
    await page.getByRole("button", { name: "Ground vehicle" }).click();
    const ground = page.getByRole("dialog", { name: "Ground MH-038" });
    await ground.getByLabel("Why it is grounded").fill("Brake line chafed through on the corrugations");
    await ground.getByRole("button", { name: "Ground vehicle" }).click();
    await expect(page.getByTestId("grounded-banner")).toContainText("Brake line chafed through");
    await page.getByRole("button", { name: "Return to service" }).click();
    const back = page.getByRole("dialog", { name: "Return MH-038 to service" });
    await back.getByRole("button", { name: "Return to service" }).click();
    await expect(back.getByLabel("Why it is safe to drive again")).toHaveAccessibleDescription(/Give the reason/);
    await back.getByLabel("Why it is safe to drive again").fill("Line replaced and brakes bled at the depot");
    await back.getByRole("button", { name: "Return to service" }).click();
    await expect(page.getByTestId("grounded-banner")).toHaveCount(0);
    const [row] = await query<{ state: string }>("select state from vehicles where id = ?", [id]);
    expect(row!.state).toBe("in_service");
  });

  test("a platform's figures must agree, and an imported one shows its missing ratings until they are entered", async ({ page }) => {
    await page.goto("/platforms/new");
    const fill = async (label: string, value: string) => page.getByRole("textbox", { name: label, exact: true }).fill(value);
    await fill("Make", "Dunnart");
    await fill("Model", "Sandrover");
    await fill("Kerb mass (kg)", "2150");
    await fill("GVM (kg)", "3100");
    await fill("GCM (kg)", "5900");
    await fill("Front axle rating (kg)", "1300");
    await fill("Rear axle rating (kg)", "1700");
    await fill("Wheelbase (mm)", "2900");
    await fill("Standard tyre size", "265/70R17");
    await page.getByRole("button", { name: "Add platform" }).click();
    await expect(page.getByLabel("Rear axle rating (kg)")).toHaveAccessibleDescription("The axle ratings add up to 3,000 kg, below the GVM of 3,100 kg");
    await fill("Rear axle rating (kg)", "1850");
    await page.getByRole("button", { name: "Add platform" }).click();
    await expect(page.getByRole("heading", { name: "Dunnart Sandrover", level: 1 })).toBeVisible();
    await expect(page.getByText("Ratings complete")).toBeVisible();

    const orgId = await idOf("organisations", "slug = ?", ["mirrabel-health"]);
    const now = Date.now();
    await query("insert into platforms (id, org_id, make, model, variant, ratings_missing, created_at, updated_at) values (?, ?, 'Bilby', 'Scout', '', 1, ?, ?)", [
      "e2e-imported-platform",
      orgId,
      now,
      now,
    ]);
    await page.goto("/platforms");
    await expect(page.getByRole("row", { name: /Bilby Scout/ })).toContainText("Ratings missing");
    await page.getByRole("link", { name: "Bilby Scout" }).click();
    await expect(page.getByTestId("missing-ratings")).toContainText("GVM (kg)");
    await page.getByRole("link", { name: "Enter the missing ratings" }).click();
    await fill("Kerb mass (kg)", "1980");
    await fill("GVM (kg)", "2900");
    await fill("GCM (kg)", "5400");
    await fill("Front axle rating (kg)", "1250");
    await fill("Rear axle rating (kg)", "1750");
    await fill("Wheelbase (mm)", "2700");
    await page.getByRole("button", { name: "Save platform" }).click();
    await expect(page.getByRole("region", { name: /Notices/ }).getByText("Bilby Scout saved; its ratings are complete")).toBeVisible();
    await expect(page.getByTestId("missing-ratings")).toHaveCount(0);
    await expect(page.getByText("Ratings complete")).toBeVisible();
  });
});

test.describe("the register pages, scanned for accessibility", () => {
  test.use({ storageState: storageFor("manager") });

  test("register, vehicle, forms and platforms have no serious violations", async ({ page }) => {
    const vehicle = await idOf("vehicles", "fleet_number = ?", ["MH-008"]);
    const [{ id: platform }] = await query<{ id: string }>(
      "select p.id from platforms p join organisations o on o.id = p.org_id where o.slug = ? order by p.make limit 1",
      ["mirrabel-health"],
    ) as [{ id: string }];
    for (const path of ["/vehicles", `/vehicles/${vehicle}`, `/vehicles/${vehicle}/edit`, "/vehicles/new", "/platforms", `/platforms/${platform}`, `/platforms/${platform}/edit`]) {
      await page.goto(path);
      await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
      if (path === "/vehicles") await expect(page.getByRole("region", { name: "Vehicles" })).toBeVisible();
      expect(await seriousViolations(page), path).toEqual([]);
    }
  });
});

test.describe("the register, as a driver", () => {
  test.use({ storageState: storageFor("driver") });

  test("shows only the driver's own vehicles, with no bulk actions or edit buttons", async ({ page }) => {
    const mine = await query<{ fleet_number: string }>(
      "select v.fleet_number from vehicles v join vehicle_drivers vd on vd.vehicle_id = v.id join users u on u.id = vd.user_id where u.email = ? order by v.fleet_number",
      ["driver@mirrabel-health.example"],
    );
    expect(mine.length).toBeGreaterThan(0);
    await page.goto("/vehicles");
    await expect(page.getByRole("heading", { name: "My vehicles" })).toBeVisible();
    await expect.poll(async () => columnValues(page, "Fleet no.")).toEqual(mine.map((m) => m.fleet_number));
    await expect(page.getByRole("checkbox")).toHaveCount(0);
    await expect(page.getByRole("link", { name: "Add vehicle" })).toHaveCount(0);
    await page.getByRole("link", { name: mine[0]!.fleet_number }).click();
    await expect(page.getByRole("heading", { name: mine[0]!.fleet_number, level: 1 })).toBeVisible();
    await expect(page.getByRole("link", { name: "Edit vehicle" })).toHaveCount(0);
    await expect(page.getByRole("button", { name: "Ground vehicle" })).toHaveCount(0);
    expect((await page.goto("/vehicles/new"))?.status()).toBe(403);
  });
});
