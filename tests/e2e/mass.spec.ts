import { readFile } from "node:fs/promises";
import { expect, test, type Page } from "@playwright/test";
import { idOf, storageFor } from "./support";

// MH-038 (a Marrak Outback 300 wagon) carries no standard yet, so nothing else moves its figures.
const FLEET = "MH-038";
// MH-037 (a Corvane Trailhand 79) is used by no other browser test: its ticket and 12 V plan are this file's own.
const RECORDS_FLEET = "MH-037";

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

    // Two aboard and 260 kg of gear in the back: the front-heavy wagon's front axle binds first
    // (demo figures: front 1,800 kg rating, 1,390 kg kerb front plus 65 % of the two occupants).
    const loading = page.getByRole("form", { name: "Loading" });
    await loading.getByLabel("Occupants").fill("2");
    await loading.getByLabel("Cargo allowance (kg)").fill("260");
    const before = await recordFigures(page);
    expect(before.limit).toBe("front");
    expect(before.text).toContain("Binding limit: Front axle");

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

  test("a ticket is recorded with its file, and the 12 V plan saved stays after a reload", async ({ page }) => {
    test.setTimeout(90_000);
    const id = await idOf("vehicles", "fleet_number = ?", [RECORDS_FLEET]);
    expect((await page.goto(`/vehicles/${id}/mass`))?.status()).toBe(200);

    // A weighbridge ticket with its PDF (an invented ticket; the figures add up).
    const ticketPdf = Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n", "latin1");
    const ticket = page.getByRole("form", { name: "Record a weighbridge ticket" });
    await ticket.getByLabel("Ticket number").fill("E2E-5521");
    await ticket.getByLabel("Front axle (kg)").fill("1420");
    await ticket.getByLabel("Rear axle (kg)").fill("1090");
    await ticket.getByLabel("Gross (kg)").fill("2510");
    await ticket.getByLabel("Ticket file (optional)").setInputFiles({ name: "ticket-5521.pdf", mimeType: "application/pdf", buffer: ticketPdf });
    await ticket.getByRole("button", { name: "Record ticket" }).click();
    await expect(page.getByTestId("ticket-status")).toContainText("Ticket E2E-5521 recorded");
    const link = page.getByTestId("ticket-file").filter({ hasText: "ticket-5521.pdf" });
    await expect(link).toBeVisible();
    const downloading = page.waitForEvent("download");
    await link.click();
    const download = await downloading;
    expect(download.suggestedFilename()).toBe("ticket-5521.pdf");
    expect((await readFile((await download.path())!)).equals(ticketPdf)).toBe(true);

    // The 12 V plan: three days away and a hungrier fridge, saved.
    await page.getByLabel("Days of autonomy").fill("3");
    await page.locator("#consumer-0-a").fill("5");
    await expect(page.getByTestId("battery-result")).toContainText("for 3 days");
    await expect(page.getByRole("note", { name: "Caution" }).filter({ hasText: "Wiring follows" })).toBeVisible();
    await page.getByRole("button", { name: "Save 12 V plan" }).click();
    await expect(page.getByTestId("electrical-plan-status")).toContainText("12 V plan saved");
    await expect(page.getByTestId("electrical-plan-saved").first()).toHaveText("Saved");

    await page.reload();
    await expect(page.getByLabel("Days of autonomy")).toHaveValue("3");
    await expect(page.locator("#consumer-0-a")).toHaveValue("5");
    await expect(page.getByTestId("electrical-plan-saved").first()).toHaveText("Saved");
    await expect(page.getByTestId("ticket-file").filter({ hasText: "ticket-5521.pdf" })).toBeVisible();
  });
});
