import { NextResponse } from "next/server";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { findPlan } from "@/lib/services/plans";
import { viewPlanSummary } from "@/lib/services/plan-views";

export const dynamic = "force-dynamic";

/** The console's view of one plan while it is computed (session, any role of the shop): state and progress. */
export async function GET(_request: Request, { params }: { params: Promise<{ id: string }> }) {
  const member = await currentMember();
  const { id } = await params;
  if (!/^pln_[0-9A-Z]{26}$/.test(id)) return NextResponse.json({ error: "No plan with that id." }, { status: 404 });
  const plan = await findPlan(await requestEm(), member.shopId, id).catch(() => null);
  if (!plan) return NextResponse.json({ error: "No plan with that id in this shop." }, { status: 404 });
  const { status, progress, failure, attempts, startedAt } = viewPlanSummary(plan);
  return NextResponse.json(
    { status, progress, failure, attempts, startedAt },
    { headers: { "Cache-Control": "no-store" } },
  );
}
