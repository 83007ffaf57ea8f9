import { expect, test, type Browser, type Page } from "@playwright/test";
import sharp from "sharp";
import { e2eDatabase, idOf, signIn, storageFor, waitForMail } from "./support";

const CONTRACTOR_A = "contractor@tallowbark-fitout.example";
const CONTRACTOR_B = "contractor@spindleflat-4x4.example";
const FIRM_A = "Tallowbark Fit-Out Workshop";
const FIRM_B = "Spindle Flat 4x4 Works";

/** Vehicles of the first organisation on an edition with no demo job on them, by fleet number. */
async function freeVehicles(): Promise<{ id: string; fleetNumber: string }[]> {
  const client = e2eDatabase();
  try {
    const result = await client.execute(
      "select v.id, v.fleet_number from vehicles v join organisations o on o.id = v.org_id where o.slug = 'mirrabel-health' and v.edition_id is not null and v.state != 'retired' and v.id not in (select vehicle_id from jobs) order by v.fleet_number limit 12",
    );
    return result.rows.map((row) => ({ id: String(row.id), fleetNumber: String(row.fleet_number) }));
  } finally {
    client.close();
  }
}

async function sql(query: string, args: (string | number)[] = []) {
  const client = e2eDatabase();
  try {
    return (await client.execute({ sql: query, args })).rows;
  } finally {
    client.close();
  }
}

async function asUser(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email);
  await expect(page).not.toHaveURL(/sign-in/);
  return page;
}

/** A picture of plain shapes with a GPS position in its EXIF, as a phone would add. */
const photoWithLocation = () =>
  sharp({ create: { width: 120, height: 80, channels: 3, background: { r: 170, g: 85, b: 40 } } })
    .jpeg()
    .withExif({ IFD3: { GPSLatitudeRef: "S", GPSLatitude: "23/1 42/1 0/1", GPSLongitudeRef: "E", GPSLongitude: "133/1 52/1 0/1" } })
    .toBuffer();
const pdfTicket = () => Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n", "latin1");

async function fillQuote(page: Page, prices: string[]) {
  const rows = page.getByTestId("quote-line");
  const count = await rows.count();
  for (let i = 0; i < count; i++) await page.getByLabel(`Line ${i + 1} unit price`).fill(prices[i] ?? "100.00");
  const validUntil = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  await page.getByLabel("Valid until").fill(validUntil);
  await expect(page.getByTestId("gst-method")).toContainText("rounded to the nearest cent");
  await page.getByRole("button", { name: "Save and submit" }).click();
  // Once submitted the quote is shown read-only, with its total.
  await expect(page.getByTestId("quote-state")).toHaveText("Submitted");
  await expect(page.getByRole("heading", { name: "History" })).toBeVisible();
}

/** Lodges one piece per evidence kind each spec line needs, typing in what its criteria ask for. */
async function lodgeForEveryLine(page: Page) {
  const lineSelect = page.getByLabel("For line");
  const options = await lineSelect.locator("option").evaluateAll((els) => els.map((e) => ({ value: (e as HTMLOptionElement).value, text: e.textContent ?? "" })));
  for (const option of options.filter((o) => o.value)) {
    await lineSelect.selectOption(option.value);
    const hintBox = page.locator("#evidence-kind-hint");
    const hint = (await hintBox.count()) > 0 ? ((await hintBox.textContent()) ?? "") : "";
    const kinds = hint.includes("needs:") ? hint.split("needs:")[1]!.split(",").map((k) => k.trim().replace(" ", "_")) : ["photo"];
    for (const kind of kinds) {
      await page.getByLabel("Kind of evidence").selectOption(kind);
      for (const input of await page.locator('input[name^="attr."]').all()) {
        const standard = (await page.locator(`[id="${await input.getAttribute("id")}-hint"]`).textContent({ timeout: 5_000 })) ?? "";
        const value = standard.replace(/^Standard: \S+ /, "").split("–")[0]!.trim();
        await input.fill(value);
      }
      const isPhoto = kind === "photo";
      await page.getByLabel("File").setInputFiles(isPhoto ? { name: "fitted.jpg", mimeType: "image/jpeg", buffer: await photoWithLocation() } : { name: `${kind}.pdf`, mimeType: "application/pdf", buffer: pdfTicket() });
      await page.getByRole("button", { name: "Upload evidence" }).click();
      await expect(page.getByTestId("evidence-upload-status")).toContainText("Evidence lodged");
    }
  }
}

test.describe("a job from variance to the ledger, across roles", () => {
  test("manager raises and offers, two workshops quote, finance approves, evidence is lodged and accepted, the cost is booked", async ({ browser }) => {
    test.setTimeout(240_000);
    const manager = await (await browser.newContext({ storageState: storageFor("manager") })).newPage();
    // The first vehicle whose gaps include two lines that can start now.
    let found: { id: string; fleetNumber: string } | undefined;
    for (const candidate of await freeVehicles()) {
      // As a manager would: the vehicle's Jobs tab, then "Raise a job from its gaps".
      await manager.goto(`/vehicles/${candidate.id}/jobs`);
      await manager.getByRole("link", { name: "Raise a job from its gaps" }).click();
      await expect(manager.getByRole("heading", { name: "Raise a job" })).toBeVisible();
      if ((await manager.getByTestId("gap-line").filter({ hasText: "Can start now" }).count()) >= 2) {
        found = candidate;
        break;
      }
    }
    if (!found) throw new Error("no demo vehicle has two gaps that can start now");
    const vehicle = found;
    let jobId = "";
    let jobNumber = "";

    await test.step("the manager raises a job from the vehicle's gaps", async () => {
      await expect(manager).toHaveURL(new RegExp(`/jobs/new\\?vehicleId=${vehicle.id}$`));
      const startable = manager.getByTestId("gap-line").filter({ hasText: "Can start now" });
      await expect(startable.first()).toBeVisible();
      expect(await startable.count()).toBeGreaterThanOrEqual(2);
      for (const row of (await startable.all()).slice(0, 2)) await row.getByRole("checkbox").check();
      await manager.getByLabel("Title").fill(`Close the gaps on ${vehicle.fleetNumber}`);
      await manager.getByLabel("Other work").fill("Check and tighten the roof rack mounts");
      await manager.getByRole("button", { name: "Raise the job" }).click();
      await expect(manager).toHaveURL(/\/jobs\/[0-9a-f-]{36}$/, { timeout: 15_000 });
      jobId = manager.url().split("/").pop()!;
      await expect(manager.getByTestId("job-state")).toHaveText("Open");
      await expect(manager.getByTestId("job-line")).toHaveCount(3);
      jobNumber = String((await sql("select number from jobs where id = ?", [jobId]))[0]!.number);
    });

    await test.step("the manager offers it to two workshops with a due date", async () => {
      const offer = manager.getByRole("form", { name: "Offer to workshops" });
      await offer.getByLabel(FIRM_A).check();
      await offer.getByLabel(FIRM_B).check();
      await offer.getByLabel("Quotes due by").fill(new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10));
      await offer.getByRole("button", { name: "Send the offer" }).click();
      await expect(manager.getByTestId("offer-status")).toContainText("Offered to 2 workshops");
      await expect(manager.getByTestId("job-state")).toHaveText("Out for quotes");
      await waitForMail(CONTRACTOR_A, `Job ${jobNumber} (${vehicle.fleetNumber}) offered`);
      await waitForMail(CONTRACTOR_B, `Job ${jobNumber} (${vehicle.fleetNumber}) offered`);
    });

    const contractorA = await (await browser.newContext({ storageState: storageFor("contractor") })).newPage();
    const contractorB = await asUser(browser, CONTRACTOR_B);

    await test.step("each contractor finds the job in their queue and quotes it", async () => {
      for (const [page, prices] of [
        [contractorA, ["2,500.00", "2,200.00", "300.00"]],
        [contractorB, ["2,900.00", "2,600.00", "350.00"]],
      ] as const) {
        await page.goto("/jobs");
        await page.getByRole("link", { name: `Close the gaps on ${vehicle.fleetNumber}` }).click();
        await page.getByRole("button", { name: "Start a quote" }).click();
        await expect(page).toHaveURL(/\/quotes\//);
        await fillQuote(page, [...prices]);
        await expect(page.getByTestId("quote-state")).toHaveText("Submitted");
      }
      await waitForMail("manager@mirrabel-health.example", `Quote from ${FIRM_A} for Job ${jobNumber}`);
      await waitForMail("manager@mirrabel-health.example", `Quote from ${FIRM_B} for Job ${jobNumber}`);
    });

    await test.step("a contractor cannot open the other firm's quote", async () => {
      const otherQuote = await idOf("quotes", "job_id = ? and firm_id = (select id from contractor_firms where name = ?)", [jobId, FIRM_B]);
      const response = await contractorA.goto(`/quotes/${otherQuote}`);
      expect(response?.status()).toBe(404);
      expect((await contractorA.request.get(`/api/quotes/${otherQuote}`)).status()).toBe(404);
      const api = await contractorA.request.get(`/api/quotes?jobId=${jobId}`);
      const items = ((await api.json()) as { items: { firmName: string }[] }).items;
      expect(items.map((q) => q.firmName)).toEqual([FIRM_A]);
    });

    await test.step("the manager compares and accepts the quote above the threshold: it waits for finance", async () => {
      await manager.goto(`/jobs/${jobId}`);
      await expect(manager.getByTestId("quote-compare")).toContainText(FIRM_A);
      await expect(manager.getByTestId("quote-compare")).toContainText(FIRM_B);
      // Tallowbark: $5,000.00 + labour, above the $5,000.00 threshold once GST is added
      await manager.getByRole("button", { name: `Accept ${FIRM_A}` }).click();
      await expect(manager.getByTestId("quote-compare")).toContainText("Awaiting finance");
      await expect(manager.getByTestId("job-state")).toHaveText("Out for quotes");
      await waitForMail("finance@mirrabel-health.example", `for Job ${jobNumber} (${vehicle.fleetNumber})`);
    });

    await test.step("finance approves in the approvals queue; the job is awarded", async () => {
      const finance = await (await browser.newContext({ storageState: storageFor("finance") })).newPage();
      await finance.goto("/approvals");
      const item = finance.getByTestId("approval-item").filter({ hasText: `Job ${jobNumber}:` });
      await item.getByRole("button", { name: "Approve" }).click();
      await expect(item).toHaveCount(0);
      await manager.reload();
      await expect(manager.getByTestId("job-state")).toHaveText("Awarded");
      await waitForMail(CONTRACTOR_A, `Your quote for Job ${jobNumber} (${vehicle.fleetNumber}): accepted`);
      await waitForMail(CONTRACTOR_B, `Your quote for Job ${jobNumber} (${vehicle.fleetNumber}): declined`);
    });

    const before = await sql("select measured_gross_kg from vehicles where id = ?", [vehicle.id]);

    await test.step("the awarded contractor lodges photos and a weighbridge ticket with its axle masses", async () => {
      await contractorA.goto(`/jobs/${jobId}`);
      await contractorA.getByRole("button", { name: "Start the work" }).click();
      await expect(contractorA.getByTestId("job-state")).toHaveText("In the workshop");
      await lodgeForEveryLine(contractorA);
      await contractorA.getByLabel("For line").selectOption("");
      await contractorA.getByLabel("Kind of evidence").selectOption("weighbridge_ticket");
      await contractorA.getByLabel("Ticket number").fill("WB-77120");
      await contractorA.getByLabel("Front axle (kg)").fill("1420");
      await contractorA.getByLabel("Rear axle (kg)").fill("1710");
      await contractorA.getByLabel("Gross (kg)").fill("3130");
      await contractorA.getByLabel("File").setInputFiles({ name: "ticket.pdf", mimeType: "application/pdf", buffer: pdfTicket() });
      await contractorA.getByRole("button", { name: "Upload evidence" }).click();
      await expect(contractorA.getByTestId("evidence-upload-status")).toContainText("Evidence lodged");
      await expect(contractorA.getByTestId("ticket-masses")).toContainText("gross 3130 kg");
      await contractorA.getByRole("button", { name: "Work done: evidence is lodged" }).click();
      await expect(contractorA.getByTestId("job-state")).toHaveText("Evidence lodged");
      await waitForMail("manager@mirrabel-health.example", `Evidence lodged for Job ${jobNumber}`);
    });

    await test.step("the served photo has no location left in it", async () => {
      const photoId = await idOf("evidence", "job_id = ? and kind = 'photo'", [jobId]);
      const response = await manager.request.get(`/api/evidence/${photoId}/file`);
      expect(response.status()).toBe(200);
      const bytes = await response.body();
      const meta = await sharp(bytes).metadata();
      expect(meta.exif).toBeUndefined();
      expect((await contractorB.request.get(`/api/evidence/${photoId}/file`)).status()).toBe(404);
    });

    await test.step("the manager rejects one piece with a reason; the contractor hears of it and lodges again", async () => {
      await manager.goto(`/jobs/${jobId}`);
      const first = manager.getByTestId("evidence-item").filter({ hasText: "fitted.jpg" }).first();
      await first.getByLabel("Why it is rejected").fill("The brand plate is not readable");
      await first.getByRole("button", { name: "Reject" }).click();
      const rejected = manager.getByTestId("evidence-item").filter({ hasText: "The brand plate is not readable" });
      await expect(rejected.getByTestId("evidence-state")).toHaveText("Rejected");
      await waitForMail(CONTRACTOR_A, `Evidence rejected for Job ${jobNumber}`);
      await contractorA.goto(`/jobs/${jobId}`);
      await lodgeForEveryLine(contractorA);
    });

    await test.step("the manager accepts the rest: the lines meet, the masses are measured", async () => {
      await manager.goto(`/jobs/${jobId}`);
      for (let guard = 0; guard < 20; guard++) {
        const accept = manager.getByRole("button", { name: "Accept", exact: true });
        const left = await accept.count();
        if (left === 0) break;
        await accept.first().click();
        await expect(accept).toHaveCount(left - 1);
      }
      const specLines = manager.getByTestId("job-line").filter({ has: manager.getByTestId("line-status") });
      await expect(specLines).toHaveCount(2);
      for (const row of await specLines.all()) await expect(row.getByTestId("line-status")).toHaveText("Meets");
      await expect(manager.getByTestId("measured-mass")).toContainText(/3,130\skg/);
      const after = await sql("select measured_front_kg, measured_rear_kg, measured_gross_kg from vehicles where id = ?", [vehicle.id]);
      expect(after[0]).toMatchObject({ measured_front_kg: 1420, measured_rear_kg: 1710, measured_gross_kg: 3130 });
      expect(before[0]?.measured_gross_kg).not.toBe(3130);
    });

    await test.step("signing off books the cost in the ledger", async () => {
      await manager.getByRole("button", { name: "Sign off and book the cost" }).click();
      await expect(manager.getByTestId("job-state")).toHaveText("Signed off");
      const booked = await sql("select amount_ex_gst_cents, gst_cents, cost_centre, source from costs where job_id = ?", [jobId]);
      expect(booked).toHaveLength(1);
      const quote = await sql("select subtotal_cents, gst_cents from quotes where job_id = ? and status = 'accepted'", [jobId]);
      expect(booked[0]).toMatchObject({ amount_ex_gst_cents: quote[0]!.subtotal_cents, gst_cents: quote[0]!.gst_cents, source: "job" });
      await waitForMail("finance@mirrabel-health.example", `Job ${jobNumber} (${vehicle.fleetNumber}) signed off`);
    });
  });
});

test.describe("who may reach quotes", () => {
  test.use({ storageState: storageFor("driver") });

  test("a driver cannot reach quotes or the jobs list", async ({ page, request }) => {
    expect((await page.goto("/quotes"))?.status()).toBe(403);
    await expect(page.getByRole("heading", { name: "Your role cannot open this page" })).toBeVisible();
    expect((await request.get("/api/quotes")).status()).toBe(403);
    await expect(page.getByRole("link", { name: "Jobs" })).toHaveCount(0);
  });
});

test.describe("finance", () => {
  test.use({ storageState: storageFor("finance") });

  test("cannot change quote lines", async ({ request }) => {
    const quoteId = await idOf("quotes", "status = 'submitted'", []);
    const response = await request.patch(`/api/quotes/${quoteId}`, { data: { lines: [] } });
    expect(response.status()).toBe(403);
  });
});
