/** What a gateway may report about a run: never more than the program makes, never backwards. */
import { type ProgramEntity } from "../../entities";
import { invalidRequest } from "../errors";

/** What the program can make, from its stored check: a run's report may not claim more. */
export function programTotals(program: ProgramEntity) {
  const check = program.check as { yield?: { total?: { blanks?: number; strokes?: number } } | null };
  const input = program.input as { sheet?: { count?: number }; cuts?: unknown[] };
  const sheets = input.sheet?.count ?? 1;
  return {
    blanks: check.yield?.total?.blanks ?? 0,
    strokes: check.yield?.total?.strokes ?? 0,
    groups: (input.cuts?.length ?? 0) * sheets,
    sheets,
  };
}

type Limit = { field: string; value: number | undefined; max: number; what: string };

/** Refuse a report that claims more than the program makes (422 naming the field, the value and the limit). */
export function withinProgram(limits: Limit[]) {
  const over = limits.filter((l) => l.value !== undefined && l.value > l.max);
  if (!over.length) return;
  const errors = over.map((limit) => ({
    location: "body",
    pointer: `/${limit.field}`,
    message: `is ${limit.value}; the program has ${limit.max} ${limit.what}`,
  }));
  throw invalidRequest(
    `The report claims more than the program makes: ${errors.map((e) => `${e.pointer} ${e.message}`).join("; ")}.`,
    errors,
  );
}

/** Progress only moves forward: a count below the last report is refused too. */
export function notBackwards(
  program: ProgramEntity,
  report: { groupsDone: number; strokesDone: number; piecesDone?: number },
) {
  const last = program.progress as
    { groupsDone?: number; strokesDone?: number; piecesDone?: number } | null | undefined;
  if (!last) return;
  const errors = (["groupsDone", "strokesDone", "piecesDone"] as const)
    .filter((k) => report[k] !== undefined && last[k] !== undefined && report[k]! < last[k]!)
    .map((field) => ({
      location: "body",
      pointer: `/${field}`,
      message: `is ${report[field]}, below the ${last[field]} reported before; progress only moves forward`,
    }));
  if (errors.length)
    throw invalidRequest(
      `Progress went backwards: ${errors.map((e) => `${e.pointer} ${e.message}`).join("; ")}.`,
      errors,
    );
}
