/**
 * The shop's catalog: shears and grades, and their mapping to the shear core's profiles.
 */
import type { EntityManager, FilterQuery } from "@mikro-orm/postgresql";
import { Grade, Shear, Shop, type GradeEntity, type ShearEntity } from "../../entities";
import type { GradeProfile, ShearProfile } from "../shear";
import { DEFAULT_SHEAR_TENSILE_RATIO } from "../shear";
import { conflict, invalidRequest, notFound } from "../errors";
import { findPage } from "../db/paging";
import type { GradeInputT, GradePatchT, GradeT } from "../schemas/grade";
import type { ShearInputT, ShearPatchT, ShearT } from "../schemas/shear";

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export interface ListOptions {
  limit: number;
  cursor?: string;
  includeArchived?: boolean;
}

// ---------------------------------------------------------------- shears

/** A shear's own fields: an entity, or a row read without one (lib/services/lookups.ts). */
export type ShearRecord = Omit<ShearEntity, "shop">;
/** A grade's own fields: an entity, or a row read without one. */
export type GradeRecord = Omit<GradeEntity, "shop">;

export function viewShear(shear: ShearRecord): ShearT {
  return {
    id: shear.id,
    name: shear.name,
    description: shear.description ?? null,
    ratedThicknessMm: shear.ratedThicknessMm,
    ratedTensileMpa: shear.ratedTensileMpa,
    ratedRakeDeg: shear.ratedRakeDeg,
    bladeLengthMm: shear.bladeLengthMm,
    backgaugeMinMm: shear.backgaugeMinMm,
    backgaugeMaxMm: shear.backgaugeMaxMm,
    rakeMinDeg: shear.rakeMinDeg,
    rakeMaxDeg: shear.rakeMaxDeg,
    gapMinMm: shear.gapMinMm,
    gapMaxMm: shear.gapMaxMm,
    strokesPerMin: shear.strokesPerMin,
    backgaugeSpeedMmPerS: shear.backgaugeSpeedMmPerS,
    handlingSecondsPerTurn: shear.handlingSecondsPerTurn,
    handlingSecondsPerSheet: shear.handlingSecondsPerSheet,
    maxBladeHardnessHb: shear.maxBladeHardnessHb ?? null,
    gradeThicknessLimitsMm: shear.gradeThicknessLimitsMm ?? {},
    crownAtRatedMm: shear.crownAtRatedMm ?? null,
    crownBaselineMm: shear.crownBaselineMm ?? null,
    backgaugeRepeatabilityMm: shear.backgaugeRepeatabilityMm ?? null,
    archivedAt: iso(shear.archivedAt),
    createdAt: shear.createdAt.toISOString(),
    updatedAt: shear.updatedAt.toISOString(),
  };
}

export function shearProfile(shear: ShearRecord): ShearProfile {
  const { archivedAt: _a, createdAt: _c, updatedAt: _u, description: _d, ...profile } = viewShear(shear);
  return {
    ...profile,
    crownAtRatedMm: shear.crownAtRatedMm ?? undefined,
    crownBaselineMm: shear.crownBaselineMm ?? undefined,
    backgaugeRepeatabilityMm: shear.backgaugeRepeatabilityMm ?? undefined,
  };
}

export async function findShear(em: EntityManager, shopId: string, id: string): Promise<ShearEntity> {
  const shear = await em.findOne(Shear, { id, shop: shopId });
  if (!shear) throw notFound("shear");
  return shear;
}

export async function listShears(em: EntityManager, shopId: string, listOptions: ListOptions) {
  const where: FilterQuery<ShearEntity> = {
    shop: shopId,
    ...(listOptions.includeArchived ? {} : { archivedAt: null }),
  };
  return findPage(em, Shear, where, listOptions, viewShear, { order: "asc" });
}

async function uniqueShearName(em: EntityManager, shopId: string, name: string, exceptId?: string) {
  const other = await em.findOne(Shear, { shop: shopId, name, ...(exceptId ? { id: { $ne: exceptId } } : {}) });
  if (other) throw conflict(`A shear named "${name}" already exists in this shop.`, { existingId: other.id });
}

function checkRanges(shear: ShearEntity) {
  for (const [lo, hi] of [
    ["backgaugeMinMm", "backgaugeMaxMm"],
    ["rakeMinDeg", "rakeMaxDeg"],
    ["gapMinMm", "gapMaxMm"],
  ] as const) {
    if (shear[lo] > shear[hi]) {
      const message = `must not exceed ${hi} (${shear[hi]})`;
      throw invalidRequest(`${lo} ${message}.`, [{ location: "body", pointer: `/${lo}`, message }]);
    }
  }
}

export async function createShear(em: EntityManager, shopId: string, input: ShearInputT): Promise<ShearT> {
  await uniqueShearName(em, shopId, input.name);
  const shear = em.create(Shear, {
    ...input,
    description: input.description ?? null,
    maxBladeHardnessHb: input.maxBladeHardnessHb ?? null,
    gradeThicknessLimitsMm: input.gradeThicknessLimitsMm ?? {},
    crownAtRatedMm: input.crownAtRatedMm ?? null,
    crownBaselineMm: input.crownBaselineMm ?? null,
    backgaugeRepeatabilityMm: input.backgaugeRepeatabilityMm ?? null,
    shop: em.getReference(Shop, shopId),
  });
  await em.flush();
  return viewShear(shear);
}

export async function updateShear(em: EntityManager, shopId: string, id: string, patch: ShearPatchT): Promise<ShearT> {
  const shear = await findShear(em, shopId, id);
  if (patch.name && patch.name !== shear.name) await uniqueShearName(em, shopId, patch.name, id);
  em.assign(shear, patch);
  checkRanges(shear);
  await em.flush();
  return viewShear(shear);
}

export async function archiveShear(em: EntityManager, shopId: string, id: string): Promise<ShearT> {
  const shear = await findShear(em, shopId, id);
  shear.archivedAt ??= new Date();
  await em.flush();
  return viewShear(shear);
}

// ---------------------------------------------------------------- grades

export function viewGrade(grade: GradeRecord): GradeT {
  return {
    id: grade.id,
    code: grade.code,
    name: grade.name,
    family: grade.family,
    standard: grade.standard,
    yieldMpa: grade.yieldMpa ?? null,
    tensileMinMpa: grade.tensileMinMpa ?? null,
    tensileTypicalMpa: grade.tensileTypicalMpa ?? null,
    tensileMaxMpa: grade.tensileMaxMpa ?? null,
    valuesAreTypical: grade.valuesAreTypical,
    shearTensileRatio: grade.shearTensileRatio,
    gaugeFamily: grade.gaugeFamily ?? null,
    hardnessHb: grade.hardnessHb ?? null,
    note: grade.note ?? null,
    archivedAt: iso(grade.archivedAt),
    createdAt: grade.createdAt.toISOString(),
    updatedAt: grade.updatedAt.toISOString(),
  };
}

export function gradeProfile(grade: GradeRecord): GradeProfile {
  const view = viewGrade(grade);
  return {
    code: view.code,
    name: view.name,
    family: view.family,
    standard: view.standard,
    yieldMpa: view.yieldMpa,
    tensileMinMpa: view.tensileMinMpa,
    tensileTypicalMpa: view.tensileTypicalMpa,
    tensileMaxMpa: view.tensileMaxMpa,
    valuesAreTypical: view.valuesAreTypical,
    shearTensileRatio: view.shearTensileRatio,
    gaugeFamily: view.gaugeFamily,
    hardnessHb: view.hardnessHb,
    note: view.note ?? undefined,
  };
}

export async function findGrade(em: EntityManager, shopId: string, id: string): Promise<GradeEntity> {
  const grade = await em.findOne(Grade, { id, shop: shopId });
  if (!grade) throw notFound("grade");
  return grade;
}

/** The active grade a program's code names, or null when the catalog has none. */
export async function gradeByCode(em: EntityManager, shopId: string, code: string): Promise<GradeEntity | null> {
  return em.findOne(Grade, { shop: shopId, code, archivedAt: null });
}

export async function listGrades(em: EntityManager, shopId: string, options: ListOptions & { family?: string }) {
  const where: FilterQuery<GradeEntity> = {
    shop: shopId,
    ...(options.includeArchived ? {} : { archivedAt: null }),
    ...(options.family ? { family: options.family as GradeEntity["family"] } : {}),
  };
  return findPage(em, Grade, where, options, viewGrade, { order: "asc" });
}

export async function createGrade(em: EntityManager, shopId: string, input: GradeInputT): Promise<GradeT> {
  const existing = await em.findOne(Grade, { shop: shopId, code: input.code });
  if (existing)
    throw conflict(`A grade with code "${input.code}" already exists in this shop.`, { existingId: existing.id });
  const grade = em.create(Grade, {
    ...input,
    tensileTypicalMpa: input.tensileTypicalMpa ?? null,
    tensileMaxMpa: input.tensileMaxMpa ?? null,
    valuesAreTypical: input.valuesAreTypical ?? false,
    shearTensileRatio: input.shearTensileRatio ?? DEFAULT_SHEAR_TENSILE_RATIO[input.family],
    gaugeFamily: input.gaugeFamily ?? null,
    hardnessHb: input.hardnessHb ?? null,
    note: input.note ?? null,
    shop: em.getReference(Shop, shopId),
  });
  await em.flush();
  return viewGrade(grade);
}

export async function updateGrade(em: EntityManager, shopId: string, id: string, patch: GradePatchT): Promise<GradeT> {
  const grade = await findGrade(em, shopId, id);
  em.assign(grade, patch);
  if (grade.tensileMinMpa == null && grade.tensileTypicalMpa == null) {
    const message = "give tensileMinMpa or tensileTypicalMpa";
    throw invalidRequest(`A grade needs a tensile strength: ${message}.`, [
      { location: "body", pointer: "/tensileMinMpa", message },
    ]);
  }
  await em.flush();
  return viewGrade(grade);
}

export async function archiveGrade(em: EntityManager, shopId: string, id: string): Promise<GradeT> {
  const grade = await findGrade(em, shopId, id);
  grade.archivedAt ??= new Date();
  await em.flush();
  return viewGrade(grade);
}
