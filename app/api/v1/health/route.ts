import { requestEm } from "@/lib/db/orm";
import { getHealthOperation } from "@/lib/api/operations/meta";
import { route } from "@/lib/api/route";
import { getRedis } from "@/lib/redis";
import { checkHealth } from "@/lib/services/health";

export const dynamic = "force-dynamic";

export const GET = route(getHealthOperation, async () => {
  const health = await checkHealth(requestEm, getRedis());
  return { status: health.status === "ok" ? 200 : 503, body: health };
});
