/** How a stored program reads in the API, in events and in the console. */
import { type ProgramEntity } from "../../entities";
import type { ProgramT } from "../schemas/program";

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

export function viewProgram(program: ProgramRecord): ProgramT {
  const input = program.input;
  return {
    id: program.id,
    status: program.status,
    revision: program.revision,
    reference: program.reference,
    title: program.title ?? null,
    shear: program.shear.id,
    routing: program.routing ?? null,
    grade: program.gradeCode,
    thickness: input.thickness,
    units: input.units,
    sheet: input.sheet,
    cuts: input.cuts,
    ...(input.setup ? { setup: input.setup } : {}),
    priority: program.priority,
    dueAt: program.dueAt?.toISOString() ?? null,
    metadata: program.metadata ?? {},
    validation: program.validation,
    check: program.check,
    acknowledged: program.acknowledged ?? [],
    releasedAt: program.releasedAt?.toISOString() ?? null,
    cancelledAt: program.cancelledAt?.toISOString() ?? null,
    run: {
      claimedBy: program.claimedBy ?? null,
      claimedAt: program.claimedAt?.toISOString() ?? null,
      leaseExpiresAt: program.leaseExpiresAt?.toISOString() ?? null,
      leaseExpiries: program.leaseExpiries ?? 0,
      startedAt: program.startedAt?.toISOString() ?? null,
      finishedAt: program.finishedAt?.toISOString() ?? null,
      progress: program.progress ?? null,
      outcome: program.outcome ?? null,
    },
    createdAt: program.createdAt.toISOString(),
    updatedAt: program.updatedAt.toISOString(),
  };
}
