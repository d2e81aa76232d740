/**
 * The machine side: gateways claim released programs under a lease (never two at once:
 * FOR UPDATE SKIP LOCKED), keep it with heartbeats, and report start, progress, completion
 * or failure. A sweeper returns programs whose lease ran out to `released`.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import type { z } from "zod";
import { Program, Shear, type ProgramEntity } from "../../entities";
import type { ProgramStatus } from "../../entities/Program";
import { conflict, forbidden, notFound } from "../errors";
import type { CompletionReportSchema, FailureReportSchema, ProgressReportSchema } from "../schemas/gateway";
import type { ProgramT } from "../schemas/program";
import { waitForNotification } from "../db/notify";
import { announceRelease, RELEASED_CHANNEL, recordEvent } from "./events";
import type { Principal } from "./keys";
import { findProgram, mustBe, transition } from "./programs";
import { viewProgram } from "./program-view";
import { programTotals, withinProgram, notBackwards } from "./run-reports";
import { bookRun } from "./booking";

export const DEFAULT_LEASE_SECONDS = 60;
/** A waiting gateway is woken by the release itself (NOTIFY on commit); this slow poll is only a safety net. */
const SAFETY_POLL_MS = 5_000;

function boundTo(principal: Principal, shearId: string) {
  if (principal.shearIds.length && !principal.shearIds.includes(shearId)) {
    throw forbidden(`This gateway key is bound to ${principal.shearIds.join(", ")}, not to ${shearId}.`, {
      shearIds: principal.shearIds,
    });
  }
}

const leaseUntil = (seconds: number) => new Date(Date.now() + seconds * 1000);

/** Return to `released` every program of the shop (or one shear) whose lease has run out. */
export async function sweepExpiredLeases(
  em: EntityManager,
  scope: { shopId?: string; shearId?: string } = {},
): Promise<string[]> {
  return em.transactional(async (tx) => {
    const rows = await tx.execute<{ id: string }[]>(
      `select id from programs where status in ('claimed', 'running') and lease_expires_at < now()
       ${scope.shopId ? "and shop_id = ?" : ""} ${scope.shearId ? "and shear_id = ?" : ""}
       order by lease_expires_at limit 100 for update skip locked`,
      [scope.shopId, scope.shearId].filter(Boolean) as string[],
    );
    const returned: string[] = [];
    for (const { id } of rows) {
      const program = await tx.findOneOrFail(Program, { id }, { populate: ["shop"] });
      const from = program.status;
      const gateway = program.claimedBy;
      const expiredAt = program.leaseExpiresAt;
      program.status = "released";
      program.claimedBy = null;
      program.leaseExpiresAt = null;
      program.leaseExpiries = (program.leaseExpiries ?? 0) + 1;
      await tx.flush();
      await announceRelease(tx, program.shear.id);
      await recordEvent(tx, program.shop.id, "program.lease_expired", program.id, {
        program: viewProgram(program),
        from,
        gateway: gateway ?? "unknown",
        reason: `No heartbeat from gateway key ${gateway} before the lease ran out at ${expiredAt?.toISOString()}; the program is released again.`,
      });
      returned.push(program.id);
    }
    return returned;
  });
}

/** Claim the next released program of a shear: highest priority, then earliest due, then oldest. */
async function claimOnce(
  em: EntityManager,
  principal: Principal,
  shearId: string,
  leaseSeconds: number,
): Promise<ProgramT | null> {
  return em.transactional(async (tx) => {
    const rows = await tx.execute<{ id: string }[]>(
      `update programs set status = 'claimed', claimed_by = ?, claimed_at = now(), lease_expires_at = ?,
         progress = null, outcome = null, started_at = null, revision = revision + 1, updated_at = now()
       where id = (
         select id from programs where shop_id = ? and shear_id = ? and status = 'released'
         order by priority desc, due_at asc nulls last, id asc
         limit 1 for update skip locked)
       returning id`,
      [principal.keyId, leaseUntil(leaseSeconds), principal.shopId, shearId],
    );
    if (!rows.length) return null;
    const program = await tx.findOneOrFail(Program, { id: rows[0].id });
    const view = viewProgram(program);
    await recordEvent(tx, principal.shopId, "program.claimed", program.id, {
      program: view,
      from: "released",
      gateway: principal.keyId,
    });
    return view;
  });
}

export async function claimNext(
  em: EntityManager,
  principal: Principal,
  shearId: string,
  opts: { waitSeconds?: number; leaseSeconds?: number; signal?: AbortSignal },
): Promise<{ program: ProgramT; lease: { expiresAt: string; seconds: number } } | null> {
  const shear = await em.findOne(Shear, { id: shearId, shop: principal.shopId });
  if (!shear) throw notFound("shear");
  boundTo(principal, shearId);
  const seconds = opts.leaseSeconds ?? DEFAULT_LEASE_SECONDS;
  const deadline = Date.now() + (opts.waitSeconds ?? 0) * 1000;
  for (;;) {
    // Listen before looking, so a program released in between still wakes this wait.
    const left = deadline - Date.now();
    const stop = new AbortController();
    const signal = opts.signal ? AbortSignal.any([stop.signal, opts.signal]) : stop.signal;
    const woken =
      left > 0 ? waitForNotification(RELEASED_CHANNEL, shearId, Math.min(SAFETY_POLL_MS, left), signal) : null;
    try {
      await sweepExpiredLeases(em.fork(), { shopId: principal.shopId, shearId });
      const program = await claimOnce(em.fork(), principal, shearId, seconds);
      if (program) return { program, lease: { expiresAt: program.run.leaseExpiresAt!, seconds } };
      if (!woken || opts.signal?.aborted) return null;
      await woken;
      if (Date.now() >= deadline || opts.signal?.aborted) {
        // One last look: the wait may have ended on the very notification of a release.
        const last = await claimOnce(em.fork(), principal, shearId, seconds);
        return last ? { program: last, lease: { expiresAt: last.run.leaseExpiresAt!, seconds } } : null;
      }
    } finally {
      stop.abort();
    }
  }
}

/** The program, held by this gateway, in one of the given states. */
async function held(
  em: EntityManager,
  principal: Principal,
  id: string,
  allowed: ProgramStatus[],
  action: string,
): Promise<ProgramEntity> {
  const program = await findProgram(em, principal.shopId, id);
  boundTo(principal, program.shear.id);
  mustBe(program, allowed, action);
  if (program.claimedBy !== principal.keyId) {
    throw conflict("Another gateway holds this program's lease.", { currentStatus: program.status });
  }
  return program;
}

export async function heartbeat(
  em: EntityManager,
  principal: Principal,
  id: string,
  leaseSeconds = DEFAULT_LEASE_SECONDS,
) {
  const program = await held(em, principal, id, ["claimed", "running"], "kept");
  program.leaseExpiresAt = leaseUntil(leaseSeconds);
  await em.flush();
  return {
    program: viewProgram(program),
    lease: { expiresAt: program.leaseExpiresAt.toISOString(), seconds: leaseSeconds },
  };
}

export async function start(em: EntityManager, principal: Principal, id: string) {
  const program = await held(em, principal, id, ["claimed"], "started");
  return transition(em, principal.shopId, program, "running", "program.started", (p) => {
    p.startedAt = new Date();
    p.leaseExpiresAt = leaseUntil(DEFAULT_LEASE_SECONDS);
  });
}

export async function progress(
  em: EntityManager,
  principal: Principal,
  id: string,
  report: z.infer<typeof ProgressReportSchema>,
) {
  const program = await held(em, principal, id, ["running"], "reported on");
  const { leaseSeconds, ...counts } = report;
  const totals = programTotals(program);
  withinProgram([
    { field: "groupsDone", value: counts.groupsDone, max: totals.groups, what: "cut groups over all its sheets" },
    { field: "strokesDone", value: counts.strokesDone, max: totals.strokes, what: "strokes" },
    { field: "piecesDone", value: counts.piecesDone, max: totals.blanks, what: "blanks" },
  ]);
  notBackwards(program, counts);
  return transition(
    em,
    principal.shopId,
    program,
    "running",
    "program.progressed",
    (row) => {
      row.progress = counts;
      row.leaseExpiresAt = leaseUntil(leaseSeconds ?? DEFAULT_LEASE_SECONDS);
    },
    { progress: counts },
  );
}

export async function complete(
  em: EntityManager,
  principal: Principal,
  id: string,
  report: z.infer<typeof CompletionReportSchema>,
) {
  const program = await held(em, principal, id, ["running"], "completed");
  const totals = programTotals(program);
  withinProgram([
    {
      field: "goodPieces",
      value: report.goodPieces + (report.scrappedPieces ?? 0),
      max: totals.blanks,
      what: "blanks (good and scrapped pieces together)",
    },
    { field: "sheetsUsed", value: report.sheetsUsed, max: totals.sheets, what: "sheets" },
  ]);
  return transition(
    em,
    principal.shopId,
    program,
    "completed",
    "program.completed",
    (row) => {
      row.finishedAt = new Date();
      row.leaseExpiresAt = null;
      row.outcome = { result: "completed", ...report };
    },
    { outcome: report },
    (tx, p) => bookRun(tx, principal.shopId, p, report.sheetsUsed ?? totals.sheets, true),
  );
}

export async function fail(
  em: EntityManager,
  principal: Principal,
  id: string,
  report: z.infer<typeof FailureReportSchema>,
) {
  const program = await held(em, principal, id, ["claimed", "running"], "failed");
  const totals = programTotals(program);
  withinProgram([
    {
      field: "goodPieces",
      value: (report.goodPieces ?? 0) + (report.scrappedPieces ?? 0),
      max: totals.blanks,
      what: "blanks (good and scrapped pieces together)",
    },
    { field: "sheetsUsed", value: report.sheetsUsed, max: totals.sheets, what: "sheets" },
  ]);
  return transition(
    em,
    principal.shopId,
    program,
    "failed",
    "program.failed",
    (row) => {
      row.finishedAt = new Date();
      row.leaseExpiresAt = null;
      row.outcome = { result: "failed", ...report };
    },
    { outcome: report },
    (tx, p) => bookRun(tx, principal.shopId, p, report.sheetsUsed ?? 0, false),
  );
}
