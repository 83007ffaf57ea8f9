import { expect, test } from "@playwright/test";
import { idOf, signIn, storageFor } from "./support";

test.describe("a driver", () => {
  test.use({ storageState: storageFor("driver") });

  test("is shown the not-allowed page for the people page, with status 403", async ({ page }) => {
    const response = await page.goto("/admin/users");
    expect(response?.status()).toBe(403);
    await expect(page.getByRole("heading", { name: "Your role cannot open this page" })).toBeVisible();
    await expect(page.getByRole("link", { name: "People" })).toHaveCount(0);
  });

  test("gets 403 in the one error shape from the people API", async ({ request }) => {
    const response = await request.get("/api/users");
    expect(response.status()).toBe(403);
    expect(await response.json()).toEqual({ error: { code: "forbidden", message: expect.any(String), details: [] } });
  });

  test("cannot open a vehicle that is not assigned to them", async ({ page, request }) => {
    const other = await idOf("vehicles", "fleet_number = ?", ["MH-040"]);
    expect((await request.get(`/api/vehicles/${other}`)).status()).toBe(404);
    const response = await page.goto(`/vehicles/${other}`);
    expect(response?.status()).toBe(404);
  });
});

test.describe("a contractor", () => {
  test.use({ storageState: storageFor("contractor") });

  test("cannot reach the organisation settings", async ({ page, request }) => {
    expect((await page.goto("/admin/settings"))?.status()).toBe(403);
    expect((await request.get("/api/users")).status()).toBe(403);
  });
});

test.describe("finance", () => {
  test.use({ storageState: storageFor("finance") });

  test("reads settings but cannot change them, and cannot manage people", async ({ page }) => {
    await page.goto("/admin/settings");
    await expect(page.getByText("Only an administrator can change these.")).toBeVisible();
    await expect(page.getByRole("button", { name: "Save settings" })).toHaveCount(0);
    expect((await page.goto("/admin/users"))?.status()).toBe(403);
  });
});

test.describe("organisations are kept apart", () => {
  test("a manager of one organisation cannot read the other's vehicle by id", async ({ page }) => {
    const mirrabelVehicle = await idOf("vehicles", "fleet_number = ?", ["MH-001"]);
    await signIn(page, "manager@gidgee-trust.example");
    await expect(page.getByTestId("current-user")).toContainText("Gidgee Range");
    const api = await page.request.get(`/api/vehicles/${mirrabelVehicle}`);
    expect(api.status()).toBe(404);
    expect((await api.json()).error.code).toBe("not_found");
    const response = await page.goto(`/vehicles/${mirrabelVehicle}`);
    expect(response?.status()).toBe(404);
    await expect(page.getByText("There is nothing at this address")).toBeVisible();
  });

  test("nobody signed in gets 401 from the API and the sign-in page for pages", async ({ page, request }) => {
    const response = await request.get("/api/users");
    expect(response.status()).toBe(401);
    await page.goto("/admin/users");
    await expect(page).toHaveURL(/\/sign-in/);
  });
});
