import { expect, test, type Page } from "@playwright/test";
import { storageFor } from "./support";

test.use({ storageState: storageFor("manager") });

async function statValue(page: Page, label: string): Promise<number> {
  // The figures sit at the top of the page, before any status pill with the same word.
  const stat = page.getByText(label, { exact: true }).first().locator("xpath=..");
  const text = (await stat.textContent()) ?? "";
  const match = /(\d[\d,]*)/.exec(text.replace(label, ""));
  expect(match, `a number in the "${label}" figure`).not.toBeNull();
  return Number(match![1]!.replace(/,/g, ""));
}

async function registerTotal(page: Page, query: string): Promise<number> {
  await page.goto(`/vehicles?${query}`);
  const count = page.getByTestId("register-count");
  await expect(count).not.toHaveText("Loading vehicles…");
  const text = (await count.textContent()) ?? "";
  if (text.startsWith("No vehicles")) return 0;
  return Number(/of (\d+) vehicle/.exec(text)![1]);
}

test("the manager's home page counts match the register", async ({ page }) => {
  await page.goto("/");
  const grounded = await statValue(page, "Grounded");
  const ready = await statValue(page, "Ready for remote duty");
  expect(await registerTotal(page, "state=grounded")).toBe(grounded);
  expect(await registerTotal(page, "readiness=ready")).toBe(ready);
});
