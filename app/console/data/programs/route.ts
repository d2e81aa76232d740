import { NextResponse } from "next/server";
import { isProgramStatus } from "@/lib/schemas/enums";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listPrograms } from "@/lib/services/program-list";
import { textProblem } from "@/lib/text";

export const dynamic = "force-dynamic";

/** The console's programs feed (session, any role of the shop): a page at a time, newest first, by state and search. */
export async function GET(request: Request) {
  const member = await currentMember();
  const query = new URL(request.url).searchParams;
  const asked = query.get("status");
  const status = isProgramStatus(asked) ? asked : undefined;
  const search = query.get("search")?.trim().slice(0, 100) || undefined;
  const cursor = query.get("cursor") ?? undefined;
  if ((search && textProblem(search)) || (cursor && textProblem(cursor)))
    return NextResponse.json({ error: "The search holds characters that cannot be searched for." }, { status: 400 });
  try {
    const page = await listPrograms(await requestEm(), member.shopId, { limit: 50, status, search, cursor });
    return NextResponse.json(
      {
        data: page.data.map((program) => ({
          id: program.id,
          reference: program.reference,
          title: program.title,
          status: program.status,
          validation: program.validation,
          findings: program.check.findings.length,
          dueAt: program.dueAt,
          updatedAt: program.updatedAt,
        })),
        next_cursor: page.next_cursor,
      },
      { headers: { "Cache-Control": "no-store" } },
    );
  } catch {
    return NextResponse.json(
      { error: "The programs could not be read; start again from the newest page." },
      { status: 400 },
    );
  }
}
