import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import sharp from "sharp";
import { e2eDatabase, idOf, storageFor, waitForMail } from "./support";

// Drivers on a phone-sized screen (390 × 844), with and without signal. The flows are Rigline's
// own (the product brief's driver and defect flows); the accessibility scan uses axe-core's
// WCAG 2.1 A/AA rules.

const PHONE = { width: 390, height: 844 };

async function rows(sql: string, args: (string | number)[]) {
  const client = e2eDatabase();
  try {
    return (await client.execute({ sql, args })).rows;
  } finally {
    client.close();
  }
}

async function photo(): Promise<Buffer> {
  return sharp({ create: { width: 320, height: 240, channels: 3, background: "#9c3d23" } })
    .jpeg()
    .toBuffer();
}

/** Opens a driver page and waits until the service worker has kept the pages for no signal. */
async function openReadyOffline(page: Page, path: string) {
  await page.goto(path);
  await expect(page.getByTestId("offline-ready")).toContainText("Works without signal", { timeout: 20_000 });
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null), { timeout: 10_000 }).toBe(true);
}

test.describe("a driver on a phone", () => {
  test.use({ storageState: storageFor("driver"), viewport: PHONE, serviceWorkers: "allow" });

  test("files a defect with a photo without signal; it waits, then is sent exactly once when the signal returns", async ({ page, context }) => {
    const vehicleId = await idOf("vehicles", "fleet_number = ?", ["MH-001"]);
    await openReadyOffline(page, `/drive/${vehicleId}`);
    await expect(page.getByRole("heading", { name: "MH-001", exact: true })).toBeVisible();
    await expect(page.getByTestId("readiness-panel")).toBeVisible();

    await context.setOffline(true);
    await page.getByRole("main").getByRole("link", { name: "Report a defect", exact: true }).click();
    await expect(page.getByRole("heading", { name: "Report a defect" })).toBeVisible();
    await expect(page.getByTestId("signal-state")).toContainText("No signal");

    const description = `Bull bar bracket cracked on the left side ${Date.now()}`;
    await page.getByLabel(/^Watch/).check();
    await page.getByLabel("What is it about?").selectOption("body_glass");
    await page.getByLabel("What is wrong?").fill(description);
    await page.getByLabel("Odometer (km)").fill("48 350");
    await page.getByLabel("Take a photo").setInputFiles({ name: "bracket.jpg", mimeType: "image/jpeg", buffer: await photo() });
    await expect(page.getByRole("img", { name: "Photo 1" })).toBeVisible();
    await page.getByRole("button", { name: "Send report" }).click();

    await expect(page.getByTestId("defect-result")).toContainText("Saved on this phone");
    await expect(page.getByTestId("waiting-count")).toHaveText("Waiting to send: 1");
    expect(await rows("select id from defects where description = ?", [description])).toHaveLength(0);

    // The queued report survives a reload without signal (kept on the phone, page from the phone).
    await page.reload();
    await expect(page.getByTestId("waiting-count")).toHaveText("Waiting to send: 1");

    await context.setOffline(false);
    await expect(page.getByTestId("waiting-count")).toContainText("Nothing waiting", { timeout: 20_000 });
    const sent = await rows("select id, client_id, severity, odometer_km from defects where description = ?", [description]);
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatchObject({ severity: "watch", odometer_km: 48350 });
    const photos = await rows("select content_type from evidence where defect_id = ?", [String(sent[0]!.id)]);
    expect(photos).toEqual([expect.objectContaining({ content_type: "image/jpeg" })]);

    // Later flushes (the timer, another online event) never send it again.
    await page.evaluate(() => window.dispatchEvent(new Event("online")));
    await page.waitForTimeout(1500);
    expect(await rows("select id from defects where description = ?", [description])).toHaveLength(1);

    // The driver sees where it stands.
    await page.goto(`/drive/${vehicleId}`);
    await expect(page.getByTestId("my-report").filter({ hasText: "Bull bar bracket cracked" })).toContainText("Reported");
  });

  test("runs the pre-trip check and raises a defect from a fault in one tap", async ({ page }) => {
    const vehicleId = await idOf("vehicles", "fleet_number = ?", ["MH-001"]);
    const before = (await rows("select count(*) as n from pre_trip_checks where vehicle_id = ?", [vehicleId]))[0]!.n as number;
    await page.goto(`/drive/${vehicleId}/check`);
    await expect(page.getByRole("heading", { name: "Pre-trip check" })).toBeVisible();
    const items = page.locator("[data-testid^='check-item-']");
    const count = await items.count();
    expect(count).toBeGreaterThanOrEqual(8);
    for (let i = 0; i < count; i++) {
      const item = items.nth(i);
      const testId = await item.getAttribute("data-testid");
      if (testId === "check-item-general.lights") continue;
      await item.getByText("OK", { exact: true }).click();
    }
    const lights = page.getByTestId("check-item-general.lights");
    await lights.getByText("Fault", { exact: true }).click();
    await lights.getByLabel("What is wrong?").fill("Left brake light out");
    await lights.getByRole("button", { name: "Watch" }).click();
    await expect(page.getByTestId("raised-general.lights")).toContainText("Defect raised (Watch) — sent");
    await expect(page.getByTestId("check-progress")).toHaveText(`${count} of ${count} answered`);
    await page.getByRole("button", { name: "Finish check" }).click();
    await expect(page.getByTestId("check-result")).toContainText("Check sent");
    await expect(page.getByTestId("check-result")).toContainText("1 fault");

    const after = (await rows("select count(*) as n from pre_trip_checks where vehicle_id = ?", [vehicleId]))[0]!.n as number;
    expect(after).toBe(before + 1);
    const raised = await rows("select severity, category from defects where description = ?", ["Lights: Left brake light out"]);
    expect(raised).toEqual([expect.objectContaining({ severity: "watch", category: "lights_electrical" })]);
  });

  test("cannot open a vehicle that is not assigned to them", async ({ page }) => {
    const theirs = await idOf("vehicles", "fleet_number = ?", ["MH-002"]);
    const response = await page.goto(`/drive/${theirs}/defect`);
    expect(response?.status()).toBe(404);
  });

  test("driver screens have no serious accessibility violations", async ({ page }) => {
    const vehicleId = await idOf("vehicles", "fleet_number = ?", ["MH-001"]);
    for (const path of ["/drive", `/drive/${vehicleId}`, `/drive/${vehicleId}/defect`, `/drive/${vehicleId}/check`]) {
      await page.goto(path);
      await expect(page.getByTestId("offline-support")).toBeVisible();
      const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
      const serious = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${path} ${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
      expect(serious).toEqual([]);
    }
  });
});

test.describe("a stop defect", () => {
  test("grounds the vehicle at once, the managers get the e-mail, and a manager returns it to service with a reason", async ({ browser }) => {
    const vehicleId = await idOf("vehicles", "fleet_number = ?", ["MH-003"]);
    const driverContext = await browser.newContext({ storageState: storageFor("driver"), viewport: PHONE });
    const driver = await driverContext.newPage();
    await driver.goto(`/drive/${vehicleId}/defect`);
    await driver.getByLabel(/^Stop — do not drive/).check();
    await driver.getByLabel("What is it about?").selectOption("brakes");
    await driver.getByLabel("What is wrong?").fill("Brake pedal sinks to the floor at the gate");
    await driver.getByRole("button", { name: "Send — ground the vehicle" }).click();
    await expect(driver.getByTestId("defect-result")).toContainText("Sent");
    await expect(driver.getByTestId("grounded-notice")).toContainText("MH-003 is now grounded");
    expect((await rows("select state from vehicles where id = ?", [vehicleId]))[0]).toMatchObject({ state: "grounded" });

    for (const manager of ["manager@mirrabel-health.example", "manager2@mirrabel-health.example"]) {
      const mail = await waitForMail(manager, "Stop defect: MH-003 is grounded");
      expect(mail.text).toContain("Brake pedal sinks to the floor at the gate");
      expect(mail.text).toContain("/defects/");
    }
    await driver.goto(`/drive/${vehicleId}`);
    await expect(driver.getByTestId("grounded-banner")).toContainText("Grounded — do not drive");
    await expect(driver.getByTestId("readiness-panel")).toContainText("Not ready");
    await driverContext.close();

    const defectId = await idOf("defects", "vehicle_id = ? and description = ?", [vehicleId, "Brake pedal sinks to the floor at the gate"]);
    const managerContext = await browser.newContext({ storageState: storageFor("manager") });
    const manager = await managerContext.newPage();
    await manager.goto("/defects?state=open&severity=stop");
    await manager.getByRole("link", { name: "Brakes" }).first().click();
    await expect(manager).toHaveURL(new RegExp(`/defects/${defectId}`));
    await expect(manager.getByTestId("vehicle-grounded")).toContainText("MH-003 is grounded");

    await manager.getByRole("button", { name: "Mark as triaged" }).click();
    await expect(manager.locator("[data-state=triaged]")).toBeVisible();
    await expect(manager.getByRole("button", { name: "Link and start repair" })).toBeVisible();

    // Returning to service needs a reason.
    await manager.getByRole("button", { name: "Return to service" }).click();
    await expect(manager.getByTestId("return-status")).toContainText("Some fields need attention");
    await expect(manager.getByText("Give the reason for returning the vehicle to service")).toBeVisible();
    await manager.getByLabel("Why is it safe to drive?").fill("Master cylinder replaced at the depot; brakes tested on the yard");
    await manager.getByRole("button", { name: "Return to service" }).click();
    await expect(manager.getByTestId("vehicle-grounded")).toHaveCount(0);
    expect((await rows("select state from vehicles where id = ?", [vehicleId]))[0]).toMatchObject({ state: "in_service" });
    const audit = await rows("select reason from audit_entries where entity_id = ? and action = 'vehicle.return_to_service'", [vehicleId]);
    expect(audit[0]).toMatchObject({ reason: "Master cylinder replaced at the depot; brakes tested on the yard" });

    await manager.getByLabel("Why close it?").fill("Repaired under the depot's own work; no job needed");
    await manager.getByRole("button", { name: "Close", exact: true }).click();
    await expect(manager.locator("[data-state=closed]")).toBeVisible();
    expect((await rows("select state from defects where id = ?", [defectId]))[0]).toMatchObject({ state: "closed" });
    await managerContext.close();
  });
});
