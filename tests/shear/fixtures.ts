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
export const WORKED_EXAMPLE: CutProgram = Object.freeze({
  ...structuredClone(EXAMPLE_PROGRAM),
  shear: "shr_demo",
}) as CutProgram;

/** A deep copy to edit in a test. */
export const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

const sheetMm = (length: number, width: number) => ({ length, width, count: 1 });
const mmProgram = (
  grade: string,
  thickness: number,
  sheet: { length: number; width: number; count: number },
  cuts: CutProgram["cuts"],
): CutProgram => ({ grade, thickness: { value: thickness }, units: "mm", sheet, cuts });

/**
 * Every cut program the shear tests use, by name: the worked example and the
 * hand-worked programs of the flow, findings and check tests (each there with
 * its arithmetic). Shared so the drawing can be compared with the flow on all of them.
 */
export const PROGRAM_FIXTURES: Readonly<Record<string, CutProgram>> = Object.freeze({
  "worked example": WORKED_EXAMPLE,
  "worked example, mm": {
    ...clone(WORKED_EXAMPLE),
    units: "mm",
    sheet: { length: 120 * 25.4, width: 48 * 25.4, count: 2 },
    cuts: [
      { backgauge: 12 * 25.4, count: 3 },
      { turn: true, backgauge: 16 * 25.4, length: 12 * 25.4, count: 7 },
    ],
    setup: undefined,
  },
  "two strip kinds, each crosscut (from)": mmProgram("A36", 3, sheetMm(2000, 1000), [
    { backgauge: 300, count: 2 },
    { backgauge: 200, count: 1 },
    { turn: true, from: 0, backgauge: 500, count: 3 },
    { turn: true, from: 1, backgauge: 400, count: 4 },
  ]),
  "12 in and 8 in strips of the worked example sheet": {
    ...clone(WORKED_EXAMPLE),
    cuts: [
      { backgauge: 12, count: 2 },
      { backgauge: 8, count: 2 },
      { backgauge: 16, count: 7, turn: true, from: 0 },
      { backgauge: 20, count: 5, turn: true, from: 1 },
    ],
  },
  "stainless in mm, remnant equal to the backgauge": mmProgram("304", 2, sheetMm(3000, 1500), [
    { backgauge: 500, count: 2 },
  ]),
  "remnant within the tolerance": mmProgram("A36", 3, sheetMm(1000, 300.05), [{ backgauge: 100, count: 2 }]),
  "remnant outside the tolerance": mmProgram("A36", 3, sheetMm(1000, 300.2), [{ backgauge: 100, count: 2 }]),
  "next group keeps cutting the remnant": mmProgram("A36", 3, sheetMm(1000, 500), [
    { backgauge: 100, count: 2 },
    { backgauge: 150, count: 1 },
  ]),
  "strokes beyond the workpiece": mmProgram("A36", 3, sheetMm(1000, 48), [{ backgauge: 12, count: 5 }]),
  "first group turns the sheet": mmProgram("A36", 3, sheetMm(1000, 500), [{ backgauge: 250, count: 3, turn: true }]),
  "turned strips with an offcut remnant": mmProgram("A36", 3, sheetMm(1000, 550), [
    { backgauge: 100, count: 5 },
    { backgauge: 300, count: 3, turn: true },
  ]),
  "partial strokes": mmProgram("A36", 3, sheetMm(1000, 500), [{ backgauge: 100, count: 2, length: 400 }]),
  "partial crosscut of turned strips": mmProgram("A36", 3, sheetMm(2000, 600), [
    { backgauge: 200, count: 2 },
    { backgauge: 150, count: 2, turn: true, length: 100 },
  ]),
  "scrap trim then blanks": mmProgram("A36", 3, sheetMm(1000, 505), [
    { backgauge: 5, count: 1, scrap: true },
    { backgauge: 100, count: 4 },
  ]),
  "scrap strips turned and cut": mmProgram("A36", 3, sheetMm(1200, 800), [
    { backgauge: 200, count: 2, scrap: true },
    { backgauge: 300, count: 3, turn: true },
  ]),
  "last strip named by a group of 0 strokes": mmProgram("A36", 3, sheetMm(2000, 300), [
    { backgauge: 100, count: 1 },
    { backgauge: 200, count: 0 },
  ]),
  "three stages: rip, crosscut, trim": mmProgram("A36", 3, sheetMm(2500, 1250), [
    { backgauge: 400, count: 2 },
    { backgauge: 600, count: 3, turn: true },
    { backgauge: 380, count: 1, turn: true },
  ]),
  "narrow strips (warnings)": mmProgram("A36", 3, sheetMm(1000, 500), [{ backgauge: 25, count: 2 }]),
});
