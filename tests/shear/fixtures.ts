/**
 * Shared test data. The shear profile is DEMO DATA (invented, not a real
 * machine): a 1/4 in × 10 ft class hydraulic guillotine rated on 60 ksi mild
 * steel, the usual basis for mild-steel ratings (common practice).
 */
import type { CutProgram, ShearProfile } from "@/lib/shear";
import { inToMm, ksiToMpa } from "@/lib/shear";
import { EXAMPLE_PROGRAM } from "@/lib/schemas/program";

export const DEMO_SHEAR: ShearProfile = Object.freeze({
  id: "shr_demo",
  name: "Demo 1/4 in × 10 ft shear",
  ratedThicknessMm: inToMm(0.25),
  ratedTensileMpa: ksiToMpa(60),
  ratedRakeDeg: 1.5,
  bladeLengthMm: 3100,
  backgaugeMinMm: 5,
  backgaugeMaxMm: 1000,
  rakeMinDeg: 0.5,
  rakeMaxDeg: 2.5,
  gapMinMm: 0.05,
  gapMaxMm: 1.0,
  strokesPerMin: 30,
  maxBladeHardnessHb: 300,
  backgaugeSpeedMmPerS: 200,
  handlingSecondsPerTurn: 6,
  handlingSecondsPerSheet: 45,
});

/** The cut-program worked example in our API docs. */
export const WORKED_EXAMPLE: CutProgram = Object.freeze({ ...structuredClone(EXAMPLE_PROGRAM), shear: "shr_demo" }) as CutProgram;

/** A deep copy to edit in a test. */
export const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;
