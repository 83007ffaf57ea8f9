/**
 * `GET /api/vehicles` under load: one page of 50 out of 10,000 vehicles, signed in as a manager,
 * 32 concurrent connections (autocannon) against the production build (`next start`) on a
 * temporary SQLite database. Baseline in the same run, on the same server: a bare route handler
 * answering static JSON of the same byte size (app/api/bench/static, on only with
 * RIGLINE_BENCH_ROUTES=1). Targets: p95 latency under 50 ms, and at least 40 % of the bare
 * route's throughput. Nothing changes the register during the load, so the requests are served
 * from the page kept for the register's revision (db/register-cache.ts), as they are between
 * changes in use; a round with the register changing ten times a second, and what one request
 * costs right after a change (the page computed afresh, measured in this process on the same
 * database), are printed beside it.
 *
 * The production build is reused when .next/BUILD_ID is newer than every source file (or always
 * with --no-build); otherwise `next build` runs first. BENCH_SERVER_NODE_FLAGS are given to the
 * server's node (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof" to profile it under load).
 */
import bcrypt from "bcryptjs";
import { eq, sql } from "drizzle-orm";
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync } from "node:fs";
import { createRequire } from "node:module";
import { join } from "node:path";
import type { Database } from "@/db/client";
import {
  concessions,
  depots,
  editionLines,
  editions,
  fitments,
  LINE_CATEGORIES,
  memberships,
  organisations,
  platforms,
  standards,
  users,
  vehicleDrivers,
  vehicles,
} from "@/db/schema";
import { clearRegisterPages, registerPage } from "@/db/register-cache";
import { demoRegistration, demoVin } from "@/db/seed/identifiers";
import { listVehiclesPage, type VehicleListParams } from "@/db/vehicles";
import type { Actor } from "@/lib/permissions";
import { freePort } from "../scripts/lib/ports";
import { benchDatabase, medianMs, type BenchResult } from "./support";

const VEHICLES = 10_000;
const PAGE_SIZE = 50;
const LINES = 40;
const CONNECTIONS = 32;
/** Each route is measured in ROUNDS alternating rounds of ROUND_SECONDS, after a warm-up. */
const ROUNDS = 2;
const ROUND_SECONDS = 5;
const WARMUP_SECONDS = 3;
export const TARGET_P95_MS = 50;
export const TARGET_THROUGHPUT_RATIO = 0.4;

export const MANAGER_EMAIL = "manager@bench-fleet.example";
const PASSWORD = "bench-password-1";

// ─── The production build ──────────────────────────────────────────────────────

const SOURCE_DIRS = ["app", "components", "lib", "db", "imports", "public"];
const SOURCE_FILES = ["next.config.mjs", "package.json", "package-lock.json", "tsconfig.json", "postcss.config.mjs", "tailwind.config.ts", "instrumentation.ts"];

function newestSourceMs(): number {
  let newest = 0;
  const visit = (path: string) => {
    if (!existsSync(path)) return;
    const stat = statSync(path);
    if (stat.isDirectory()) {
      for (const entry of readdirSync(path)) visit(join(path, entry));
    } else {
      newest = Math.max(newest, stat.mtimeMs);
    }
  };
  for (const path of [...SOURCE_DIRS, ...SOURCE_FILES]) visit(path);
  return newest;
}

function ensureBuild(skip: boolean): void {
  const buildId = join(".next", "BUILD_ID");
  if (skip) {
    if (!existsSync(buildId)) throw new Error("--no-build given but there is no production build (.next/BUILD_ID); run `npm run build`");
    return;
  }
  if (existsSync(buildId) && statSync(buildId).mtimeMs > newestSourceMs()) return;
  console.log("  building the app (next build) …");
  const built = spawnSync("node_modules/.bin/next", ["build"], { stdio: ["ignore", "ignore", "inherit"], env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } });
  if (built.status !== 0) throw new Error(`next build exited with ${built.status}`);
}

// ─── The register: one organisation, 10,000 vehicles ───────────────────────────

export async function fillRegister(database: Database): Promise<void> {
  const passwordHash = await bcrypt.hash(PASSWORD, 10);
  const [org] = await database.insert(organisations).values({ name: "Bench Fleet", slug: "bench-fleet" }).returning();
  const orgId = org!.id;
  const [manager] = await database.insert(users).values({ email: MANAGER_EMAIL, name: "Bench Manager", passwordHash }).returning();
  await database.insert(memberships).values({ orgId, userId: manager!.id, role: "manager" });
  const driverRows = await database
    .insert(users)
    .values(Array.from({ length: 40 }, (_, i) => ({ email: `driver${i}@bench-fleet.example`, name: `Bench Driver ${String(i).padStart(2, "0")}`, passwordHash })))
    .returning();
  await database.insert(memberships).values(driverRows.map((u) => ({ orgId, userId: u.id, role: "driver" as const })));

  const depotRows = await database
    .insert(depots)
    .values(["North Camp", "River Yard", "Ridge Base", "Salt Flat", "Gorge Station", "Coast Shed"].map((name, i) => ({ orgId, name, code: `D${i + 1}` })))
    .returning();
  const platformRows = await database
    .insert(platforms)
    .values(
      [
        ["Corvane", "Trailhand 79", "single cab chassis"],
        ["Corvane", "Trailhand 79", "dual cab chassis"],
        ["Marrak", "Outback 300", "wagon"],
        ["Yendor", "Terrus 4", "dual cab ute"],
        ["Brolga", "Kestrel", "LC wagon"],
      ].map(([make, model, variant]) => ({ orgId, make: make!, model: model!, variant: variant!, kerbMassKg: 2300, gvmKg: 3500 })),
    )
    .returning();
  const [standard] = await database.insert(standards).values({ orgId, name: "Remote duty fit-out" }).returning();
  const [edition] = await database
    .insert(editions)
    .values({ orgId, standardId: standard!.id, number: 1, status: "published", publishedAt: new Date("2026-03-01T00:00:00Z"), publishedBy: manager!.id })
    .returning();
  const lines = Array.from({ length: LINES }, (_, i) => ({
    orgId,
    editionId: edition!.id,
    key: `line-${i}`,
    code: `L-${String(i + 1).padStart(2, "0")}`,
    category: LINE_CATEGORIES[i % LINE_CATEGORIES.length]!,
    title: `Fit-out line ${i + 1}`,
    requirement: (i % 8 === 7 ? "may_fit" : "must_fit") as "may_fit" | "must_fit",
    quantity: 1,
    massKg: 4 + (i % 9),
    zone: "tub" as const,
    criteria: i % 6 === 0 ? [{ attribute: "ratingKg", op: "gte" as const, value: 400 }] : [],
    evidenceNeeded: [],
    standardCostCents: 12_000 + i * 250,
    expiryMonths: i % 10 === 3 ? 12 : null,
    sortOrder: i,
  }));
  await database.insert(editionLines).values(lines);

  const fitted = new Date("2026-05-01T00:00:00Z");
  const concessionUntil = new Date("2027-06-30T00:00:00Z");
  const BATCH = 500;
  for (let start = 0; start < VEHICLES; start += BATCH) {
    await database.transaction(async (tx) => {
      const batch = Array.from({ length: Math.min(BATCH, VEHICLES - start) }, (_, j) => {
        const i = start + j;
        return {
          orgId,
          fleetNumber: `BF-${String(i + 1).padStart(5, "0")}`,
          vin: demoVin("BF", i),
          registration: demoRegistration("BF", i),
          registrationExpiry: new Date(Date.UTC(2027, i % 12, 1 + (i % 28))),
          platformId: platformRows[i % platformRows.length]!.id,
          depotId: i % 17 === 0 ? null : depotRows[i % depotRows.length]!.id,
          costCentre: `CC-${(i % 6) + 1}`,
          // Four vehicles in five are held to the published edition; the rest have none yet.
          editionId: i % 5 === 4 ? null : edition!.id,
          state: (i % 23 === 0 ? "in_fitout" : i % 41 === 0 ? "grounded" : "in_service") as "in_fitout" | "grounded" | "in_service",
          groundedReason: i % 23 !== 0 && i % 41 === 0 ? "Cracked chassis rail near rear spring hanger" : null,
          odometerKm: 12_000 + ((i * 7919) % 240_000),
          buildYear: 2016 + (i % 10),
        };
      });
      const inserted = await tx.insert(vehicles).values(batch).returning({ id: vehicles.id, editionId: vehicles.editionId });
      const fitmentRows = inserted.flatMap((v, j): (typeof fitments.$inferInsert)[] => {
        const i = start + j;
        if (!v.editionId) return i % 3 === 0 ? [{ orgId, vehicleId: v.id, lineKey: null, label: "Roof rack (extra)", fittedAt: fitted, attributes: {} }] : [];
        // Most vehicles lack a line or two; one in seven is complete.
        return lines
          .filter((_, li) => i % 7 === 0 || (i + li) % 13 !== 0)
          .map((l, li) => ({ orgId, vehicleId: v.id, lineKey: l.key, label: l.title, fittedAt: fitted, attributes: (li % 6 === 0 ? { ratingKg: i % 11 === 0 ? 380 : 450 } : {}) as Record<string, number> }));
      });
      for (let k = 0; k < fitmentRows.length; k += 2000) await tx.insert(fitments).values(fitmentRows.slice(k, k + 2000));
      const concessionRows = inserted
        .filter((v, j) => v.editionId && (start + j) % 19 === 0)
        .map((v) => ({ orgId, vehicleId: v.id, lineKey: "line-0", reason: "Awaiting stock of the rated part", expiresAt: concessionUntil, approvedBy: manager!.id }));
      if (concessionRows.length > 0) await tx.insert(concessions).values(concessionRows);
      const driverLinks = inserted
        .filter((_, j) => (start + j) % 4 === 0)
        .map((v, k) => ({ vehicleId: v.id, userId: driverRows[(start + k) % driverRows.length]!.id }));
      if (driverLinks.length > 0) await tx.insert(vehicleDrivers).values(driverLinks);
    });
  }
}

// ─── The server and a signed-in browser ────────────────────────────────────────

type Server = { child: ChildProcess; base: string; output: () => string };

async function startServer(databaseUrl: string, dir: string): Promise<Server> {
  const port = await freePort();
  const storage = join(dir, "files");
  mkdirSync(storage, { recursive: true });
  let output = "";
  const nodeFlags = (process.env.BENCH_SERVER_NODE_FLAGS ?? "").split(" ").filter(Boolean);
  const child = spawn(process.execPath, [...nodeFlags, "node_modules/next/dist/bin/next", "start", "-p", String(port), "-H", "127.0.0.1"], {
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      RIGLINE_MODE: "production",
      RIGLINE_BENCH_ROUTES: "1",
      DATABASE_URL: databaseUrl,
      AUTH_SECRET: "bench-only-secret-bench-only-secret-0123",
      APP_URL: `http://localhost:${port}`,
      OUTBOX_SENDER: "off",
      STORAGE_DRIVER: "disk",
      STORAGE_DIR: storage,
    },
  });
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-8000);
  };
  child.stdout!.on("data", keep);
  child.stderr!.on("data", keep);
  const server = { child, base: `http://127.0.0.1:${port}`, output: () => output };
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${output}`);
    try {
      if ((await fetch(`${server.base}/api/health`)).ok) return server;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  await stopServer(server);
  throw new Error(`next start did not answer /api/health within 60 s:\n${output}`);
}

async function stopServer(server: Server): Promise<void> {
  if (server.child.exitCode !== null || server.child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => server.child.once("exit", () => resolve()));
  server.child.kill("SIGTERM");
  const timer = setTimeout(() => server.child.kill("SIGKILL"), 5000);
  await exited;
  clearTimeout(timer);
}

/** Name=value pairs of the Set-Cookie headers, merged into a cookie jar. */
function keepCookies(jar: Map<string, string>, response: Response): void {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const at = pair!.indexOf("=");
    jar.set(pair!.slice(0, at).trim(), pair!.slice(at + 1).trim());
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");

/** Signs in as a browser does with Auth.js credentials: the CSRF token, then the callback. */
async function signIn(base: string): Promise<string> {
  const jar = new Map<string, string>();
  const csrfResponse = await fetch(`${base}/api/auth/csrf`);
  keepCookies(jar, csrfResponse);
  const { csrfToken } = (await csrfResponse.json()) as { csrfToken: string };
  const response = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookieHeader(jar) },
    body: new URLSearchParams({ csrfToken, email: MANAGER_EMAIL, password: PASSWORD, callbackUrl: `${base}/vehicles` }),
  });
  keepCookies(jar, response);
  if (![...jar.keys()].some((k) => k.endsWith("authjs.session-token"))) {
    throw new Error(`sign-in failed: ${response.status} ${response.headers.get("location") ?? ""}`);
  }
  return cookieHeader(jar);
}

// ─── Load ──────────────────────────────────────────────────────────────────────

type AutocannonInstance = {
  on(event: "response", listener: (client: unknown, statusCode: number, bytes: number, ms: number) => void): void;
  then: Promise<{ duration: number; non2xx: number; errors: number; timeouts: number; requests: { sent: number } }>["then"];
};
type Autocannon = (options: { url: string; connections: number; duration: number; headers?: Record<string, string> }) => AutocannonInstance;
const autocannon = createRequire(import.meta.url)("autocannon") as Autocannon;

type Load = { requests: number; sent: number; seconds: number; latencies: number[]; bytes: number; serverCpuMs: number };

/** CPU time (user + system) the server process has used so far, from /proc (Linux); NaN elsewhere. */
function cpuMsOf(pid: number | undefined): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
    // utime and stime are fields 14 and 15 of stat, in clock ticks (100 a second on Linux).
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
  } catch {
    return NaN;
  }
}

/**
 * Waits until the server has worked off what it was sent (autocannon stops the clock with up to
 * 32 requests still in the server, which would otherwise be served in the next measurement):
 * two quarter-seconds in a row with under 10 % of a core used.
 */
async function settle(serverPid: number | undefined): Promise<void> {
  const deadline = Date.now() + 60_000;
  let quiet = 0;
  let last = cpuMsOf(serverPid);
  while (quiet < 2 && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, 250));
    const now = cpuMsOf(serverPid);
    quiet = Number.isNaN(now) || now - last < 25 ? quiet + 1 : 0;
    last = now;
  }
}

async function load(url: string, seconds: number, headers: Record<string, string>, serverPid?: number): Promise<Load> {
  await settle(serverPid);
  const cpuBefore = cpuMsOf(serverPid);
  const latencies: number[] = [];
  let bytes = 0;
  let bad = 0;
  const instance = autocannon({ url, connections: CONNECTIONS, duration: seconds, headers });
  instance.on("response", (_client, status, responseBytes, ms) => {
    if (status !== 200) bad++;
    latencies.push(ms);
    bytes += responseBytes;
  });
  const result = await instance;
  if (bad > 0 || result.errors > 0 || result.timeouts > 0) {
    throw new Error(`${url}: ${bad} non-200 answers, ${result.errors} errors, ${result.timeouts} timeouts under load`);
  }
  // The server's CPU until it has served everything this load sent, shared by all it was sent.
  await settle(serverPid);
  const serverCpuMs = cpuMsOf(serverPid) - cpuBefore;
  return { requests: latencies.length, sent: Math.max(result.requests.sent, latencies.length), seconds: result.duration, latencies, bytes, serverCpuMs };
}

function merge(loads: Load[]): Load {
  return {
    requests: loads.reduce((s, l) => s + l.requests, 0),
    sent: loads.reduce((s, l) => s + l.sent, 0),
    seconds: loads.reduce((s, l) => s + l.seconds, 0),
    latencies: loads.flatMap((l) => l.latencies),
    bytes: loads.reduce((s, l) => s + l.bytes, 0),
    serverCpuMs: loads.reduce((s, l) => s + l.serverCpuMs, 0),
  };
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

export type RouteFigures = { reqPerSec: number; p50: number; p95: number; p99: number; bodyBytes: number; requests: number; cpuMsPerRequest: number };

function figures(l: Load, bodyBytes: number): RouteFigures {
  const sorted = [...l.latencies].sort((a, b) => a - b);
  return {
    reqPerSec: l.requests / l.seconds,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    bodyBytes,
    requests: l.requests,
    cpuMsPerRequest: l.serverCpuMs / l.sent,
  };
}

// Server CPU per request does not depend on what else the machine is doing, unlike req/s.
const describe = (f: RouteFigures) =>
  `${Math.round(f.reqPerSec).toLocaleString("en-AU")} req/s, latency p50 ${f.p50.toFixed(1)} / p95 ${f.p95.toFixed(1)} / p99 ${f.p99.toFixed(1)} ms, ${f.bodyBytes.toLocaleString("en-AU")} bytes a response, server CPU ${f.cpuMsPerRequest.toFixed(2)} ms a request`;

// ─── The benchmark ─────────────────────────────────────────────────────────────

/** Median cost of computing the measured page afresh, and of serving it kept, in this process. */
async function pageCostsInProcess(database: Database): Promise<{ computedMs: number; keptMs: number }> {
  const manager = await database.query.users.findFirst({ where: (u, { eq }) => eq(u.email, MANAGER_EMAIL) });
  const membership = await database.query.memberships.findFirst({ where: (m, { eq }) => eq(m.userId, manager!.id) });
  const actor: Actor = { userId: manager!.id, orgId: membership!.orgId, role: membership!.role, firmId: membership!.firmId, depotId: membership!.depotId };
  const params: VehicleListParams = { page: 1, pageSize: PAGE_SIZE, sort: "fleetNumber", dir: "asc" };
  const computedMs = await medianMs(() => listVehiclesPage(database, actor, params, new Date()), 41, 5);
  clearRegisterPages(database);
  const keptMs = await medianMs(() => registerPage(database, actor, params, new Date()), 201, 5);
  return { computedMs, keptMs };
}

export async function run(options: { noBuild?: boolean } = {}): Promise<BenchResult[]> {
  ensureBuild(options.noBuild ?? false);
  const { database, dir, url, close } = await benchDatabase();
  let server: Server | undefined;
  try {
    await fillRegister(database);
    server = await startServer(url, dir);
    const cookie = await signIn(server.base);
    const apiUrl = `${server.base}/api/vehicles?page=1&pageSize=${PAGE_SIZE}`;

    const first = await fetch(apiUrl, { headers: { cookie } });
    const text = await first.text();
    if (first.status !== 200) throw new Error(`GET /api/vehicles answered ${first.status}: ${text.slice(0, 300)}`);
    const page = JSON.parse(text) as { items: { variance: string }[]; total: number };
    if (page.items.length !== PAGE_SIZE || page.total !== VEHICLES) throw new Error(`expected ${PAGE_SIZE} of ${VEHICLES} vehicles, got ${page.items.length} of ${page.total}`);
    if (!page.items.some((i) => i.variance === "gaps") || !page.items.some((i) => i.variance === "no_edition")) {
      throw new Error("the measured page should show vehicles with gaps and without an edition");
    }
    const bytes = Buffer.byteLength(text);
    const bareUrl = `${server.base}/api/bench/static?bytes=${bytes}`;
    const bare = await fetch(bareUrl);
    const bareBytes = (await bare.arrayBuffer()).byteLength;
    if (bare.status !== 200 || bareBytes !== bytes) throw new Error(`the bare route answered ${bare.status} with ${bareBytes} bytes, not ${bytes}`);

    const headers = { cookie };
    const pid = server.child.pid;
    await load(bareUrl, WARMUP_SECONDS, {}, pid);
    await load(apiUrl, WARMUP_SECONDS, headers, pid);
    const bareLoads: Load[] = [];
    const apiLoads: Load[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      bareLoads.push(await load(bareUrl, ROUND_SECONDS, {}, pid));
      apiLoads.push(await load(apiUrl, ROUND_SECONDS, headers, pid));
    }
    // The register changing under the load: one vehicle edited ten times a second, each edit
    // raising the register revision, so every page is computed afresh again after it.
    const [edited] = await database.select({ id: vehicles.id }).from(vehicles).limit(1);
    let edits = 0;
    const writer = setInterval(() => {
      // A query runs when awaited: then() starts it; the count is of edits committed.
      database
        .update(vehicles)
        .set({ odometerKm: sql`coalesce(${vehicles.odometerKm}, 0) + 1` })
        .where(eq(vehicles.id, edited!.id))
        .then(
          () => void edits++,
          (error: unknown) => console.error("bench edit failed", error),
        );
    }, 100);
    let changing: Load;
    try {
      changing = await load(apiUrl, ROUND_SECONDS, headers, pid);
    } finally {
      clearInterval(writer);
    }
    const afresh = await pageCostsInProcess(database);
    const api = figures(merge(apiLoads), bytes);
    const base = figures(merge(bareLoads), bareBytes);
    const busy = figures(changing, bytes);
    const ratio = api.reqPerSec / base.reqPerSec;
    const name = `GET /api/vehicles, page of ${PAGE_SIZE} of ${VEHICLES.toLocaleString("en-AU")} vehicles, signed in, ${CONNECTIONS} connections`;
    const baseline = `bare route with static JSON of the same size: ${describe(base)}`;
    return [
      {
        name: `${name}: latency`,
        figure: describe(api),
        baseline,
        ratio: api.p95 / base.p95,
        ratioLabel: "× the bare route's p95",
        target: `p95 under ${TARGET_P95_MS} ms (${api.p95.toFixed(1)} ms)`,
        met: api.p95 < TARGET_P95_MS,
      },
      {
        name: `${name}: throughput`,
        figure: `${Math.round(api.reqPerSec).toLocaleString("en-AU")} req/s (${api.requests.toLocaleString("en-AU")} requests in ${ROUNDS * ROUND_SECONDS} s)`,
        baseline: `${Math.round(base.reqPerSec).toLocaleString("en-AU")} req/s for the bare route (${base.requests.toLocaleString("en-AU")} requests in ${ROUNDS * ROUND_SECONDS} s)`,
        ratio,
        ratioLabel: "of the bare route's throughput",
        target: `at least ${TARGET_THROUGHPUT_RATIO.toFixed(2)} of the bare route's throughput`,
        met: ratio >= TARGET_THROUGHPUT_RATIO,
      },
      {
        name: `${name}, while the register changes ten times a second`,
        figure: `${describe(busy)} (${edits} edits in ${ROUND_SECONDS} s)`,
        baseline: `${Math.round(base.reqPerSec).toLocaleString("en-AU")} req/s for the bare route`,
        ratio: busy.reqPerSec / base.reqPerSec,
        ratioLabel: "of the bare route's throughput",
        target: "none of its own (for comparison: the targets are judged on the steady register above)",
        met: null,
      },
      {
        name: `Register page of ${PAGE_SIZE} computed afresh (the first request after any change), in process`,
        figure: `${afresh.computedMs.toFixed(2)} ms a page (count, page, variance statuses, drivers)`,
        baseline: `${afresh.keptMs.toFixed(3)} ms for the kept page (one revision read)`,
        ratio: afresh.computedMs / afresh.keptMs,
        ratioLabel: "× the kept page",
        target: "none of its own (for comparison)",
        met: null,
      },
    ];
  } catch (error) {
    if (server) console.error(`server output:\n${server.output()}`);
    throw error;
  } finally {
    if (server) await stopServer(server);
    close();
  }
}
