/** How a stored program reads in the API, in events and in the console. */
import { type ProgramEntity } from "../../entities";
import type { ProgramInputT, ProgramT } from "../schemas/program";
import type { CheckT } from "../schemas/check";

/** What the view reads of a program: a stored one, or one about to be written. */
export type ProgramRecord = Pick<
  ProgramEntity,
  | "id"
  | "status"
  | "revision"
  | "reference"
  | "title"
  | "input"
  | "gradeCode"
  | "priority"
  | "dueAt"
  | "metadata"
  | "validation"
  | "check"
  | "acknowledged"
  | "releasedAt"
  | "cancelledAt"
  | "claimedBy"
  | "claimedAt"
  | "leaseExpiresAt"
  | "leaseExpiries"
  | "startedAt"
  | "finishedAt"
  | "progress"
  | "outcome"
  | "routing"
  | "createdAt"
  | "updatedAt"
> & { shear: { id: string } };

export function viewProgram(p: ProgramRecord): ProgramT {
  const input = p.input as ProgramInputT;
  return {
    id: p.id,
    status: p.status,
    revision: p.revision,
    reference: p.reference,
    title: p.title ?? null,
    shear: p.shear.id,
    routing: p.routing ?? null,
    grade: p.gradeCode,
    thickness: input.thickness,
    units: input.units,
    sheet: input.sheet,
    cuts: input.cuts,
    ...(input.setup ? { setup: input.setup } : {}),
    priority: p.priority,
    dueAt: p.dueAt?.toISOString() ?? null,
    metadata: p.metadata ?? {},
    validation: p.validation as ProgramT["validation"],
    check: p.check as CheckT,
    acknowledged: p.acknowledged ?? [],
    releasedAt: p.releasedAt?.toISOString() ?? null,
    cancelledAt: p.cancelledAt?.toISOString() ?? null,
    run: {
      claimedBy: p.claimedBy ?? null,
      claimedAt: p.claimedAt?.toISOString() ?? null,
      leaseExpiresAt: p.leaseExpiresAt?.toISOString() ?? null,
      leaseExpiries: p.leaseExpiries ?? 0,
      startedAt: p.startedAt?.toISOString() ?? null,
      finishedAt: p.finishedAt?.toISOString() ?? null,
      progress: p.progress ?? null,
      outcome: p.outcome ?? null,
    },
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
