import { NextResponse } from "next/server";
import { PROGRAM_STATUSES, type ProgramStatus } from "@/lib/schemas/enums";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listPrograms } from "@/lib/services/programs";

export const dynamic = "force-dynamic";

/** The console's programs feed (session, any role of the shop). */
export async function GET(request: Request) {
  const member = await currentMember();
  const q = new URL(request.url).searchParams;
  const status = PROGRAM_STATUSES.includes(q.get("status") as ProgramStatus) ? (q.get("status") as ProgramStatus) : undefined;
  try {
    const page = await listPrograms(await requestEm(), member.shopId, { limit: 100, status, cursor: q.get("cursor") ?? undefined });
    return NextResponse.json({
      data: page.data.map((p) => ({ id: p.id, reference: p.reference, title: p.title, status: p.status, validation: p.validation, findings: p.check.findings.length, dueAt: p.dueAt, updatedAt: p.updatedAt })),
      next_cursor: page.next_cursor,
    }, { headers: { "Cache-Control": "no-store" } });
  } catch {
    return NextResponse.json({ error: "The programs could not be read; try again." }, { status: 400 });
  }
}
