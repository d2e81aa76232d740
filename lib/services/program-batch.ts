/**
 * Many programs in one request. Each is read with the same schema and checked the same way
 * as a single create; the whole batch is written in one transaction. All or nothing by
 * default (one problem naming every program that cannot be created, nothing written), or
 * program by program, each answered with its program or its problem, in order.
 */
import { UniqueConstraintViolationException, type EntityManager } from "@mikro-orm/postgresql";
import { ApiError, conflict, invalidRequest } from "../errors";
import { ProgramInputSchema, type ProgramBatchResultT, type ProgramInputT, type ProgramT } from "../schemas/program";
import { existingReferences } from "./lookups";
import { checkPrograms, duplicateReference, storePrograms, type Checked } from "./program-create";

type ItemError = { location: string; pointer: string; message: string };
type ProblemT = Extract<ProgramBatchResultT, { problem: unknown }>["problem"];

/** The same refusal with its pointers moved into the batch body, under `/programs/{index}`. */
function within(index: number, err: ApiError): ApiError {
  const errors = (err.extensions.errors as ItemError[] | undefined)?.map((e) => ({
    ...e,
    pointer: `/programs/${index}${e.pointer}`,
  }));
  return new ApiError(
    err.status,
    err.slug,
    err.title,
    `Program ${index}: ${err.message}`,
    {
      ...err.extensions,
      index,
      ...(errors ? { errors } : {}),
    },
    err.headers,
  );
}

/** Each item read by the program schema; a reference sent twice is refused the second time. */
function readItems(items: unknown[]): (ProgramInputT | ApiError)[] {
  const seen = new Map<string, number>();
  return items.map((item, index) => {
    const parsed = ProgramInputSchema.safeParse(item);
    if (!parsed.success) {
      const errors = parsed.error.issues.map((issue) => ({
        location: "body",
        pointer: `/programs/${index}${issue.path.map((p) => `/${String(p)}`).join("")}`,
        message: issue.message,
      }));
      return new ApiError(
        422,
        "invalid-request",
        "The request does not match the schema",
        `Program ${index}: ${errors[0].pointer}: ${errors[0].message}.`,
        { index, errors },
      );
    }
    const first = seen.get(parsed.data.reference);
    if (first !== undefined)
      return conflict(
        `Program ${index}: reference "${parsed.data.reference}" is also program ${first} of this batch.`,
        {
          index,
          existingId: null,
        },
      );
    seen.set(parsed.data.reference, index);
    return parsed.data;
  });
}

/**
 * Each item checked, or its refusal, in order. The shop's references are not read before the
 * write: most batches bring new ones, and the unique index refuses a taken one when the batch is
 * written (`createBatch` and `createEach` then read which). They are read here only when some
 * program is refused anyway, or inside a caller's transaction (where a refused write would abort
 * it), so that a refusal names a taken reference first, as a single create does.
 */
async function checkItems(em: EntityManager, shopId: string, items: unknown[]): Promise<(Checked | ApiError)[]> {
  const read = readItems(items);
  const valid = read.flatMap((r, index) => (r instanceof ApiError ? [] : [{ index, input: r }]));
  const inputs = valid.map((v) => v.input);
  const inTransaction = em.isInTransaction();
  const checked = await checkPrograms(em, shopId, inputs, { references: inTransaction });
  const refused = read.length !== valid.length || checked.some((c) => c instanceof ApiError);
  const taken =
    refused && !inTransaction
      ? await existingReferences(
          em,
          shopId,
          inputs.map((input) => input.reference),
        )
      : new Map<string, string>();
  valid.forEach((item, index) => {
    const existingId = taken.get(item.input.reference);
    const outcome = existingId ? duplicateReference(item.input.reference, existingId) : checked[index];
    read[item.index] = outcome instanceof ApiError ? within(item.index, outcome) : (outcome as never);
  });
  return read as (Checked | ApiError)[];
}

/** One problem for an all-or-nothing batch that cannot be written: 422 if any program is invalid, else 409. */
function batchRefusal(count: number, failed: ApiError[]): ApiError {
  const status = failed.some((f) => f.status === 422) ? 422 : 409;
  const detail = `${failed.length} of the ${count} programs cannot be created, so none was: ${failed
    .slice(0, 3)
    .map((f) => f.message)
    .join(" ")}${failed.length > 3 ? " …" : ""}`;
  const failures = failed.map((f) => f.toProblem());
  const errors = failed.flatMap((f) => (f.extensions.errors as ItemError[] | undefined) ?? []);
  if (status === 422) return invalidRequest(detail, errors, { failures });
  return conflict(detail, { failures });
}

/** All or nothing: the programs created, or one refusal naming every program that cannot be. */
export async function createBatch(em: EntityManager, shopId: string, items: unknown[]): Promise<ProgramT[]> {
  const checked = await checkItems(em, shopId, items);
  const failed = checked.filter((c): c is ApiError => c instanceof ApiError);
  if (failed.length) throw batchRefusal(items.length, failed);
  try {
    return await storePrograms(em, shopId, checked as Checked[]);
  } catch (err) {
    if (!(err instanceof UniqueConstraintViolationException)) throw err;
    // A reference is taken (by an earlier program, or by a concurrent writer since the check): say which.
    const existing = await existingReferences(
      em.fork(),
      shopId,
      (checked as Checked[]).map((c) => c.input.reference),
    );
    const taken = (checked as Checked[]).flatMap((one, index) => {
      const id = existing.get(one.input.reference);
      return id ? [within(index, duplicateReference(one.input.reference, id))] : [];
    });
    throw batchRefusal(items.length, taken.length ? taken : [conflict("A reference was taken meanwhile; retry.")]);
  }
}

/** Program by program: each result in order, every program that can be created written in one transaction. */
export async function createEach(em: EntityManager, shopId: string, items: unknown[]): Promise<ProgramBatchResultT[]> {
  const checked = await checkItems(em, shopId, items);
  for (let attempt = 0; ; attempt++) {
    const good = checked.flatMap((c, index) => (c instanceof ApiError ? [] : [{ index, c }]));
    try {
      const written = await storePrograms(
        em,
        shopId,
        good.map((g) => g.c),
      );
      const programs = new Map(good.map((g, i) => [g.index, written[i]]));
      return checked.map((outcome, index) =>
        outcome instanceof ApiError
          ? { index, status: outcome.status, problem: outcome.toProblem() as ProblemT }
          : { index, status: 201 as const, program: programs.get(index)! },
      );
    } catch (err) {
      if (!(err instanceof UniqueConstraintViolationException) || attempt >= 3) throw err;
      // Some references are taken (by an earlier program, or a concurrent writer): refuse those programs, write the rest.
      const existing = await existingReferences(
        em.fork(),
        shopId,
        good.map((g) => g.c.input.reference),
      );
      for (const item of good) {
        const id = existing.get(item.c.input.reference);
        if (id) checked[item.index] = within(item.index, duplicateReference(item.c.input.reference, id));
      }
    }
  }
}
