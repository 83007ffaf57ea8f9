import { createClient } from "@libsql/client";
import { expect, type Page } from "@playwright/test";

export const PASSWORD = "outback-demo-2026";

export const ACCOUNTS = {
  admin: "admin@mirrabel-health.example",
  manager: "manager@mirrabel-health.example",
  finance: "finance@mirrabel-health.example",
  contractor: "contractor@tallowbark-fitout.example",
  driver: "driver@mirrabel-health.example",
} as const;
export type RoleName = keyof typeof ACCOUNTS;
export const ROLE_NAMES = Object.keys(ACCOUNTS) as RoleName[];

export const storageFor = (role: RoleName) => `tests/e2e/.auth/${role}.json`;

export async function signIn(page: Page, email: string, password = PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** The e2e database (a fresh temporary file per run), for reading what the app stored. */
export function e2eDatabase() {
  const url = process.env.E2E_DATABASE_URL;
  if (!url || !url.startsWith("file:")) throw new Error("E2E_DATABASE_URL must be the local test database");
  return createClient({ url });
}

/** Waits for a message caught by the local SMTP stand-in and returns it. */
export async function waitForMail(to: string, subjectIncludes: string, timeoutMs = 15_000) {
  const client = e2eDatabase();
  try {
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      const result = await client.execute({
        sql: "select subject, text_body as text, html_body as html from dev_mailbox where to_address like ? and subject like ? order by created_at desc limit 1",
        args: [`%${to}%`, `%${subjectIncludes}%`],
      });
      const row = result.rows[0];
      if (row) return { subject: String(row.subject), text: String(row.text), html: row.html ? String(row.html) : null };
      await new Promise((r) => setTimeout(r, 250));
    }
  } finally {
    client.close();
  }
  throw new Error(`no mail to ${to} with "${subjectIncludes}" within ${timeoutMs} ms`);
}

export function linkIn(text: string, path: string): string {
  const match = new RegExp(`https?://[^\\s]+${path}[^\\s]*`).exec(text);
  expect(match, `a link to ${path} in the mail`).not.toBeNull();
  return match![0];
}

export async function idOf(table: string, where: string, args: (string | number)[]): Promise<string> {
  const client = e2eDatabase();
  try {
    const result = await client.execute({ sql: `select id from ${table} where ${where} limit 1`, args });
    const id = result.rows[0]?.id;
    if (!id) throw new Error(`no ${table} where ${where}`);
    return String(id);
  } finally {
    client.close();
  }
}
