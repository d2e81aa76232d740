/**
 * Orders for tests and benchmarks (invented, seeded so every run gets the same): the largest
 * order the planner's limits allow, and mixed shop orders of the usual kind.
 */
import { PLAN_LIMITS } from "../../lib/planner/order";

/** A small deterministic generator (mulberry32), so an order is the same on every run. */
export function seeded(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let value = state;
    value = Math.imul(value ^ (value >>> 15), value | 1);
    value ^= value + Math.imul(value ^ (value >>> 7), value | 61);
    return ((value ^ (value >>> 14)) >>> 0) / 4294967296;
  };
}

/** As many blank types, pieces and stock sizes as a plan may have, in millimetres, for a shear with a 3.1 m blade. */
export function largestOrder(shear: string, seed = 20261202) {
  const random = seeded(seed);
  const between = (low: number, high: number) => low + Math.floor(random() * (high - low + 1));
  const types = PLAN_LIMITS.blankTypes;
  const each = Math.floor(PLAN_LIMITS.totalPieces / types);
  return {
    reference: `LARGEST-${seed}`,
    shear,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm" as const,
    stock: Array.from({ length: PLAN_LIMITS.stockSizes }, (_, i) => ({ length: 2000 + 50 * i, width: 1000 + 25 * i })),
    blanks: Array.from({ length: types }, (_, index) => ({
      label: `part ${index + 1}`,
      length: between(40, 900),
      width: between(40, 600),
      quantity: each,
      canTurn: random() < 0.8,
    })),
  };
}

/** A mixed shop order of `types` blank types on three sheet sizes (millimetres), seeded. */
export function mediumOrder(shear: string, seed: number, types: number) {
  const random = seeded(seed);
  const between = (low: number, high: number) => low + Math.floor(random() * (high - low + 1));
  return {
    reference: `MIXED-${seed}-${types}`,
    shear,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm" as const,
    stock: [
      { length: 2500, width: 1250 },
      { length: 3000, width: 1500 },
      { length: 2000, width: 1000, count: 10 },
    ],
    blanks: Array.from({ length: types }, (_, index) => ({
      label: `part ${index + 1}`,
      length: between(60, 1100),
      width: between(40, 700),
      quantity: between(5, 60),
      canTurn: random() < 0.75,
    })),
  };
}
