import { expect, test } from "@playwright/test";
import { e2eDatabase, idOf, storageFor } from "./support";

// MH-034 fully meets edition 1 of the demo's "Remote duty fit-out" and no other spec touches it.
const FLEET = "MH-034";

async function editionId(number: number): Promise<string> {
  const client = e2eDatabase();
  try {
    const result = await client.execute({
      sql: "select e.id from editions e join standards s on s.id = e.standard_id where s.name = 'Remote duty fit-out' and e.number = ?",
      args: [number],
    });
    return String(result.rows[0]!.id);
  } finally {
    client.close();
  }
}

test.describe("a fleet manager", () => {
  test.use({ storageState: storageFor("manager") });

  test("adds a line to the draft, publishes it, rolls it out to a vehicle and sees its variance change", async ({ page }) => {
    test.setTimeout(90_000);
    const vehicleId = await idOf("vehicles", "fleet_number = ?", [FLEET]);

    // Before: the vehicle is on edition 1.
    await page.goto(`/vehicles/${vehicleId}/spec`);
    await expect(page.getByRole("heading", { name: "Against Remote duty fit-out, edition 1" })).toBeVisible();
    const shortBefore = Number(await page.getByTestId("count-short").locator("dd").textContent());

    // The draft edition 2, from the standards pages.
    await page.goto("/standards");
    await page.getByRole("link", { name: "Remote duty fit-out" }).click();
    await page.getByRole("link", { name: "Edition 2" }).click();
    await expect(page.getByTestId("edition-status")).toHaveText("Draft");

    // Add a line, with a criterion and a cost in dollars.
    const form = page.getByRole("form", { name: "Add a line" });
    await form.getByRole("textbox", { name: "Code", exact: true }).fill("CM-06");
    await form.getByLabel("What the line asks for").fill("Satellite phone for the clinic team");
    await form.getByLabel("Category").selectOption({ label: "Communications" });
    await form.getByLabel("Requirement").selectOption({ label: "Must fit" });
    await form.getByLabel("Mass (kg, each)").fill("0.4");
    await form.getByLabel("Or zone").selectOption({ label: "Cab" });
    await form.getByRole("button", { name: "Add a criterion" }).click();
    await form.getByLabel("Attribute", { exact: true }).fill("batteryHours");
    await form.getByLabel("Test", { exact: true }).selectOption({ label: "at least (≥)" });
    await form.getByLabel("Value", { exact: true }).fill("30");
    await form.getByLabel("Unit", { exact: true }).fill("h");
    await form.getByLabel("Standard cost (AUD, whole line)").fill("1,290.00");
    await form.getByRole("button", { name: "Add line" }).click();
    const row = page.getByTestId("line-CM-06");
    await expect(row).toContainText("Satellite phone for the clinic team");
    await expect(row).toContainText("batteryHours ≥ 30 h");
    await expect(row).toContainText("$1,290.00");

    // Publish: the edition is frozen, and the roll-out panel appears.
    await page.getByRole("button", { name: "Publish edition 2" }).click();
    await expect(page.getByTestId("edition-status")).toHaveText("Published");
    await expect(page.getByRole("button", { name: "Edit CM-06" })).toHaveCount(0);

    // Preview the roll-out to one vehicle, then confirm it.
    await page.getByLabel("Find vehicles").fill(FLEET);
    await page.getByLabel(new RegExp(`^${FLEET}`)).check();
    await page.getByRole("button", { name: "Preview roll-out to 1 vehicle" }).click();
    const preview = page.getByTestId("rollout-preview");
    await expect(preview).toContainText("CM-06 Satellite phone for the clinic team");
    await expect(preview).toContainText("CM-03 HF radio");
    await page.getByRole("button", { name: "Confirm: assign edition 2 to 1 vehicle" }).click();
    await expect(page.getByTestId("rollout-confirm-status")).toContainText("Edition 2 assigned to 1 vehicle");

    // After: the Spec check tab judges the vehicle against edition 2; the new line is short.
    await page.goto(`/vehicles/${vehicleId}/spec`);
    await expect(page.getByRole("heading", { name: "Against Remote duty fit-out, edition 2" })).toBeVisible();
    await expect(page.getByTestId("spec-line-CM-06")).toHaveAttribute("data-status", "short");
    await expect(page.getByTestId("spec-line-CM-03")).toHaveAttribute("data-status", "short");
    const shortAfter = Number(await page.getByTestId("count-short").locator("dd").textContent());
    // Edition 2 adds three must-fit lines this vehicle lacks: CM-03 (now required), SF-07, CM-06.
    expect(shortAfter).toBe(shortBefore + 3);
    await expect(page.getByTestId("spec-line-RC-01")).toHaveAttribute("data-status", "off_spec");
  });

  test("the published edition refuses a new line with 409", async ({ page }) => {
    const response = await page.request.post(`/api/editions/${await editionId(1)}/lines`, {
      data: { code: "X-01", title: "Anything", category: "safety", requirement: "must_fit", quantity: 1, massKg: 0, massKind: "constant", standardCostCents: 0 },
    });
    expect(response.status()).toBe(409);
    expect((await response.json()).error.code).toBe("conflict");
  });
});

for (const role of ["driver", "contractor"] as const) {
  test.describe(`a ${role}`, () => {
    test.use({ storageState: storageFor(role) });

    test("cannot open the standards pages (403) nor change an edition through the API (403)", async ({ page }) => {
      const response = await page.goto("/standards");
      expect(response?.status()).toBe(403);
      await expect(page.getByRole("heading", { name: "Your role cannot open this page" })).toBeVisible();
      await expect(page.getByRole("link", { name: "Standards" })).toHaveCount(0);

      const draft = await editionId(1);
      const publish = await page.request.post(`/api/editions/${draft}/publish`);
      expect(publish.status()).toBe(403);
      expect((await publish.json()).error.code).toBe("forbidden");
      const line = await page.request.post(`/api/editions/${draft}/lines`, { data: { code: "X-01", title: "Anything" } });
      expect(line.status()).toBe(403);
      const rollout = await page.request.post(`/api/editions/${draft}/rollout`, { data: { vehicleIds: ["x"], dryRun: true } });
      expect(rollout.status()).toBe(403);
    });
  });
}
