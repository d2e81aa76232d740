/**
 * Shear force and capacity.
 *
 * Raked blade (the usual guillotine): only a short length of blade, about
 * t / tan α, is in the cut at once, so
 *
 *     F ≈ k · UTS · t² / tan α
 *
 * with k dimensionless (any consistent units: MPa · mm² → N). Published forms
 * differ in k (penetration before fracture, shear/tensile ratio). We take
 * k = 0.48, a FIT, not a source: it reproduces a plate maker's worked shearing
 * example (3/8 in plate; 125 ksi tensile: 73 / 55 / 44 t at 3 / 4 / 5° rake;
 * 181 ksi: 107 t at 3°; tons read as metric tonnes-force) within 1.5 %.
 *
 * Straight blade (or a cut shorter than the raked contact length): the whole
 * length of cut is in the cut at once, F = τ · L · t, with τ = shear/tensile
 * ratio × UTS. A cut uses the smaller of the two: when L is shorter than the
 * raked contact length, the blade is engaged over L only.
 */
import type { LengthUnit, ShearProfile } from "./types";
import type { ForceReport } from "./reports";
import type { GradeTensile } from "./grades";
import { sameGradeCode } from "./grades";
import {
  DECIMALS,
  fmtDeg,
  fmtLength,
  fmtStrength,
  forceUnitFor,
  roundTo,
  showForce,
  showLength,
  showPct,
  showStrength,
  strengthUnitFor,
} from "./units";

/** Raked-blade force constant, dimensionless (a fit; see module comment). */
export const RAKED_FORCE_K = 0.48;
/** Dull blades can need up to about half again the force (common practice); shown, never hidden. */
export const DULL_BLADE_FACTOR = 1.5;

const RAD_PER_DEG = Math.PI / 180;
const N_PER_KN = 1000;

/** Raked-blade force, kN, for tensile strength (MPa), thickness (mm) and rake (degrees). Rake ≤ 0 → Infinity. */
export function rakedForceKn(tensileMpa: number, thicknessMm: number, rakeDeg: number): number {
  if (!(rakeDeg > 0)) return Number.POSITIVE_INFINITY;
  return (RAKED_FORCE_K * tensileMpa * thicknessMm * thicknessMm) / Math.tan(rakeDeg * RAD_PER_DEG) / N_PER_KN;
}

/** Straight-blade force, kN: τ · L · t. */
export function straightForceKn(shearMpa: number, lengthMm: number, thicknessMm: number): number {
  return (shearMpa * lengthMm * thicknessMm) / N_PER_KN;
}

export interface CutForceInput {
  tensileMpa: number;
  shearMpa: number;
  thicknessMm: number;
  lengthMm: number;
  rakeDeg: number;
}

export interface CutForce {
  kn: number;
  model: "raked" | "straight";
}

/** Force of one cut: the raked model, capped by the straight-blade force over the length of cut. */
export function cutForce(cutForceInput: CutForceInput): CutForce {
  const raked = rakedForceKn(cutForceInput.tensileMpa, cutForceInput.thicknessMm, cutForceInput.rakeDeg);
  const straight = straightForceKn(cutForceInput.shearMpa, cutForceInput.lengthMm, cutForceInput.thicknessMm);
  return straight < raked ? { kn: straight, model: "straight" } : { kn: raked, model: "raked" };
}

/** The shear's capacity: the raked-blade force at its rating (rated thickness, tensile and rake). */
export function ratedForceKn(shear: ShearProfile): number {
  return rakedForceKn(shear.ratedTensileMpa, shear.ratedThicknessMm, shear.ratedRakeDeg);
}

export interface MaxThickness {
  mm: number;
  source: "shear-profile" | "model";
}

/**
 * Thickest plate of a grade the shear may cut. An explicit per-grade limit in
 * the shear profile wins; otherwise equal force at equal (rated) rake gives
 * t_max = t_rated · √(UTS_rated / UTS_grade).
 */
export function maxThicknessForGradeMm(shear: ShearProfile, gradeCode: string, tensileMpa: number): MaxThickness {
  const limits = shear.gradeThicknessLimitsMm;
  if (limits) {
    for (const code of Object.keys(limits)) {
      const mm = limits[code];
      if (sameGradeCode(code, gradeCode) && Number.isFinite(mm) && mm > 0) return { mm, source: "shear-profile" };
    }
  }
  return { mm: shear.ratedThicknessMm * Math.sqrt(shear.ratedTensileMpa / tensileMpa), source: "model" };
}

/** Share of the rated force a required force uses, %. */
export function capacityUsedPct(requiredKn: number, ratedKn: number): number {
  return (100 * requiredKn) / ratedKn;
}

/** Rake (degrees) at which the raked-blade force equals `forceKn`: α = atan(k · UTS · t² / F). */
export function rakeForForceDeg(tensileMpa: number, thicknessMm: number, forceKn: number): number {
  return Math.atan((RAKED_FORCE_K * tensileMpa * thicknessMm * thicknessMm) / (forceKn * N_PER_KN)) / RAD_PER_DEG;
}

export interface ForceReportInput {
  units: LengthUnit;
  requiredKn: number;
  ratedKn: number;
  rakeDeg: number;
  tensile: GradeTensile;
  maxThickness: MaxThickness;
  gradeCode: string;
  shear: ShearProfile;
  byGroup: ReadonlyArray<{ group: number; cutLengthMm: number; force: CutForce }>;
}

/** The force and capacity report in the caller's units. */
export function forceReport(forceReportInput: ForceReportInput): ForceReport {
  const units = forceReportInput.units;
  const dull = forceReportInput.requiredKn * DULL_BLADE_FACTOR;
  const why =
    forceReportInput.maxThickness.source === "shear-profile"
      ? `Limit this shear's profile sets for ${forceReportInput.gradeCode}.`
      : `${fmtLength(forceReportInput.shear.ratedThicknessMm, units)} rating × √(${fmtStrength(forceReportInput.shear.ratedTensileMpa, units)} / ${fmtStrength(forceReportInput.tensile.mpa, units)}) at the rated ${fmtDeg(forceReportInput.shear.ratedRakeDeg)} rake.`;
  return {
    unit: forceUnitFor(units),
    required: showForce(forceReportInput.requiredKn, units),
    rated: showForce(forceReportInput.ratedKn, units),
    capacityUsedPct: showPct(capacityUsedPct(forceReportInput.requiredKn, forceReportInput.ratedKn)),
    dullBlade: {
      factor: DULL_BLADE_FACTOR,
      required: showForce(dull, units),
      capacityUsedPct: showPct(capacityUsedPct(dull, forceReportInput.ratedKn)),
    },
    rakeDeg: roundTo(forceReportInput.rakeDeg, DECIMALS.deg),
    tensile: {
      value: showStrength(forceReportInput.tensile.mpa, units),
      unit: strengthUnitFor(units),
      basis: forceReportInput.tensile.basis,
    },
    maxThicknessForGrade: {
      value: showLength(forceReportInput.maxThickness.mm, units),
      unit: units,
      source: forceReportInput.maxThickness.source,
      why,
    },
    byGroup: forceReportInput.byGroup.map((group) => ({
      group: group.group,
      cutLength: showLength(group.cutLengthMm, units),
      force: showForce(group.force.kn, units),
      model: group.force.model,
    })),
  };
}
