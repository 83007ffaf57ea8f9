import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { ROLE_NAMES, storageFor } from "./support";

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`);
}

// axe-core scan (WCAG 2.1 A/AA rules): no serious or critical violations.
test("the sign-in page has no serious accessibility violations", async ({ page }) => {
  await page.goto("/sign-in");
  expect(await seriousViolations(page)).toEqual([]);
});

for (const role of ROLE_NAMES) {
  test.describe(`${role} home page`, () => {
    test.use({ storageState: storageFor(role) });
    test("has no serious accessibility violations", async ({ page }) => {
      await page.goto("/");
      await expect(page.getByTestId("current-user")).toBeVisible();
      expect(await seriousViolations(page)).toEqual([]);
    });
  });
}
