"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect } from "react";
import useSWR from "swr";
import { cancelPlanAction } from "@/app/console/plans/actions";
import { ActionForm } from "./ActionForm";

interface PlanState {
  status: "queued" | "running" | "complete" | "failed" | "cancelled";
  progress: { patterns: number; piecesPlaced: number; piecesWanted: number } | null;
  failure: { reason: string; message: string } | null;
  attempts: number;
  startedAt: string | null;
}

const fetcher = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

/**
 * A plan while a worker computes it: its state and progress, read every second (SWR), with a
 * way to cancel it; when it ends, the page reloads to show the plan (or why it failed).
 */
export function PlanProgress({ id, initial, canCancel }: { id: string; initial: PlanState; canCancel: boolean }) {
  const router = useRouter();
  const waiting = initial.status === "queued" || initial.status === "running";
  const { data, error } = useSWR<PlanState>(waiting ? `/console/data/plans/${id}` : null, fetcher, {
    refreshInterval: 1000,
    fallbackData: initial,
  });
  const state = data ?? initial;
  const ended = state.status !== "queued" && state.status !== "running";
  useEffect(() => {
    if (waiting && ended) router.refresh();
  }, [waiting, ended, router]);

  if (state.status === "failed" || state.status === "cancelled") {
    return (
      <section
        role="status"
        data-testid="plan-ended"
        className="max-w-2xl rounded-md border border-scale-200 bg-white p-4 text-sm"
      >
        <h2 className="font-semibold">{state.status === "failed" ? "The plan failed" : "The plan was cancelled"}</h2>
        {state.failure && (
          <p className="mt-1">
            {state.failure.message} <span className="font-mono text-xs text-ink-muted">({state.failure.reason})</span>
          </p>
        )}
        <p className="mt-2 text-ink-muted">
          Nothing was written. Start a new plan from the{" "}
          <Link className="text-edge hover:underline" href="/console/plans/new">
            planner
          </Link>
          .
        </p>
      </section>
    );
  }
  const progress = state.progress;
  const share =
    progress && progress.piecesWanted > 0
      ? Math.min(100, Math.round((100 * progress.piecesPlaced) / progress.piecesWanted))
      : 0;
  return (
    <section
      data-testid="plan-progress"
      className="max-w-2xl space-y-3 rounded-md border border-scale-200 bg-white p-4 text-sm"
    >
      <h2 className="font-semibold">{state.status === "queued" ? "Waiting for a planning worker…" : "Planning…"}</h2>
      <div
        role="progressbar"
        aria-label="Pieces placed"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={share}
        className="h-2 overflow-hidden rounded bg-scale-200"
      >
        <div className="h-full bg-edge transition-all" style={{ width: `${share}%` }} />
      </div>
      <p className="text-ink-muted">
        {progress
          ? `${progress.patterns} sheet pattern${progress.patterns === 1 ? "" : "s"} found · ${progress.piecesPlaced} of ${progress.piecesWanted} pieces placed`
          : "No pattern yet."}
        {state.attempts > 1 ? ` · attempt ${state.attempts} (a worker was lost and another took the plan over)` : ""}
      </p>
      {error && (
        <p role="alert" className="text-fault">
          {(error as Error).message}
        </p>
      )}
      {canCancel && !ended && (
        <ActionForm
          action={cancelPlanAction}
          fields={{ plan: id }}
          confirm="Cancel this plan? Nothing of it is kept."
          buttonClassName="rounded-md border border-fault/50 px-3 py-1.5 text-sm text-fault hover:bg-fault-light"
        >
          Cancel plan
        </ActionForm>
      )}
    </section>
  );
}
