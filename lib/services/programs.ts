/**
 * Cut programs: create (checked by the shear core and stored with its findings, setup,
 * yield and estimate), read, list, update drafts, dry-run check, release and cancel.
 * Every change and its event are written in one transaction.
 */
import { OptimisticLockError, UniqueConstraintViolationException, type EntityManager } from "@mikro-orm/postgresql";
import { Program, type ProgramEntity, type ShearEntity } from "../../entities";
import type { ProgramStatus } from "../../entities/Program";
import { ApiError, conflict, notFound, preconditionFailed, preconditionRequired } from "../errors";

import type { ProgramInputT, ProgramLayoutT, ProgramPatchT, ProgramT, ProgramValidationT } from "../schemas/program";
import type { RoutingT } from "../schemas/settings";
import type { CheckT } from "../schemas/check";
import { checkProgram, programLayout, remnantToleranceMm, type CheckResult } from "../shear";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { announceRelease, recordEvent, type EventType } from "./events";
import { existingReferences, gradesByCode, shearsNamed } from "./lookups";
import { applyInput, duplicateReference, shearRefusal } from "./program-create";
import { viewProgram } from "./program-view";
import { activeShear, routeProgram } from "./routing";
import { releaseForProgram } from "./stock";
import { readsOf } from "../db/reads";

export { createProgram } from "./program-create";

const CANCELLABLE: ProgramStatus[] = ["draft", "released", "claimed", "running"];

export const etagOf = (revision: number) => `"${revision}"`;

/**
 * Run the shear core on a program with the shop's current catalog. A program that names no shear
 * is routed (lib/services/routing.ts) and from then on names the one chosen.
 */
export async function runCheck(
  em: EntityManager,
  shopId: string,
  input: ProgramInputT,
  opts: { allowNone?: boolean } = {},
): Promise<{ shear: ShearEntity; check: CheckResult; routing: RoutingT | null }> {
  if (input.shear === undefined) {
    const routed = await routeProgram(em, shopId, input, opts);
    input.shear = routed.shear.id;
    return routed;
  }
  const [shear, grade] = await readsOf(
    em,
    () => activeShear(em, shopId, input.shear!),
    () => gradeByCode(em, shopId, input.grade),
  );
  const check = checkProgram(input, { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null });
  // A shear named by name is stored by id: renaming it later changes nothing about the program.
  input.shear = shear.id;
  return { shear, check, routing: null };
}

/**
 * The dry run: the same check as create, with the reads concurrent requests share (lib/services/lookups.ts).
 * A program that names no shear is checked on every active shear, and the answer says which can run it.
 */
export async function validateProgram(
  em: EntityManager,
  shopId: string,
  input: ProgramInputT,
): Promise<ProgramValidationT> {
  if (input.shear === undefined) {
    const { check, routing } = await runCheck(em, shopId, input, { allowNone: true });
    return { ...(check as CheckT), routing };
  }
  const key = input.shear.trim();
  const [shearOf, grades] = await readsOf(
    em,
    () => shearsNamed(em, shopId, [key]),
    () => gradesByCode(em, shopId, [input.grade]),
  );
  const shear = shearOf(key);
  if (!shear || shear.archivedAt) throw shearRefusal("program", Boolean(shear));
  const grade = grades.get(input.grade);
  const check = checkProgram(input, { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null });
  return { ...(check as CheckT), routing: null };
}

async function byReference(em: EntityManager, shopId: string, reference: string) {
  return (await existingReferences(em, shopId, [reference])).get(reference) ?? null;
}

export async function findProgram(em: EntityManager, shopId: string, id: string): Promise<ProgramEntity> {
  const program = await em.findOne(Program, { id, shop: shopId });
  if (!program) throw notFound("program");
  return program;
}

/**
 * One sheet of the program as it is cut (its current revision), placed with the remnant tolerance its
 * check counted with, so it shows what the check's yield counts even after the shear's repeatability
 * changed; a check stored before it reported its tolerance gets the shear's as it is now. Not stored, so a
 * check stays small: placed when it is read.
 */
export async function readProgramLayout(em: EntityManager, program: ProgramEntity): Promise<ProgramLayoutT> {
  const toleranceMm = program.check?.yield?.remnantToleranceMm ?? (await shearToleranceMm(em, program.shear.id));
  return { id: program.id, revision: program.revision, layout: programLayout(program.input, toleranceMm) };
}

/** The shear's remnant tolerance as it is now (its stated repeatability, or the core's default). */
async function shearToleranceMm(em: EntityManager, shearId: string): Promise<number> {
  const [shear] = await em
    .getConnection()
    .execute<{ repeatability: number | null }[]>(
      "select backgauge_repeatability_mm as repeatability from shears where id = ?",
      [shearId],
    );
  return remnantToleranceMm({ backgaugeRepeatabilityMm: shear?.repeatability ?? null });
}

/** Check If-Match against the program's revision: 428 when missing, 412 when stale. */
export function checkIfMatch(program: ProgramEntity, ifMatch: string | null) {
  if (ifMatch === null) throw preconditionRequired("Send If-Match with the ETag you read (GET the program first).");
  const tags = ifMatch.split(",").map((t) => t.trim().replace(/^W\//, ""));
  if (!tags.includes("*") && !tags.includes(etagOf(program.revision))) {
    throw preconditionFailed(`The program is at revision ${program.revision}; read it again and retry.`, {
      currentRevision: program.revision,
    });
  }
}

export function mustBe(program: ProgramEntity, allowed: ProgramStatus[], action: string) {
  if (!allowed.includes(program.status)) {
    throw conflict(`A ${program.status} program cannot be ${action}.`, {
      currentStatus: program.status,
      allowedFrom: allowed,
    });
  }
}

export async function updateProgram(
  em: EntityManager,
  shopId: string,
  id: string,
  patch: ProgramPatchT,
  ifMatch: string | null,
): Promise<ProgramT> {
  const program = await findProgram(em, shopId, id);
  checkIfMatch(program, ifMatch);
  mustBe(program, ["draft"], "edited");
  const input = { ...program.input, ...patch };
  if (patch.reference && patch.reference !== program.reference) {
    const existingId = await byReference(em, shopId, patch.reference);
    if (existingId) throw duplicateReference(patch.reference, existingId);
  }
  const { shear, check } = await runCheck(em, shopId, input);
  try {
    return await em.transactional(async (tx) => {
      const current = await tx.findOneOrFail(Program, { id });
      if (current.revision !== program.revision)
        throw preconditionFailed(
          `The program changed meanwhile (revision ${current.revision}); read it again and retry.`,
          {
            currentRevision: current.revision,
          },
        );
      current.shear = shear;
      applyInput(current, input, check);
      await tx.flush();
      const view = viewProgram(current);
      await recordEvent(tx, shopId, "program.updated", current.id, { program: view, changed: Object.keys(patch) });
      return view;
    });
  } catch (err) {
    if (err instanceof OptimisticLockError)
      throw preconditionFailed("The program changed meanwhile; read it again and retry.");
    if (err instanceof UniqueConstraintViolationException)
      throw duplicateReference(input.reference, await byReference(em.fork(), shopId, input.reference));
    throw err;
  }
}

export async function releaseProgram(
  em: EntityManager,
  shopId: string,
  id: string,
  acknowledge: string[] = [],
): Promise<ProgramT> {
  const program = await findProgram(em, shopId, id);
  mustBe(program, ["draft"], "released");
  // Check again: the shear or grade may have changed since the program was stored.
  const { check } = await runCheck(em, shopId, program.input);
  if (check.validation === "fail") {
    throw new ApiError(
      409,
      "program-not-releasable",
      "The program has errors",
      "Fix the findings of severity `error` before releasing.",
      {
        validation: check.validation,
        findings: check.findings,
      },
    );
  }
  const warnings = [...new Set(check.findings.filter((f) => f.severity === "warning").map((f) => f.code))];
  const missing = warnings.filter((c) => !acknowledge.includes(c));
  if (missing.length) {
    throw new ApiError(
      409,
      "warnings-not-acknowledged",
      "Acknowledge the warnings to release",
      `Release again with "acknowledge": ${JSON.stringify(warnings)} once you have read them.`,
      {
        validation: check.validation,
        unacknowledged: missing,
        findings: check.findings.filter((f) => f.severity === "warning"),
      },
    );
  }
  return transition(em, shopId, program, "released", "program.released", (row) => {
    row.validation = check.validation;
    row.check = check;
    row.acknowledged = warnings;
    row.releasedAt = new Date();
  });
}

export async function cancelProgram(em: EntityManager, shopId: string, id: string, reason?: string): Promise<ProgramT> {
  const program = await findProgram(em, shopId, id);
  mustBe(program, CANCELLABLE, "cancelled");
  return transition(
    em,
    shopId,
    program,
    "cancelled",
    "program.cancelled",
    (p) => {
      p.cancelledAt = new Date();
      p.leaseExpiresAt = null;
    },
    { reason: reason ?? null },
    (tx, p) => releaseForProgram(tx, shopId, p.id),
  );
}

/**
 * Move a program to another state (or the same one, for progress), with its event, in one
 * transaction. Only from the state and revision that were read: a concurrent change makes
 * this one answer 409 with the state it found.
 */
export async function transition(
  em: EntityManager,
  shopId: string,
  program: ProgramEntity,
  to: ProgramStatus,
  type: EventType,
  change: (row: ProgramEntity) => void,
  extra: Record<string, unknown> = {},
  /** more to do in the same transaction (a cancelled program's stock goes back) */
  also?: (tx: EntityManager, row: ProgramEntity) => Promise<unknown>,
): Promise<ProgramT> {
  const from = program.status;
  try {
    return await em.transactional(async (tx) => {
      // Only move from the state we read; a concurrent transition makes this one fail cleanly.
      const current = await tx.findOneOrFail(Program, { id: program.id });
      if (current.status !== from || current.revision !== program.revision) {
        throw conflict(`The program changed meanwhile and is now ${current.status}.`, {
          currentStatus: current.status,
        });
      }
      current.status = to;
      change(current);
      await tx.flush();
      if (to === "released") await announceRelease(tx, current.shear.id);
      const view = viewProgram(current);
      await recordEvent(tx, shopId, type, current.id, { program: view, from, ...extra });
      await also?.(tx, current);
      return view;
    });
  } catch (err) {
    if (err instanceof OptimisticLockError) {
      const now = await em.fork().findOne(Program, { id: program.id });
      throw conflict(`The program changed meanwhile and is now ${now?.status}.`, { currentStatus: now?.status });
    }
    throw err;
  }
}
