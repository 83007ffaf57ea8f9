import { expect, test as setup } from "@playwright/test";
import { ACCOUNTS, ROLE_NAMES, signIn, storageFor } from "./support";

// One signed-in browser state per role, reused by the specs.
for (const role of ROLE_NAMES) {
  setup(`sign in as ${role}`, async ({ page }) => {
    await signIn(page, ACCOUNTS[role]);
    await expect(page.getByTestId("current-user")).toBeVisible();
    await page.context().storageState({ path: storageFor(role) });
  });
}
