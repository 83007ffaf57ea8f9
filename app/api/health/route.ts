import { sql } from "drizzle-orm";
import { NextResponse } from "next/server";
import { db } from "@/db/client";

export const dynamic = "force-dynamic";

/** Liveness and database reachability, for load balancers and the test harness. */
export async function GET() {
  try {
    await db().run(sql`select 1`);
    return NextResponse.json({ status: "ok", database: "ok" });
  } catch {
    return NextResponse.json(
      { error: { code: "internal", message: "The database is not reachable", details: [] } },
      { status: 503 },
    );
  }
}
