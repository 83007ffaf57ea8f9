import { expect, test } from "@playwright/test";
import { ACCOUNTS, ROLE_NAMES, signIn } from "./support";

const HOME_QUESTION = {
  admin: "Is everyone set up, and is mail getting through?",
  manager: "What needs my decision, and which vehicles are not ready?",
  finance: "What awaits my approval, and how is spend running?",
  contractor: "What do I owe whom, and by when?",
  driver: "Is my vehicle ready, and what did I report?",
} as const;

test.describe("sign-in and sign-out", () => {
  for (const role of ROLE_NAMES) {
    test(`${role} signs in to their own home page and signs out`, async ({ page }) => {
      await signIn(page, ACCOUNTS[role]);
      await expect(page.getByText(HOME_QUESTION[role])).toBeVisible();
      await page.getByRole("button", { name: "Sign out" }).click();
      await expect(page).toHaveURL(/\/sign-in\?signedOut=1/);
      await expect(page.getByText("You are signed out.")).toBeVisible();
      // The session is gone: the home page sends us back to sign in.
      await page.goto("/");
      await expect(page).toHaveURL(/\/sign-in/);
    });
  }

  test("a wrong password is refused with a plain message", async ({ page }) => {
    await signIn(page, ACCOUNTS.manager, "not-the-password");
    await expect(page.getByTestId("sign-in-status")).toContainText("do not match an active account");
    await expect(page.getByLabel("E-mail")).toHaveValue(ACCOUNTS.manager);
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("repeated failures for one e-mail are rate limited, even with the right password", async ({ page }) => {
    const email = "finance@gidgee-trust.example";
    for (let i = 0; i < 5; i++) {
      await signIn(page, email, `wrong-${i}`);
      await expect(page.getByTestId("sign-in-status")).toContainText("do not match");
    }
    await signIn(page, email);
    await expect(page.getByTestId("sign-in-status")).toContainText("Too many sign-in attempts");
    await page.goto("/");
    await expect(page).toHaveURL(/\/sign-in/);
  });
});
