/** The console's overview numbers for one shop. */
import type { EntityManager } from "@mikro-orm/postgresql";

export async function overview(em: EntityManager, shopId: string) {
  const conn = em.getConnection();
  const hourAgo = new Date(Date.now() - 3_600_000);
  const [requests] = await conn.execute<{ total: string; errors: string }[]>(
    "select count(*) as total, count(*) filter (where status >= 500 or status = 429) as errors from request_logs where shop_id = ? and created_at >= ?",
    [shopId, hourAgo],
  );
  const [deliveries] = await conn.execute<{ total: string; ok: string; failing: string }[]>(
    `select count(*) as total, count(*) filter (where status = 'succeeded') as ok, count(*) filter (where status = 'failed') as failing
     from deliveries where shop_id = ? and created_at >= ?`,
    [shopId, new Date(Date.now() - 86_400_000)],
  );
  const byStatus = await conn.execute<{ status: string; n: string }[]>(
    "select status, count(*) as n from programs where shop_id = ? group by status",
    [shopId],
  );
  const perMinute = await conn.execute<{ minute: Date; n: string }[]>(
    "select date_trunc('minute', created_at) as minute, count(*) as n from request_logs where shop_id = ? and created_at >= ? group by 1 order by 1",
    [shopId, hourAgo],
  );
  const [endpoints] = await conn.execute<{ disabled: string }[]>(
    "select count(*) filter (where not enabled) as disabled from webhook_endpoints where shop_id = ?",
    [shopId],
  );
  const [setup] = await conn.execute<
    { shears: string; grades: string; keys: string; endpoints: string; programs: string; released: string }[]
  >(
    `select (select count(*) from shears where shop_id = ? and archived_at is null) as shears,
            (select count(*) from grades where shop_id = ? and archived_at is null) as grades,
            (select count(*) from api_keys where shop_id = ? and revoked_at is null) as keys,
            (select count(*) from webhook_endpoints where shop_id = ?) as endpoints,
            (select count(*) from programs where shop_id = ?) as programs,
            (select count(*) from programs where shop_id = ? and released_at is not null) as released`,
    Array(6).fill(shopId),
  );
  const total = Number(requests.total);
  const delivered = Number(deliveries.total);
  return {
    requestsLastHour: total,
    errorRatePct: total ? Math.round((Number(requests.errors) / total) * 1000) / 10 : 0,
    deliverySuccessPct: delivered ? Math.round((Number(deliveries.ok) / delivered) * 1000) / 10 : null,
    failedDeliveries: Number(deliveries.failing),
    disabledEndpoints: Number(endpoints.disabled),
    programsByStatus: Object.fromEntries(byStatus.map((r) => [r.status, Number(r.n)])) as Record<string, number>,
    requestsPerMinute: lastHour(perMinute.map((r) => ({ minute: new Date(r.minute).toISOString(), n: Number(r.n) }))),
    /** a new shop's first steps, each done or not */
    setup: {
      shear: Number(setup.shears) > 0,
      grades: Number(setup.grades) > 0,
      key: Number(setup.keys) > 0,
      endpoint: Number(setup.endpoints) > 0,
      program: Number(setup.programs) > 0,
      released: Number(setup.released) > 0,
    },
  };
}

/** Every minute of the last hour, with zeros where nothing came in. */
function lastHour(counts: { minute: string; n: number }[]) {
  const byMinute = new Map(counts.map((c) => [c.minute, c.n]));
  const now = Math.floor(Date.now() / 60_000) * 60_000;
  return Array.from({ length: 60 }, (_, index) => {
    const minute = new Date(now - (59 - index) * 60_000).toISOString();
    return { minute, n: byMinute.get(minute) ?? 0 };
  });
}
