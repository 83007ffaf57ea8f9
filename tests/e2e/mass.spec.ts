import { readFile } from "node:fs/promises";
import { expect, test, type Page } from "@playwright/test";
import { idOf, storageFor } from "./support";

// MH-038 (a Marrak Outback 300 wagon) carries no standard yet, so nothing else moves its figures.
const FLEET = "MH-038";

async function recordFigures(page: Page) {
  // Wait until the server has confirmed the figures the browser computed.
  await expect(page.getByText("Figures of record, checked by the server.")).toBeVisible();
  const front = Number(await page.getByTestId("axle-front").getAttribute("data-value"));
  const rear = Number(await page.getByTestId("axle-rear").getAttribute("data-value"));
  const binding = page.getByTestId("binding-limit");
  return { front, rear, limit: await binding.getAttribute("data-limit"), text: (await binding.textContent()) ?? "" };
}

async function addPlannedItem(page: Page, label: string, massKg: string) {
  const form = page.getByRole("form", { name: "Add a planned item" });
  await form.getByLabel("Item").fill(label);
  await form.getByLabel("Mass (kg)").fill(massKg);
  await form.getByLabel("Where it sits").selectOption({ label: "Rear overhang" });
  await form.getByRole("button", { name: "Add to plan" }).click();
  await expect(page.getByTestId("planned-item").filter({ hasText: label })).toBeVisible();
  await expect(form.getByLabel("Item")).toHaveValue("");
}

test.describe("the mass planner", () => {
  test.use({ storageState: storageFor("manager") });

  test("a rear bar with a second spare makes the rear axle bind and lightens the front; the statement downloads", async ({ page }) => {
    test.setTimeout(90_000);
    const id = await idOf("vehicles", "fleet_number = ?", [FLEET]);
    const response = await page.goto(`/vehicles/${id}/mass`);
    expect(response?.status()).toBe(200);
    await expect(page.getByRole("heading", { name: "How much can it still carry?" })).toBeVisible();
    await expect(page.getByRole("note", { name: "Caution" }).first()).toContainText("certified weighbridge");

    // A loaded touring trip with nobody aboard yet: 600 kg of gear in the tub.
    const loading = page.getByRole("form", { name: "Loading" });
    await loading.getByLabel("Occupants").fill("0");
    await loading.getByLabel("Cargo allowance (kg)").fill("600");
    const before = await recordFigures(page);
    expect(before.limit).toBe("front");

    await addPlannedItem(page, "Rear bar with wheel carrier", "60");
    await addPlannedItem(page, "Second spare wheel", "40");

    const after = await recordFigures(page);
    expect(after.limit).toBe("rear");
    expect(after.text).toContain("Binding limit: Rear axle");
    // Mass far behind the rear axle loads the rear by more than its own weight and lifts the front.
    expect(after.front).toBeLessThan(before.front);
    expect(after.rear - before.rear).toBeGreaterThan(100);
    await expect(page.getByTestId("check-rear").getByText("Binding")).toBeVisible();
    await expect(page.getByRole("img", { name: `Side view of ${FLEET} with its loads` })).toBeVisible();

    // The printable statement of these figures.
    const downloading = page.waitForEvent("download");
    await page.getByRole("link", { name: "Download statement (PDF)" }).click();
    const download = await downloading;
    expect(download.suggestedFilename()).toBe(`mass-statement-${FLEET}.pdf`);
    const pdf = await readFile((await download.path())!);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pdf.toString("latin1")).toContain(FLEET);

    // Leave the demo vehicle as it was.
    for (const label of ["Rear bar with wheel carrier", "Second spare wheel"]) {
      await page.getByRole("button", { name: `Remove ${label} from the plan` }).click();
      await expect(page.getByTestId("planned-item").filter({ hasText: label })).toHaveCount(0);
    }
  });
});
