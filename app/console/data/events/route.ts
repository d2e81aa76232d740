import { NextResponse } from "next/server";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES } from "@/lib/services/event-types";
import { listEvents } from "@/lib/services/webhooks";

export const dynamic = "force-dynamic";

/** The console's events feed (session, any role of the shop). */
export async function GET(request: Request) {
  const member = await currentMember();
  const q = new URL(request.url).searchParams;
  const type = (EVENT_TYPES as readonly string[]).includes(q.get("type") ?? "") ? q.get("type")! : undefined;
  try {
    const page = await listEvents(await requestEm(), member.shopId, { limit: 100, type, cursor: q.get("cursor") ?? undefined });
    return NextResponse.json({ data: page.data.map(({ data: _d, ...e }) => e), next_cursor: page.next_cursor }, { headers: { "Cache-Control": "no-store" } });
  } catch {
    return NextResponse.json({ error: "The events could not be read; try again." }, { status: 400 });
  }
}
