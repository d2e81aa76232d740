/**
 * Sheet gauges: gauge number → thickness, each family derived from its
 * published definition (never from a table of thicknesses).
 *
 * - US Standard Gauge (Act of Congress of 3 March 1893, 15 U.S.C. § 206): a
 *   weight per square foot for each gauge number, for wrought iron at
 *   480 lb/ft³, i.e. 40 lb/ft² = 640 oz/ft² per inch of thickness. The Act's
 *   weights step evenly between a few breakpoints (20 oz from No. 7/0 to No. 1,
 *   10 oz to No. 14, 5 oz to No. 16, 4 oz to No. 20, 2 oz to No. 26, 1 oz to
 *   No. 31, ½ oz to No. 36, ¼ oz to No. 38); we store those breakpoints.
 * - Manufacturers' Standard Gauge for sheet steel: the same weights per gauge
 *   number, converted at 41.82 lb/ft² per inch of thickness.
 * - Galvanized sheet gauge: the MSG weight plus 2.5 oz/ft² of zinc coating,
 *   converted at the same 41.82 lb/ft² per inch.
 * - American Wire Gauge (Brown & Sharpe): d = 0.005 in · 92^((36 − n)/39).
 */
import type { GaugeFamily } from "./types";
import { inToMm } from "./units";

/** Wrought iron at 480 lb/ft³ → 40 lb/ft² per inch = 640 oz/ft² per inch (the 1893 Act's basis). */
export const USSG_OZ_PER_SQFT_PER_IN = 640;
/** Manufacturers' Standard Gauge: sheet steel taken at 41.82 lb/ft² per inch of thickness. */
export const MSG_LB_PER_SQFT_PER_IN = 41.82;
/** Galvanized sheet gauge: zinc coating added to the MSG weight, oz/ft². */
export const GALVANIZED_COATING_OZ_PER_SQFT = 2.5;
export const OZ_PER_LB = 16;
/** AWG: No. 36 is 0.005 in and No. 0000 is 0.46 in; 39 steps between them, ratio 92. */
export const AWG_D36_IN = 0.005;
export const AWG_RATIO = 92;
export const AWG_STEPS = 39;

/**
 * Breakpoints of the 1893 Act's weight column: [gauge number, oz/ft²].
 * No. 7/0 is written −6 (No. 0 is 0, No. 00 is −1, …). Between two
 * breakpoints the Act's weights change by an even step per gauge number.
 */
const USSG_WEIGHT_BREAKPOINTS: ReadonlyArray<readonly [number, number]> = [
  [-6, 320],
  [1, 180],
  [14, 50],
  [16, 40],
  [20, 24],
  [26, 12],
  [31, 7],
  [36, 4.5],
  [38, 4],
];

/** Gauge numbers accepted per family (whole numbers only; the multi-zero sizes are not plain numbers). */
export const GAUGE_RANGES: Readonly<Record<GaugeFamily, { min: number; max: number }>> = {
  // The 1893 Act runs No. 7/0 to No. 38; as plain numbers we accept No. 0 to No. 38.
  ussg: { min: 0, max: 38 },
  // Sheet steel charts under the MSG run No. 3 to No. 38 (No. 3 = 0.2391 in).
  msg: { min: 3, max: 38 },
  // Galvanized sheet gauge charts run No. 8 to No. 32.
  galvanized: { min: 8, max: 32 },
  // Aluminium sheet by AWG: No. 0 to No. 40.
  awg: { min: 0, max: 40 },
};

const isGaugeNumber = (family: GaugeFamily, gauge: number): boolean =>
  Number.isInteger(gauge) && gauge >= GAUGE_RANGES[family].min && gauge <= GAUGE_RANGES[family].max;

/** Weight per square foot of a US Standard Gauge number, oz/ft², from the Act's breakpoints. */
export function ussgOuncesPerSqFt(gauge: number): number | null {
  if (!Number.isInteger(gauge) || gauge < -6 || gauge > 38) return null;
  for (let i = 1; i < USSG_WEIGHT_BREAKPOINTS.length; i++) {
    const [g1, w1] = USSG_WEIGHT_BREAKPOINTS[i];
    if (gauge <= g1) {
      const [g0, w0] = USSG_WEIGHT_BREAKPOINTS[i - 1];
      return w0 + ((w1 - w0) * (gauge - g0)) / (g1 - g0);
    }
  }
  return null;
}

/** US Standard Gauge thickness, in: weight over 640 oz/ft² per inch. */
export function ussgThicknessIn(gauge: number): number | null {
  const oz = ussgOuncesPerSqFt(gauge);
  return oz === null ? null : oz / USSG_OZ_PER_SQFT_PER_IN;
}

/** Manufacturers' Standard Gauge thickness, in: the same weight over 41.82 lb/ft² per inch. */
export function msgThicknessIn(gauge: number): number | null {
  const oz = ussgOuncesPerSqFt(gauge);
  return oz === null ? null : oz / OZ_PER_LB / MSG_LB_PER_SQFT_PER_IN;
}

/** Galvanized sheet gauge thickness, in: (MSG weight + 2.5 oz/ft²) over 41.82 lb/ft² per inch. */
export function galvanizedThicknessIn(gauge: number): number | null {
  const oz = ussgOuncesPerSqFt(gauge);
  return oz === null ? null : (oz + GALVANIZED_COATING_OZ_PER_SQFT) / OZ_PER_LB / MSG_LB_PER_SQFT_PER_IN;
}

/** American Wire Gauge diameter (= sheet thickness), in: 0.005 · 92^((36 − n)/39). */
export function awgThicknessIn(gauge: number): number {
  return AWG_D36_IN * AWG_RATIO ** ((36 - gauge) / AWG_STEPS);
}

/** Thickness in inches of gauge `n` in `family`, or null if the family does not define it. */
export function gaugeThicknessIn(family: GaugeFamily, gauge: number): number | null {
  if (!isGaugeNumber(family, gauge)) return null;
  switch (family) {
    case "ussg":
      return ussgThicknessIn(gauge);
    case "msg":
      return msgThicknessIn(gauge);
    case "galvanized":
      return galvanizedThicknessIn(gauge);
    case "awg":
      return awgThicknessIn(gauge);
  }
}

/** Thickness in mm of gauge `n` in `family`, or null if the family does not define it. */
export function gaugeThicknessMm(family: GaugeFamily, gauge: number): number | null {
  const thicknessIn = gaugeThicknessIn(family, gauge);
  return thicknessIn === null ? null : inToMm(thicknessIn);
}

export interface GaugeRow {
  gauge: number;
  thicknessIn: number;
  thicknessMm: number;
}

/** Every gauge of a family, thickest first (for a gauge catalogue endpoint). */
export function gaugeTable(family: GaugeFamily): GaugeRow[] {
  const rows: GaugeRow[] = [];
  for (let gauge = GAUGE_RANGES[family].min; gauge <= GAUGE_RANGES[family].max; gauge++) {
    const thicknessIn = gaugeThicknessIn(family, gauge);
    if (thicknessIn !== null) rows.push({ gauge: gauge, thicknessIn: thicknessIn, thicknessMm: inToMm(thicknessIn) });
  }
  return rows;
}

export const GAUGE_FAMILY_NAMES: Readonly<Record<GaugeFamily, string>> = {
  msg: "Manufacturers' Standard Gauge (sheet steel)",
  galvanized: "galvanized sheet gauge",
  ussg: "US Standard Gauge (1893)",
  awg: "American Wire Gauge (Brown & Sharpe)",
};
