/**
 * What the demo, development and test runners share: a prepared environment, the local SMTP
 * stand-in writing to the development mailbox, and the Next server as one child process.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { makeDb, openClient, prepareLocal, type Database } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { devMailbox } from "@/db/schema";
import { startSmtpStandIn } from "@/lib/server/mail/standin";
import { loadDotEnv } from "../load-env";

/** A stable local secret for demo and development, kept under data/ (git-ignored). */
export function localAuthSecret(): string {
  mkdirSync("data", { recursive: true });
  const file = "data/.auth-secret";
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

export function prepareEnv(mode: "demo" | "development" | "test", overrides: Record<string, string> = {}) {
  loadDotEnv();
  process.env.NEXT_TELEMETRY_DISABLED = "1";
  process.env.RIGLINE_MODE = mode;
  process.env.AUTH_SECRET ??= localAuthSecret();
  process.env.DATABASE_URL ??= "file:./data/rigline.db";
  process.env.SMTP_HOST ??= "127.0.0.1";
  process.env.SMTP_PORT ??= "2525";
  Object.assign(process.env, overrides);
  process.env.APP_URL ??= `http://localhost:${process.env.PORT ?? "3000"}`;
}

export async function openDatabase(url = process.env.DATABASE_URL!): Promise<Database> {
  const client = openClient(url, process.env.DATABASE_AUTH_TOKEN);
  await prepareLocal(client, url);
  const database = makeDb(client);
  await migrateDatabase(database);
  return database;
}

/** The local SMTP stand-in: every message lands in the development mailbox table. */
export async function startMailStandIn(database: Database, port: number) {
  return startSmtpStandIn({
    port,
    store: async (mail) => {
      await database.insert(devMailbox).values({
        toAddress: mail.to,
        fromAddress: mail.from,
        subject: mail.subject,
        textBody: mail.text,
        htmlBody: mail.html,
      });
    },
  });
}

export function run(command: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: "inherit", env });
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${command} ${args.join(" ")} exited with ${code}`))));
  });
}

/** Starts `next start` directly (not through npx, so stopping it frees the port). */
export function startNext(port: number, env: NodeJS.ProcessEnv = process.env, mode: "start" | "dev" = "start"): ChildProcess {
  return spawn("node_modules/.bin/next", [mode, "-p", String(port), "-H", "0.0.0.0"], { stdio: "inherit", env });
}

export async function waitForHealth(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`The app did not answer ${url} within ${timeoutMs / 1000} s`);
}
