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

export function viewShear(s: ShearEntity): ShearT {
  return {
    id: s.id,
    name: s.name,
    description: s.description ?? null,
    ratedThicknessMm: s.ratedThicknessMm,
    ratedTensileMpa: s.ratedTensileMpa,
    ratedRakeDeg: s.ratedRakeDeg,
    bladeLengthMm: s.bladeLengthMm,
    backgaugeMinMm: s.backgaugeMinMm,
    backgaugeMaxMm: s.backgaugeMaxMm,
    rakeMinDeg: s.rakeMinDeg,
    rakeMaxDeg: s.rakeMaxDeg,
    gapMinMm: s.gapMinMm,
    gapMaxMm: s.gapMaxMm,
    strokesPerMin: s.strokesPerMin,
    backgaugeSpeedMmPerS: s.backgaugeSpeedMmPerS,
    handlingSecondsPerTurn: s.handlingSecondsPerTurn,
    handlingSecondsPerSheet: s.handlingSecondsPerSheet,
    maxBladeHardnessHb: s.maxBladeHardnessHb ?? null,
    gradeThicknessLimitsMm: s.gradeThicknessLimitsMm ?? {},
    crownAtRatedMm: s.crownAtRatedMm ?? null,
    crownBaselineMm: s.crownBaselineMm ?? null,
    backgaugeRepeatabilityMm: s.backgaugeRepeatabilityMm ?? null,
    archivedAt: iso(s.archivedAt),
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
  };
}

export function shearProfile(s: ShearEntity): ShearProfile {
  const { archivedAt: _a, createdAt: _c, updatedAt: _u, description: _d, ...profile } = viewShear(s);
  return {
    ...profile,
    crownAtRatedMm: s.crownAtRatedMm ?? undefined,
    crownBaselineMm: s.crownBaselineMm ?? undefined,
    backgaugeRepeatabilityMm: s.backgaugeRepeatabilityMm ?? undefined,
  };
}

export async function findShear(em: EntityManager, shopId: string, id: string): Promise<ShearEntity> {
  const shear = await em.findOne(Shear, { id, shop: shopId });
  if (!shear) throw notFound("shear");
  return shear;
}

export async function listShears(em: EntityManager, shopId: string, o: ListOptions) {
  const where: FilterQuery<ShearEntity> = { shop: shopId, ...(o.includeArchived ? {} : { archivedAt: null }) };
  return findPage(em, Shear, where, o, viewShear, { order: "asc" });
}

async function uniqueShearName(em: EntityManager, shopId: string, name: string, exceptId?: string) {
  const other = await em.findOne(Shear, { shop: shopId, name, ...(exceptId ? { id: { $ne: exceptId } } : {}) });
  if (other) throw conflict(`A shear named "${name}" already exists in this shop.`, { existingId: other.id });
}

function checkRanges(s: ShearEntity) {
  for (const [lo, hi] of [
    ["backgaugeMinMm", "backgaugeMaxMm"],
    ["rakeMinDeg", "rakeMaxDeg"],
    ["gapMinMm", "gapMaxMm"],
  ] as const) {
    if (s[lo] > s[hi]) {
      const message = `must not exceed ${hi} (${s[hi]})`;
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

export function viewGrade(g: GradeEntity): GradeT {
  return {
    id: g.id,
    code: g.code,
    name: g.name,
    family: g.family,
    standard: g.standard,
    yieldMpa: g.yieldMpa ?? null,
    tensileMinMpa: g.tensileMinMpa ?? null,
    tensileTypicalMpa: g.tensileTypicalMpa ?? null,
    tensileMaxMpa: g.tensileMaxMpa ?? null,
    valuesAreTypical: g.valuesAreTypical,
    shearTensileRatio: g.shearTensileRatio,
    gaugeFamily: g.gaugeFamily ?? null,
    hardnessHb: g.hardnessHb ?? null,
    note: g.note ?? null,
    archivedAt: iso(g.archivedAt),
    createdAt: g.createdAt.toISOString(),
    updatedAt: g.updatedAt.toISOString(),
  };
}

export function gradeProfile(g: GradeEntity): GradeProfile {
  const v = viewGrade(g);
  return {
    code: v.code,
    name: v.name,
    family: v.family,
    standard: v.standard,
    yieldMpa: v.yieldMpa,
    tensileMinMpa: v.tensileMinMpa,
    tensileTypicalMpa: v.tensileTypicalMpa,
    tensileMaxMpa: v.tensileMaxMpa,
    valuesAreTypical: v.valuesAreTypical,
    shearTensileRatio: v.shearTensileRatio,
    gaugeFamily: v.gaugeFamily,
    hardnessHb: v.hardnessHb,
    note: v.note ?? undefined,
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

export async function listGrades(em: EntityManager, shopId: string, o: ListOptions & { family?: string }) {
  const where: FilterQuery<GradeEntity> = {
    shop: shopId,
    ...(o.includeArchived ? {} : { archivedAt: null }),
    ...(o.family ? { family: o.family as GradeEntity["family"] } : {}),
  };
  return findPage(em, Grade, where, o, viewGrade, { order: "asc" });
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
