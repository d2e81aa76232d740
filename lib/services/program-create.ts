/**
 * Creating programs: the one path behind a single create, a batch, a cut-list upload and a
 * plan's programs. Everything is checked first (the shears and grades a batch names are read
 * once, its references looked up in one query), then the programs and their
 * `program.created` events are written in one transaction, one insert for each table.
 */
import { UniqueConstraintViolationException, type EntityManager } from "@mikro-orm/postgresql";
import type { ProgramEntity } from "../../entities";
import { ApiError, conflict, invalidRequest } from "../errors";
import type { ProgramInputT, ProgramT } from "../schemas/program";
import type { RoutingT } from "../schemas/settings";
import { checkProgram, type CheckResult } from "../shear";
import { gradeProfile, shearProfile, type ShearRecord } from "./catalog";
import { newId } from "../ids";
import { runPrepared } from "../db/prepared";
import { jsonTextAround, rememberJsonBytes } from "../json-text";
import { wakeAfterCommit } from "../db/wake";
import { OUTBOX_CHANNEL, subscribesSql } from "./events";
import { existingReferences, gradesByCode, shearsNamed } from "./lookups";
import { viewProgram, type ProgramRecord } from "./program-view";
import { routeProgram } from "./routing";
import { readsOf } from "../db/reads";

export const DEFAULT_PRIORITY = 5;

/** A program that passed its checks and can be written. */
export interface Checked {
  input: ProgramInputT;
  shear: ShearRecord;
  check: CheckResult;
  /** how the shear was chosen, when the program named none */
  routing: RoutingT | null;
}

/** The refusal of a program whose shear cannot be used (422 pointing at `/shear`). */
export function shearRefusal(what: string, archived: boolean): ApiError {
  const message = archived ? "that shear is archived" : "no shear in this shop has that id or name";
  return invalidRequest(`The ${what}'s shear cannot be used: ${message}.`, [
    { location: "body", pointer: "/shear", message },
  ]);
}

export function duplicateReference(reference: string, existingId: string | null): ApiError {
  return conflict(`A program with reference "${reference}" already exists in this shop.`, { existingId });
}

export function applyInput(program: ProgramEntity, input: ProgramInputT, check: CheckResult) {
  program.input = input;
  program.reference = input.reference;
  program.title = input.title ?? null;
  program.gradeCode = input.grade;
  program.units = input.units;
  program.priority = input.priority ?? DEFAULT_PRIORITY;
  program.dueAt = input.dueAt ? new Date(input.dueAt) : null;
  program.metadata = input.metadata ?? {};
  program.validation = check.validation;
  program.check = check;
}

/**
 * Check each program against its shear and grade as the catalog has them now, and against
 * the shop's references. Each answer is the checked program or the refusal for it, in order.
 * A program that names no shear is routed to the one the shop's rule chooses (lib/services/routing.ts).
 * `references: false` leaves the references to the caller (a single create learns a taken one
 * from the unique index when it writes, and asks only when it refuses the program anyway).
 */
export async function checkPrograms(
  em: EntityManager,
  shopId: string,
  inputs: ProgramInputT[],
  { references = true }: { references?: boolean } = {},
): Promise<(Checked | ApiError)[]> {
  const [shearOf, gradeOf, existing] = await readsOf(
    em,
    () =>
      shearsNamed(
        em,
        shopId,
        inputs.flatMap((i) => (i.shear === undefined ? [] : [i.shear.trim()])),
      ),
    () =>
      gradesByCode(
        em,
        shopId,
        inputs.map((i) => i.grade),
      ),
    async () =>
      references
        ? existingReferences(
            em,
            shopId,
            inputs.map((i) => i.reference),
          )
        : new Map<string, string>(),
  );
  const checked: (Checked | ApiError)[] = [];
  for (const input of inputs) {
    const existingId = existing.get(input.reference);
    if (existingId) {
      checked.push(duplicateReference(input.reference, existingId));
      continue;
    }
    if (input.shear === undefined) {
      try {
        const { shear, check, routing } = await routeProgram(em, shopId, input);
        checked.push({ input: { ...input, shear: shear.id }, shear, check, routing });
      } catch (err) {
        if (!(err instanceof ApiError)) throw err;
        checked.push(err);
      }
      continue;
    }
    const shear = shearOf(input.shear.trim());
    if (!shear || shear.archivedAt) {
      checked.push(shearRefusal("program", Boolean(shear)));
      continue;
    }
    const grade = gradeOf.get(input.grade);
    const check = checkProgram(input, { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null });
    // A shear named by name is stored by id: renaming it later changes nothing about the program.
    checked.push({ input: { ...input, shear: shear.id }, shear, check, routing: null });
  }
  return checked;
}

/**
 * What a new program sets (the other columns keep their defaults), as `json_to_recordset` reads
 * it: the row, its event's id and its place `n` in the lot. The large part, the program as the
 * API shows it (which is also the event's body and holds the check), is not in that JSON:
 * PostgreSQL's `json_to_recordset` reads kilobytes of nested JSON at a fraction of the speed at
 * which it checks JSON text, so the checks and the rest of each view go as two more text
 * parameters, one entry per program split at ASCII record separators (which JSON text never holds
 * raw: `JSON.stringify` escapes every character below U+0020), the view's text around its check split
 * at a unit separator. Those two are sent as their UTF-8 bytes (node-postgres binds a Buffer in
 * binary format, which for text is the text's bytes, checked as UTF-8 by PostgreSQL). The check and
 * the event's body are stored as that text (`text` columns: `JSON.stringify` wrote it, so it is not
 * checked as JSON again). The check is stored once: the event's body has `null` in its place, at
 * `check_at` (after the 11 characters of `{"program":` and the head), and borrows the program's
 * (lib/services/event-bodies.ts, migration 20261204200000). When no endpoint of the shop takes
 * `program.created` (none enabled and subscribed to it, read in the statement's snapshot), the events
 * are written as already fanned out (`dispatched_at` set: into no deliveries) and the worker is not
 * woken; an endpoint receives the events written after it was added, as it would from the worker.
 */
const ROW =
  "id text, shop_id text, shear_id text, reference text, title text, revision int, input jsonb, grade_code text, units text, priority int, due_at timestamptz, validation text, metadata jsonb, routing jsonb, created_at timestamptz, updated_at timestamptz, event_id text, n int";
const COLUMNS = ROW.split(", ")
  .map((c) => c.split(" ")[0])
  .slice(0, -2)
  .join(", ");
const RECORD_BYTE = 0x1e;
const UNIT_BYTE = 0x1f;
const RECORD_BYTES = Buffer.from([RECORD_BYTE]);
const UNIT_BYTES = Buffer.from([UNIT_BYTE]);
const utf8 = (text: string) => Buffer.from(text, "utf8");
const INSERT = `with x as materialized (select * from json_to_recordset($1::json) as x(${ROW})),
  c as (select * from string_to_table($2, E'\\x1e') with ordinality as c("check", n)),
  v as (select split_part(around, E'\\x1f', 1) as head, split_part(around, E'\\x1f', 2) as tail, n
        from string_to_table($3, E'\\x1e') with ordinality as v(around, n)),
  p as (insert into programs (${COLUMNS}, "check") select ${COLUMNS}, c."check" from x join c using (n) returning 1),
  s as (select exists (select 1 from webhook_endpoints w
          where w.shop_id = $4 and ${subscribesSql("w", "'program.created'")}) as subscribed),
  e as (insert into events (id, shop_id, type, subject_id, data, check_at, dispatched_at, created_at)
        select event_id, shop_id, 'program.created', id, ('{"program":' || v.head || 'null' || v.tail || '}'),
          char_length(v.head) + 12, case when s.subscribed then null else created_at end, created_at
        from x join v using (n) cross join s returning 1)
  select (select count(*) from p) as programs, (select count(*) from e) as events, (select subscribed from s) as subscribed`;

/**
 * The programs and their events in one statement (one round trip; on its own, one
 * transaction): both inserts happen, or, when a reference was taken meanwhile, neither.
 */
async function insert(em: EntityManager, shopId: string, checked: Checked[]): Promise<ProgramT[]> {
  const now = new Date();
  const programs = checked.map(({ input, shear, check, routing }): ProgramRecord & { units: string } => ({
    id: newId("program"),
    status: "draft",
    revision: 1,
    reference: input.reference,
    title: input.title ?? null,
    input,
    shear: { id: shear.id },
    gradeCode: input.grade,
    units: input.units,
    priority: input.priority ?? DEFAULT_PRIORITY,
    dueAt: input.dueAt ? new Date(input.dueAt) : null,
    metadata: input.metadata ?? {},
    validation: check.validation,
    check,
    acknowledged: [],
    releasedAt: null,
    cancelledAt: null,
    claimedBy: null,
    claimedAt: null,
    leaseExpiresAt: null,
    leaseExpiries: 0,
    startedAt: null,
    finishedAt: null,
    progress: null,
    outcome: null,
    routing,
    createdAt: now,
    updatedAt: now,
  }));
  const views = programs.map(viewProgram);
  // Each view is serialised once, around its check, and encoded once: the same bytes go into the statement and,
  // remembered, the answer.
  const pieces = views.map((view) => {
    const { head, inner, tail } = jsonTextAround(view, "check");
    return [utf8(head), utf8(inner), utf8(tail)] as const;
  });
  views.forEach((view, i) => rememberJsonBytes(view, pieces[i]));
  // the event's body is `{ program }` (EventData<"program.created">), built in the statement from the view's text
  const rows = programs.map((program, i) => ({
    id: program.id,
    shop_id: shopId,
    shear_id: program.shear.id,
    reference: program.reference,
    title: program.title,
    revision: program.revision,
    input: program.input,
    grade_code: program.gradeCode,
    units: program.units,
    priority: program.priority,
    due_at: program.dueAt,
    validation: program.validation,
    metadata: program.metadata,
    routing: program.routing,
    created_at: now,
    updated_at: now,
    event_id: newId("event"),
    n: i + 1,
  }));
  // The statement pairs the n-th piece of each text with the n-th row: a separator inside a piece would shift them.
  // UTF-8 writes every character above U+007F with bytes above 0x7F, so a separator byte is a separator character.
  const unsplittable = (bytes: Buffer) => bytes.includes(RECORD_BYTE) || bytes.includes(UNIT_BYTE);
  if (pieces.some((piece) => piece.some(unsplittable)))
    throw new Error("a program's JSON text holds a raw separator; it cannot be written");
  const checks = Buffer.concat(pieces.flatMap(([, inner], i) => (i ? [RECORD_BYTES, inner] : [inner])));
  const around = Buffer.concat(
    pieces.flatMap(([head, , tail], i) => [...(i ? [RECORD_BYTES] : []), head, UNIT_BYTES, tail]),
  );
  const inTransaction = em.isInTransaction();
  let subscribed: boolean;
  try {
    // Bound parameters, not MikroORM's `execute`, which writes every value into the SQL text: a batch's JSON runs to
    // megabytes. Prepared: planning the statement cost about as much as running it for one program.
    [{ subscribed }] = await runPrepared<{ subscribed: boolean }>(
      em,
      inTransaction ? "program-create-in-transaction" : "program-create",
      inTransaction
        ? `${INSERT}, (select pg_notify('${OUTBOX_CHANNEL}', '') from s where s.subscribed) as woke`
        : INSERT,
      [JSON.stringify(rows), checks, around, shopId],
    );
  } catch (err) {
    if ((err as { code?: string }).code === "23505" && !(err instanceof UniqueConstraintViolationException))
      throw new UniqueConstraintViolationException(err as Error);
    throw err;
  }
  // The worker has fan-out to do only when some endpoint takes the events (else they were written as dispatched). In
  // the caller's transaction the NOTIFY above goes out at its commit; on its own the statement has committed.
  if (subscribed && !inTransaction) wakeAfterCommit(em, OUTBOX_CHANNEL);
  return views;
}

/**
 * Write checked programs with their events: in the caller's transaction when there is one,
 * else atomically on their own. A reference taken meanwhile by a concurrent writer
 * surfaces as `UniqueConstraintViolationException`, for the caller to answer.
 */
export async function storePrograms(em: EntityManager, shopId: string, checked: Checked[]): Promise<ProgramT[]> {
  return checked.length ? insert(em, shopId, checked) : [];
}

/**
 * Create one program (a draft, with its check and its `program.created` event). A reference
 * already taken is refused with 409 before any other refusal, as a batch does; it is read only
 * when the program is refused or its write meets the unique index, not before every create
 * (inside a caller's transaction it is read first, so a failed write never aborts that transaction).
 */
export async function createProgram(em: EntityManager, shopId: string, input: ProgramInputT): Promise<ProgramT> {
  const readReferencesFirst = em.isInTransaction();
  const [checked] = await checkPrograms(em, shopId, [input], { references: readReferencesFirst });
  const taken = async (lookup: EntityManager) =>
    (await existingReferences(lookup, shopId, [input.reference])).get(input.reference) ?? null;
  if (checked instanceof ApiError) {
    const existingId = readReferencesFirst ? null : await taken(em);
    throw existingId ? duplicateReference(input.reference, existingId) : checked;
  }
  try {
    return (await storePrograms(em, shopId, [checked]))[0];
  } catch (err) {
    if (!(err instanceof UniqueConstraintViolationException)) throw err;
    throw duplicateReference(input.reference, await taken(em.fork()).catch(() => null));
  }
}
