import { NextResponse } from "next/server";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listRequests, type LogFilter } from "@/lib/services/logs";
import { textProblem } from "@/lib/text";

export const dynamic = "force-dynamic";

/** The console's request log feed (session, any role of the shop): newest first, filtered. */
export async function GET(request: Request) {
  const member = await currentMember();
  const query = new URL(request.url).searchParams;
  const hours = [1, 24, 168].includes(Number(query.get("hours"))) ? Number(query.get("hours")) : 24;
  const status = query.get("status");
  const id = query.get("id")?.trim();
  for (const value of [id, query.get("cursor"), query.get("key"), query.get("route")]) {
    if (value && textProblem(value))
      return NextResponse.json({ error: "The filter holds characters that cannot be searched for." }, { status: 400 });
  }
  const filter: LogFilter = {
    limit: 50,
    cursor: query.get("cursor") ?? undefined,
    id: id || undefined,
    keyId: query.get("key") || undefined,
    route: query.get("route") || undefined,
    statusClass:
      status && ["2xx", "3xx", "4xx", "5xx"].includes(status) ? (status as LogFilter["statusClass"]) : undefined,
    from: id ? undefined : new Date(Date.now() - hours * 3_600_000),
  };
  try {
    const page = await listRequests(await requestEm(), member.shopId, filter);
    return NextResponse.json(
      { data: page.data.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })), next_cursor: page.next_cursor },
      { headers: { "Cache-Control": "no-store" } },
    );
  } catch {
    return NextResponse.json({ error: "The log could not be read; try again." }, { status: 400 });
  }
}
