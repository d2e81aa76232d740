import { NextResponse } from "next/server";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { isEventType } from "@/lib/schemas/enums";
import { listEvents } from "@/lib/services/webhooks";
import { textProblem } from "@/lib/text";

export const dynamic = "force-dynamic";

/** What an event is about, by name first: a program's or plan's reference, an endpoint's address. */
function about(subjectId: string, data: Record<string, unknown>): { label: string; href: string | null } {
  const program = data.program as { reference?: string } | undefined;
  const plan = data.plan as { reference?: string | null } | undefined;
  const endpoint = data.endpoint as { url?: string } | undefined;
  if (subjectId.startsWith("prg_"))
    return { label: program?.reference ?? subjectId, href: `/console/programs/${subjectId}` };
  if (subjectId.startsWith("pln_"))
    return { label: plan?.reference ?? "a plan without a reference", href: `/console/plans/${subjectId}` };
  if (subjectId.startsWith("whe_"))
    return { label: endpoint?.url ?? subjectId, href: `/console/webhooks/${subjectId}` };
  return { label: subjectId, href: null };
}

/** The console's events feed (session, any role of the shop): a page at a time, newest first. */
export async function GET(request: Request) {
  const member = await currentMember();
  const query = new URL(request.url).searchParams;
  const asked = query.get("type");
  const type = isEventType(asked) ? asked : undefined;
  const cursor = query.get("cursor") ?? undefined;
  if (cursor && textProblem(cursor)) return NextResponse.json({ error: "That page cannot be read." }, { status: 400 });
  try {
    const page = await listEvents(await requestEm(), member.shopId, { limit: 50, type, cursor });
    return NextResponse.json(
      {
        data: page.data.map(({ data, ...fields }) => ({ ...fields, about: about(fields.subjectId, data) })),
        next_cursor: page.next_cursor,
      },
      { headers: { "Cache-Control": "no-store" } },
    );
  } catch {
    return NextResponse.json(
      { error: "The events could not be read; start again from the newest page." },
      { status: 400 },
    );
  }
}
