import { and, asc, eq, inArray } from "drizzle-orm";
import { GENERAL_CHECK_ITEMS } from "@/lib/defects";
import type { Database } from "../client";
import { auditEntries, defects, jobs, memberships, preTripChecks, users, vehicleDrivers, vehicles } from "../schema";

/**
 * Demo defects and pre-trip checks (invented): reports in every state and severity on the
 * drivers' vehicles, one vehicle grounded by a stop defect, a duplicate merged into the report
 * kept, one closed with a reason, and a finished pre-trip check. The first driver's vehicles
 * stay in service, so the demo (and the browser tests) can ground one of them themselves.
 */

const DAY_MS = 86_400_000;

type Driver = { userId: string; name: string; vehicles: { id: string; fleetNumber: string; state: string }[] };

async function driversWithVehicles(tx: Database, orgId: string): Promise<Driver[]> {
  const rows = await tx
    .select({ userId: users.id, name: users.name, email: users.email, vehicleId: vehicles.id, fleetNumber: vehicles.fleetNumber, state: vehicles.state })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(vehicleDrivers, eq(vehicleDrivers.userId, users.id))
    .innerJoin(vehicles, and(eq(vehicles.id, vehicleDrivers.vehicleId), eq(vehicles.orgId, orgId)))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "driver")))
    .orderBy(asc(users.email), asc(vehicles.fleetNumber));
  const byUser = new Map<string, Driver>();
  for (const r of rows) {
    const d = byUser.get(r.userId) ?? { userId: r.userId, name: r.name, vehicles: [] };
    d.vehicles.push({ id: r.vehicleId, fleetNumber: r.fleetNumber, state: r.state });
    byUser.set(r.userId, d);
  }
  // In the order of their first vehicle, so the first driver is the one of the first vehicles.
  return [...byUser.values()].sort((a, b) => a.vehicles[0]!.fleetNumber.localeCompare(b.vehicles[0]!.fleetNumber));
}

export async function seedDefects(tx: Database, orgId: string, now: Date = new Date()): Promise<void> {
  const drivers = await driversWithVehicles(tx, orgId);
  const first = drivers[0];
  if (!first || first.vehicles.length === 0) return;
  const second = drivers[1] ?? first;
  const ago = (days: number, hours = 0) => new Date(now.getTime() - days * DAY_MS - hours * 3_600_000);
  const v = (d: Driver, i: number) => d.vehicles[i % d.vehicles.length]!;

  const insert = async (row: Omit<typeof defects.$inferInsert, "orgId" | "clientId"> & { clientId?: string }) => {
    const [out] = await tx
      .insert(defects)
      .values({ orgId, clientId: row.clientId ?? crypto.randomUUID(), ...row, updatedAt: row.updatedAt ?? row.createdAt })
      .returning();
    return out!;
  };

  // A job already raised, to show a defect in repair: on a driver's vehicle if the jobs demo has
  // one there, else on any vehicle (then reported by a manager: anyone may report a defect).
  const driverVehicleIds = drivers.flatMap((d) => d.vehicles.map((x) => x.id));
  const openJobs = await tx
    .select({ id: jobs.id, vehicleId: jobs.vehicleId })
    .from(jobs)
    .where(and(eq(jobs.orgId, orgId), inArray(jobs.state, ["open", "quoting", "awarded", "in_workshop", "evidence_lodged"])))
    .orderBy(asc(jobs.number));
  const openJob = openJobs.find((j) => driverVehicleIds.includes(j.vehicleId)) ?? openJobs[0];
  const [manager] = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "manager")))
    .orderBy(asc(memberships.createdAt))
    .limit(1);

  // The second driver's vehicle grounded by a stop defect, with the managers' notice long sent.
  const stopVehicle = v(second, 1);
  const stop = await insert({
    vehicleId: stopVehicle.id,
    reportedBy: second.userId,
    severity: "stop",
    category: "brakes",
    description: "Brake pedal goes soft after the creek crossing and the vehicle pulls to the left.",
    odometerKm: 112_480,
    latitude: -24.1187,
    longitude: 134.2056,
    state: "reported",
    createdAt: ago(0, 5),
  });
  if (second !== first || first.vehicles.length > 1) {
    const reason = `Stop defect reported by ${second.name}: Brakes — ${stop.description}`.slice(0, 300);
    await tx.update(vehicles).set({ state: "grounded", groundedReason: reason }).where(eq(vehicles.id, stopVehicle.id));
    await tx.insert(auditEntries).values({
      orgId,
      actorId: second.userId,
      action: "vehicle.ground",
      entityType: "vehicle",
      entityId: stopVehicle.id,
      before: { state: stopVehicle.state },
      after: { state: "grounded", groundedReason: reason },
      reason: `Stop defect ${stop.id}`,
      at: stop.createdAt,
    });
  }

  const tyre = await insert({
    vehicleId: v(second, 0).id,
    reportedBy: second.userId,
    severity: "before_next_trip",
    category: "tyres_wheels",
    description: "Left rear tyre loses about 40 kPa overnight. No nail visible.",
    odometerKm: 64_210,
    state: "triaged",
    createdAt: ago(3),
  });
  await insert({
    vehicleId: v(second, 0).id,
    reportedBy: second.userId,
    severity: "watch",
    category: "tyres_wheels",
    description: "Slow leak in the left rear again this morning.",
    state: "merged",
    mergedIntoId: tyre.id,
    createdAt: ago(2),
  });

  await insert({
    vehicleId: v(first, 0).id,
    reportedBy: first.userId,
    severity: "watch",
    category: "body_glass",
    description: "Stone chip low on the windscreen, passenger side. Not spreading yet.",
    odometerKm: 48_210,
    state: "reported",
    createdAt: ago(1, 2),
  });
  await insert({
    vehicleId: v(first, 0).id,
    reportedBy: first.userId,
    severity: "before_next_trip",
    category: "engine_fluids",
    description: "Engine warning light came on at the fuel stop.",
    state: "closed",
    closeReason: "Fuel cap not clicked shut; the light cleared after refuelling properly.",
    createdAt: ago(9),
    updatedAt: ago(8),
  });
  if (openJob) {
    const reporter = drivers.find((d) => d.vehicles.some((x) => x.id === openJob.vehicleId))?.userId ?? manager?.userId ?? first.userId;
    await insert({
      vehicleId: openJob.vehicleId,
      reportedBy: reporter,
      severity: "before_next_trip",
      category: "lights_electrical",
      description: "Right spotlight flickers on corrugations; connector looks corroded.",
      state: "in_repair",
      jobId: openJob.id,
      createdAt: ago(6),
      updatedAt: ago(5),
    });
  } else {
    await insert({
      vehicleId: v(first, 1).id,
      reportedBy: first.userId,
      severity: "before_next_trip",
      category: "lights_electrical",
      description: "Right spotlight flickers on corrugations; connector looks corroded.",
      state: "triaged",
      createdAt: ago(6),
    });
  }
  await insert({
    vehicleId: v(second, 2).id,
    reportedBy: second.userId,
    severity: "watch",
    category: "fit_out",
    description: "Rear door seal lets fine dust into the cargo area.",
    state: "resolved",
    createdAt: ago(14),
    updatedAt: ago(4),
  });
  await insert({
    vehicleId: v(second, 2).id,
    reportedBy: second.userId,
    severity: "stop",
    category: "steering_suspension",
    description: "Steering wheel shimmies hard above 80 km/h on the bitumen.",
    state: "closed",
    createdAt: ago(30),
    updatedAt: ago(21),
  });

  // A finished pre-trip check by the first driver, yesterday: one fault, put right on the spot.
  await tx.insert(preTripChecks).values({
    orgId,
    vehicleId: v(first, 0).id,
    driverId: first.userId,
    clientId: crypto.randomUUID(),
    items: GENERAL_CHECK_ITEMS.map((item) =>
      item.key === "general.tyres"
        ? { key: item.key, label: item.label, result: "fail" as const, note: "Left front 30 kPa low; pumped up to the placard pressure" }
        : { key: item.key, label: item.label, result: "pass" as const },
    ),
    completedAt: ago(1, 3),
    createdAt: ago(1, 3),
  });
}
