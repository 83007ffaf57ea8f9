import { expect, test } from "@playwright/test";
import { e2eDatabase, idOf, storageFor } from "./support";

// The product brief's defect flow: a manager raises the repair job straight from a triaged
// report, and the report is linked and in repair as soon as the job exists.

test.use({ storageState: storageFor("manager") });

test("a manager raises a repair job from a triaged defect in one step", async ({ page }) => {
  const defectId = await idOf("defects", "description = ? and state = ?", ["Left rear tyre loses about 40 kPa overnight. No nail visible.", "triaged"]);
  await page.goto(`/defects/${defectId}`);
  await page.getByRole("link", { name: "Raise a job" }).click();
  await expect(page.getByRole("heading", { name: "Raise a job" })).toBeVisible();
  await expect(page.getByTestId("repair-for")).toContainText("raising it links the defect");
  await expect(page.getByLabel("Title")).toHaveValue(/^Repair: /);
  await expect(page.getByLabel("Other work")).toHaveValue(/40 kPa overnight/);
  await page.getByRole("button", { name: "Raise the job" }).click();
  await expect(page).toHaveURL(/\/jobs\/[0-9a-f-]{36}$/);

  const client = e2eDatabase();
  try {
    const [defect] = (await client.execute({ sql: "select state, job_id from defects where id = ?", args: [defectId] })).rows;
    expect(defect).toMatchObject({ state: "in_repair" });
    expect(page.url()).toContain(String(defect!.job_id));
  } finally {
    client.close();
  }
  await page.goto(`/defects/${defectId}`);
  await expect(page.getByText("Repair job")).toBeVisible();
  await expect(page.locator("[data-state=in_repair]")).toBeVisible();
});
