import { requestEm } from "@/lib/db/orm";
import { getRedis } from "@/lib/redis";
import { checkHealth } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** GET /api/v1/health: database and Redis reachability and the version. 503 when either is down. */
export async function GET() {
  const health = await checkHealth(requestEm, getRedis());
  return Response.json(health, {
    status: health.status === "ok" ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
