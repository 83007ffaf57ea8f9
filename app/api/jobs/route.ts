import { listJobs, raiseJob } from "@/lib/commands/jobs";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

/** Jobs the caller may see; filters `state`, `firmId`, `depotId`, `vehicleId`, `overdue=1`. */
export const GET = routeHandler(listJobs, (request) => queryParams(request), {
  respond: (items) => Response.json({ items }),
});

/** Raise a job on a vehicle: `{ vehicleId, title, lineKeys: [...], freeText: [...], costKind, dueAt, defectId? }` (a triaged defect it repairs). */
export const POST = routeHandler(raiseJob, (request) => readJson(request), { status: 201 });
