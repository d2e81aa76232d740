/**
 * Creating programs: the one path behind a single create, a batch, a cut-list upload and a
 * plan's programs. Everything is checked first (the shears and grades a batch names are read
 * once, its references looked up in one query), then the programs and their
 * `program.created` events are written in one transaction, one insert for each table.
 */
import { UniqueConstraintViolationException, type EntityManager } from "@mikro-orm/postgresql";
import { Grade, Program, Shear, Shop, type GradeEntity, type ProgramEntity, type ShearEntity } from "../../entities";
import { ApiError, conflict, invalidRequest } from "../errors";
import type { ProgramInputT, ProgramT } from "../schemas/program";
import { checkProgram, type CheckResult } from "../shear";
import { gradeProfile, shearProfile } from "./catalog";
import { recordEvents } from "./events";
import { viewProgram } from "./program-view";

export const DEFAULT_PRIORITY = 5;
const SHEAR_ID = /^shr_[0-9A-Z]{26}$/;

/** A program that passed its checks and can be written. */
export interface Checked {
  input: ProgramInputT;
  shear: ShearEntity;
  check: CheckResult;
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

/** The shears the inputs name, by id (archived ones too, to say so) or by name in any case (in use only). */
async function shearsNamed(em: EntityManager, shopId: string, inputs: ProgramInputT[]) {
  const keys = inputs.map((i) => i.shear.trim());
  const ids = [...new Set(keys.filter((k) => SHEAR_ID.test(k)))];
  const byName = keys.some((k) => !SHEAR_ID.test(k));
  const [withIds, inUse] = await Promise.all([
    ids.length ? em.find(Shear, { id: { $in: ids }, shop: shopId }) : [],
    byName ? em.find(Shear, { shop: shopId, archivedAt: null }) : [],
  ]);
  const found = new Map<string, ShearEntity>(withIds.map((s) => [s.id, s]));
  for (const s of inUse) found.set(s.name.trim().toLowerCase(), s);
  return (key: string) => found.get(SHEAR_ID.test(key) ? key : key.toLowerCase()) ?? null;
}

/** Existing programs of this shop with any of these references: reference → id. */
export async function existingReferences(em: EntityManager, shopId: string, references: string[]) {
  if (!references.length) return new Map<string, string>();
  const rows = await em.find(
    Program,
    { shop: shopId, reference: { $in: [...new Set(references)] } },
    { fields: ["id", "reference"], disableIdentityMap: true },
  );
  return new Map(rows.map((r) => [r.reference, r.id]));
}

/**
 * Check each program against its shear and grade as the catalog has them now, and against
 * the shop's references. Each answer is the checked program or the refusal for it, in order.
 */
export async function checkPrograms(
  em: EntityManager,
  shopId: string,
  inputs: ProgramInputT[],
): Promise<(Checked | ApiError)[]> {
  const codes = [...new Set(inputs.map((i) => i.grade))];
  const [shearOf, grades, existing] = await Promise.all([
    shearsNamed(em, shopId, inputs),
    em.find(Grade, { shop: shopId, code: { $in: codes }, archivedAt: null }),
    existingReferences(
      em,
      shopId,
      inputs.map((i) => i.reference),
    ),
  ]);
  const gradeOf = new Map<string, GradeEntity>(grades.map((g) => [g.code, g]));
  return inputs.map((input) => {
    const shear = shearOf(input.shear.trim());
    if (!shear || shear.archivedAt) return shearRefusal("program", Boolean(shear));
    const existingId = existing.get(input.reference);
    if (existingId) return duplicateReference(input.reference, existingId);
    const grade = gradeOf.get(input.grade);
    const check = checkProgram(input, { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null });
    // A shear named by name is stored by id: renaming it later changes nothing about the program.
    return { input: { ...input, shear: shear.id }, shear, check };
  });
}

async function insert(tx: EntityManager, shopId: string, checked: Checked[]): Promise<ProgramT[]> {
  const shop = tx.getReference(Shop, shopId);
  const programs = checked.map(({ input, shear, check }) => {
    const program = tx.create(Program, {
      shop,
      shear,
      reference: input.reference,
      gradeCode: input.grade,
      units: input.units,
      input,
      validation: check.validation,
      check,
    });
    applyInput(program, input, check);
    return program;
  });
  await tx.flush();
  const views = programs.map(viewProgram);
  await recordEvents(
    tx,
    shopId,
    views.map((program) => ({ type: "program.created" as const, subjectId: program.id, data: { program } })),
  );
  await tx.flush();
  return views;
}

/**
 * Write checked programs with their events: in the caller's transaction when there is one,
 * else in a transaction of their own. A reference taken meanwhile by a concurrent writer
 * surfaces as `UniqueConstraintViolationException`, for the caller to answer.
 */
export async function storePrograms(em: EntityManager, shopId: string, checked: Checked[]): Promise<ProgramT[]> {
  if (!checked.length) return [];
  if (em.isInTransaction()) return insert(em, shopId, checked);
  return em.transactional((tx) => insert(tx, shopId, checked));
}

/** Create one program (a draft, with its check and its `program.created` event). */
export async function createProgram(em: EntityManager, shopId: string, input: ProgramInputT): Promise<ProgramT> {
  const [checked] = await checkPrograms(em, shopId, [input]);
  if (checked instanceof ApiError) throw checked;
  try {
    return (await storePrograms(em, shopId, [checked]))[0];
  } catch (err) {
    if (!(err instanceof UniqueConstraintViolationException)) throw err;
    const existing = await existingReferences(em.fork(), shopId, [input.reference]).catch(() => new Map());
    throw duplicateReference(input.reference, existing.get(input.reference) ?? null);
  }
}
