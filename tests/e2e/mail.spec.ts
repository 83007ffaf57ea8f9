import { expect, test } from "@playwright/test";
import { linkIn, signIn, storageFor, waitForMail } from "./support";

test.describe("invitations, password resets and deactivation", () => {
  test("an invited person gets the e-mail, sets a password through its link, signs in; deactivation ends their session", async ({ browser }) => {
    const adminContext = await browser.newContext({ storageState: storageFor("admin") });
    const admin = await adminContext.newPage();
    await admin.goto("/admin/users");
    const invite = admin.getByRole("form", { name: "Invite someone" });
    await invite.getByLabel("Name").fill("Wren Holloway");
    await invite.getByLabel("E-mail").fill("wren.holloway@mirrabel-health.example");
    await invite.getByLabel("Role").selectOption("driver");
    await invite.getByRole("button", { name: "Send invitation" }).click();
    await expect(admin.getByTestId("invite-status")).toContainText("Invitation sent to wren.holloway@mirrabel-health.example");

    const mail = await waitForMail("wren.holloway@mirrabel-health.example", "invited");
    expect(mail.html).toContain("Choose your password");
    const link = linkIn(mail.text, "/password/");

    // The admin also sees it in the development mailbox.
    await admin.goto("/admin/mailbox");
    await expect(admin.getByTestId("mailbox-message").filter({ hasText: "wren.holloway@" }).first()).toBeVisible();

    const inviteeContext = await browser.newContext();
    const invitee = await inviteeContext.newPage();
    await invitee.goto(new URL(link).pathname);
    await expect(invitee.getByRole("heading", { name: "Welcome to Rigline" })).toBeVisible();
    await invitee.getByLabel("New password").fill("short");
    await invitee.getByLabel("The same password again").fill("short");
    await invitee.getByRole("button", { name: "Save password" }).click();
    await expect(invitee.getByText("Use at least 10 characters")).toBeVisible();
    await invitee.getByLabel("New password").fill("red-dust-track-42");
    await invitee.getByLabel("The same password again").fill("red-dust-track-42");
    await invitee.getByRole("button", { name: "Save password" }).click();
    await expect(invitee).toHaveURL(/passwordSet=1/);
    await signIn(invitee, "wren.holloway@mirrabel-health.example", "red-dust-track-42");
    await expect(invitee.getByText("Is my vehicle ready, and what did I report?")).toBeVisible();

    // The link worked once; a second use is refused.
    await invitee.goto(new URL(link).pathname);
    await expect(invitee.getByRole("heading", { name: "This link no longer works" })).toBeVisible();

    // Deactivating the account ends the open session at once.
    await admin.goto("/admin/users");
    const row = admin.getByTestId("member-wren.holloway@mirrabel-health.example");
    await row.getByRole("button", { name: "Deactivate Wren Holloway" }).click();
    await expect(row.getByText("Deactivated")).toBeVisible();
    await invitee.goto("/");
    await expect(invitee).toHaveURL(/\/sign-in/);
    await signIn(invitee, "wren.holloway@mirrabel-health.example", "red-dust-track-42");
    await expect(invitee.getByTestId("sign-in-status")).toContainText("do not match an active account");
    await adminContext.close();
    await inviteeContext.close();
  });

  test("a password reset e-mail arrives and its link sets a new password once", async ({ page }) => {
    await page.goto("/forgot-password");
    await page.getByLabel("E-mail").fill("manager2@mirrabel-health.example");
    await page.getByRole("button", { name: "Send me a reset link" }).click();
    await expect(page.getByTestId("reset-status")).toContainText("If that address belongs to an account");

    const mail = await waitForMail("manager2@mirrabel-health.example", "Reset your Rigline password");
    const link = linkIn(mail.text, "/password/");
    await page.goto(new URL(link).pathname);
    await page.getByLabel("New password").fill("saltbush-plain-77");
    await page.getByLabel("The same password again").fill("saltbush-plain-77");
    await page.getByRole("button", { name: "Save password" }).click();
    await expect(page).toHaveURL(/passwordSet=1/);
    await signIn(page, "manager2@mirrabel-health.example", "saltbush-plain-77");
    await expect(page.getByText("What needs my decision, and which vehicles are not ready?")).toBeVisible();

    // An unknown address gets the same answer and no mail.
    await page.goto("/forgot-password");
    await page.getByLabel("E-mail").fill("nobody@mirrabel-health.example");
    await page.getByRole("button", { name: "Send me a reset link" }).click();
    await expect(page.getByTestId("reset-status")).toContainText("If that address belongs to an account");
  });
});
