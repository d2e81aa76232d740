/**
 * Unit conversions at the edge of the core, and display rounding.
 *
 * Inside the core everything is mm, MPa, kN, s. These functions convert the
 * caller's units in and out. Constants are the definitions:
 * - 1 in = 25.4 mm exactly (international yard and pound agreement, 1959);
 * - 1 ksi = 1000 lbf/in² = 6.894757 MPa (rounded to 7 significant figures);
 * - 1 short ton-force = 2000 lbf = 8.896443 kN (rounded to 7 significant figures).
 */
import type { AreaUnit, ForceUnit, LengthUnit, StrengthUnit } from "./types";

export const MM_PER_IN = 25.4;
export const MPA_PER_KSI = 6.894757;
export const KN_PER_TONF = 8.896443;

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const ksiToMpa = (ksi: number): number => ksi * MPA_PER_KSI;
export const mpaToKsi = (mpa: number): number => mpa / MPA_PER_KSI;
export const tonfToKn = (tonf: number): number => tonf * KN_PER_TONF;
export const knToTonf = (kn: number): number => kn / KN_PER_TONF;

export function isLengthUnit(value: unknown): value is LengthUnit {
  return value === "in" || value === "mm";
}

/** A length in the caller's unit → mm. */
export function lengthToMm(value: number, unit: LengthUnit): number {
  return unit === "in" ? inToMm(value) : value;
}

/** mm → a length in the caller's unit (unrounded). */
export function lengthFromMm(mm: number, unit: LengthUnit): number {
  return unit === "in" ? mmToIn(mm) : mm;
}

export const strengthUnitFor = (unit: LengthUnit): StrengthUnit => (unit === "in" ? "ksi" : "MPa");
export const forceUnitFor = (unit: LengthUnit): ForceUnit => (unit === "in" ? "tonf" : "kN");
export const areaUnitFor = (unit: LengthUnit): AreaUnit => (unit === "in" ? "in2" : "mm2");

export const strengthFromMpa = (mpa: number, unit: LengthUnit): number => (unit === "in" ? mpaToKsi(mpa) : mpa);
export const forceFromKn = (kn: number, unit: LengthUnit): number => (unit === "in" ? knToTonf(kn) : kn);
export const areaFromMm2 = (mm2: number, unit: LengthUnit): number =>
  unit === "in" ? mm2 / (MM_PER_IN * MM_PER_IN) : mm2;

/**
 * Decimal places used when reporting values. A ten-thousandth of an inch and a
 * thousandth of a millimetre are finer than a backgauge positions to (a few
 * thousandths of an inch, common practice), so rounding never hides a setting.
 */
export const DECIMALS = {
  length: { in: 4, mm: 3 },
  area: { in: 2, mm: 0 },
  force: 2,
  strength: { in: 1, mm: 0 },
  pct: 1,
  deg: 2,
  seconds: 1,
} as const;

const POW10 = [1, 10, 100, 1000, 10000, 100000, 1000000];

/** Round half away from zero to `decimals` places (0–6); non-finite values pass through. */
export function roundTo(value: number, decimals: number): number {
  if (!Number.isFinite(value)) return value;
  const scale = POW10[decimals] ?? 10 ** decimals;
  const rounded = Math.round(Math.abs(value) * scale + 1e-9) / scale;
  return value < 0 ? -rounded : rounded;
}

/** mm → caller's length unit, rounded for reports. */
export const showLength = (mm: number, unit: LengthUnit): number =>
  roundTo(lengthFromMm(mm, unit), DECIMALS.length[unit]);
export const showArea = (mm2: number, unit: LengthUnit): number => roundTo(areaFromMm2(mm2, unit), DECIMALS.area[unit]);
export const showForce = (kn: number, unit: LengthUnit): number => roundTo(forceFromKn(kn, unit), DECIMALS.force);
export const showStrength = (mpa: number, unit: LengthUnit): number =>
  roundTo(strengthFromMpa(mpa, unit), DECIMALS.strength[unit]);
export const showPct = (pct: number): number => roundTo(pct, DECIMALS.pct);

/** A number for messages: fixed decimals, trailing zeros dropped ("45", "0.1345", "0.05"). */
export function fmtNumber(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return text.includes(".") ? text.replace(/\.?0+$/, "") : text;
}

/** Text for messages: "0.1345 in", "3.416 mm", "12 in". */
export const fmtLength = (mm: number, unit: LengthUnit): string =>
  `${fmtNumber(lengthFromMm(mm, unit), DECIMALS.length[unit])} ${unit}`;
export const fmtForce = (kn: number, unit: LengthUnit): string =>
  `${forceFromKn(kn, unit).toFixed(1)} ${forceUnitFor(unit)}`;
export const fmtStrength = (mpa: number, unit: LengthUnit): string =>
  `${strengthFromMpa(mpa, unit).toFixed(DECIMALS.strength[unit])} ${strengthUnitFor(unit)}`;
export const fmtDeg = (deg: number): string => `${roundTo(deg, DECIMALS.deg)}°`;
export const fmtPct = (pct: number): string => `${pct.toFixed(DECIMALS.pct)} %`;
