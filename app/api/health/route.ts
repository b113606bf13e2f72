import { sql } from "drizzle-orm";
import { db } from "@/db";
import { route } from "@/lib/http/route";

export const dynamic = "force-dynamic";

/** Liveness and database reachability, for load balancers and the start script. Public: no session is read. */
export const GET = route({ access: "public" }, async () => {
  try {
    await db.execute(sql`SELECT 1`);
    return Response.json({ status: "ok", db: "up" }, { headers: { "Cache-Control": "no-store" } });
  } catch (err) {
    console.error("[health] database unreachable:", err instanceof Error ? err.message : err);
    return Response.json(
      { status: "unavailable", db: "down", message: "The database is not reachable. Try again shortly." },
      { status: 503, headers: { "Cache-Control": "no-store", "Retry-After": "5" } },
    );
  }
});
