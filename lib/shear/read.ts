/**
 * Reading a cut program defensively: the input may be any value. Every field
 * that cannot be used becomes a `value_invalid` (or `units_inconsistent`)
 * finding with a JSON pointer; what can be used is returned in canonical units.
 * Never throws, never changes the input.
 */
import type { Finding, LengthUnit } from "./types";
import type { FlowCut } from "./flow";
import { finding } from "./findings";
import { NOTHING_GIVEN, type GivenSetup } from "./setup";
import { inToMm, isLengthUnit, lengthToMm } from "./units";
import { describe, isAbsent, isNonNegative, isObject, isPositive, numberOrNull, type PlainObject } from "./values";

export type ThicknessRead =
  { kind: "value"; mm: number; raw: number; pointer: string } | { kind: "gauge"; gauge: number; pointer: string };

export interface SheetRead {
  lengthMm: number;
  widthMm: number;
  count: number;
  /** The sheet length as given, in the program's units (for the units check). */
  rawLength: number;
}

export interface ProgramRead {
  units: LengthUnit;
  gradeCode: string | null;
  thickness: ThicknessRead | null;
  sheet: SheetRead | null;
  cutsIsArray: boolean;
  cuts: FlowCut[];
  /** Groups whose fields were invalid (already reported): the flow runs them as no-ops, the checks skip them. */
  skip: boolean[];
  given: GivenSetup;
  gapPointer: string;
}

function invalid(out: Finding[], pointer: string, label: string, rule: string, actual: unknown): void {
  out.push(
    finding(
      "value_invalid",
      pointer,
      `${label} must be ${rule}; got ${describe(actual)}.`,
      null,
      numberOrNull(actual),
      null,
    ),
  );
}

function readThickness(value: unknown, units: LengthUnit, out: Finding[]): ThicknessRead | null {
  if (!isObject(value)) {
    invalid(out, "/thickness", "Thickness", 'an object with "value" or "gauge"', value);
    return null;
  }
  const hasValue = !isAbsent(value.value);
  const hasGauge = !isAbsent(value.gauge);
  if (hasValue && hasGauge) {
    out.push(finding("value_invalid", "/thickness", 'Thickness must give either "value" or "gauge", not both.'));
    return null;
  }
  if (hasValue) {
    if (isPositive(value.value))
      return { kind: "value", mm: lengthToMm(value.value, units), raw: value.value, pointer: "/thickness/value" };
    invalid(out, "/thickness/value", "Thickness", "a number greater than zero", value.value);
    return null;
  }
  if (hasGauge) {
    if (typeof value.gauge === "number" && Number.isFinite(value.gauge))
      return { kind: "gauge", gauge: value.gauge, pointer: "/thickness/gauge" };
    invalid(out, "/thickness/gauge", "Gauge", "a number", value.gauge);
    return null;
  }
  invalid(out, "/thickness", "Thickness", 'an object with "value" or "gauge"', value);
  return null;
}

function readSheet(value: unknown, units: LengthUnit, out: Finding[]): SheetRead | null {
  if (!isObject(value)) {
    invalid(out, "/sheet", "The sheet", "an object with length, width and count", value);
    return null;
  }
  let usable = true;
  if (!isPositive(value.length)) {
    invalid(out, "/sheet/length", "Sheet length", "a number greater than zero", value.length);
    usable = false;
  }
  if (!isPositive(value.width)) {
    invalid(out, "/sheet/width", "Sheet width", "a number greater than zero", value.width);
    usable = false;
  }
  if (!(Number.isInteger(value.count) && (value.count as number) > 0)) {
    invalid(out, "/sheet/count", "Sheet count", "a whole number of at least 1", value.count);
    usable = false;
  }
  if (!usable) return null;
  const length = value.length as number;
  return {
    lengthMm: lengthToMm(length, units),
    widthMm: lengthToMm(value.width as number, units),
    count: value.count as number,
    rawLength: length,
  };
}

const NO_OP_CUT = (turn: boolean): FlowCut => ({
  backgaugeMm: 0,
  count: 0,
  lengthMm: null,
  turn,
  from: null,
  scrap: false,
});

function readCut(value: unknown, index: number, units: LengthUnit, out: Finding[]): { cut: FlowCut; usable: boolean } {
  const at = `/cuts/${index}`;
  const group = `Group ${index + 1}`;
  if (!isObject(value)) {
    invalid(out, at, group, "an object with backgauge and count", value);
    return { cut: NO_OP_CUT(false), usable: false };
  }
  let usable = true;
  const fail = (field: string, label: string, rule: string): void => {
    invalid(out, `${at}/${field}`, `${group} ${label}`, rule, value[field]);
    usable = false;
  };
  if (!isPositive(value.backgauge)) fail("backgauge", "backgauge", "a number greater than zero");
  if (!(Number.isInteger(value.count) && (value.count as number) >= 0))
    fail("count", "count", "a whole number, 0 or more");
  if (!isAbsent(value.length) && !isPositive(value.length))
    fail("length", "length of cut", "a number greater than zero");
  if (!isAbsent(value.turn) && typeof value.turn !== "boolean") fail("turn", "turn", "true or false");
  if (!isAbsent(value.scrap) && typeof value.scrap !== "boolean") fail("scrap", "scrap", "true or false");
  const turn = value.turn === true;
  if (!isAbsent(value.from)) {
    if (!turn) fail("from", "from", "given only with turn: true");
    else if (!(Number.isInteger(value.from) && (value.from as number) >= 0 && (value.from as number) < index))
      fail("from", "from", `the index of an earlier group (0 to ${index - 1})`);
  }
  if (!usable) return { cut: NO_OP_CUT(turn), usable };
  return {
    cut: {
      backgaugeMm: lengthToMm(value.backgauge as number, units),
      count: value.count as number,
      lengthMm: isAbsent(value.length) ? null : lengthToMm(value.length as number, units),
      turn,
      from: turn && !isAbsent(value.from) ? (value.from as number) : null,
      scrap: value.scrap === true,
    },
    usable,
  };
}

/** The same length given twice (…Mm and …In) must agree to within this, mm (ours). */
export const DUAL_UNIT_AGREEMENT_MM = 0.001;

/** A length given as `<base>Mm` or `<base>In` (either, or both if they agree). */
function readDualLength(
  setup: PlainObject,
  base: string,
  label: string,
  out: Finding[],
): { mm: number | null; pointer: string } {
  const mmKey = `${base}Mm`;
  const inchKey = `${base}In`;
  const mmPointer = `/setup/${mmKey}`;
  const inchPointer = `/setup/${inchKey}`;
  let mm: number | null = null;
  let inches: number | null = null;
  if (!isAbsent(setup[mmKey])) {
    if (isNonNegative(setup[mmKey])) mm = setup[mmKey] as number;
    else invalid(out, mmPointer, label, "a number, 0 or more", setup[mmKey]);
  }
  if (!isAbsent(setup[inchKey])) {
    if (isNonNegative(setup[inchKey])) inches = setup[inchKey] as number;
    else invalid(out, inchPointer, label, "a number, 0 or more", setup[inchKey]);
  }
  if (mm !== null && inches !== null) {
    if (Math.abs(mm - inToMm(inches)) > DUAL_UNIT_AGREEMENT_MM) {
      const message = `${label} is given twice and the two disagree: ${mm} mm in "${mmKey}" but ${inches} in (${inToMm(inches).toFixed(3)} mm) in "${inchKey}". The millimetre value is used for the other checks.`;
      out.push(finding("units_inconsistent", inchPointer, message, mm, inToMm(inches), "mm"));
    }
    return { mm, pointer: mmPointer };
  }
  if (mm !== null) return { mm, pointer: mmPointer };
  if (inches !== null) return { mm: inToMm(inches), pointer: inchPointer };
  return { mm: null, pointer: mmPointer };
}

function readSetup(value: unknown, out: Finding[]): { given: GivenSetup; gapPointer: string } {
  if (isAbsent(value)) return { given: NOTHING_GIVEN, gapPointer: "/setup/bladeGapMm" };
  if (!isObject(value)) {
    invalid(out, "/setup", "Setup", "an object", value);
    return { given: NOTHING_GIVEN, gapPointer: "/setup/bladeGapMm" };
  }
  let rakeDeg: number | null = null;
  if (!isAbsent(value.rakeDeg)) {
    if (isNonNegative(value.rakeDeg)) rakeDeg = value.rakeDeg;
    else invalid(out, "/setup/rakeDeg", "Rake", "a number of degrees, 0 or more", value.rakeDeg);
  }
  let holdDownPct: number | null = null;
  if (!isAbsent(value.holdDownPct)) {
    if (isNonNegative(value.holdDownPct) && value.holdDownPct <= 100) holdDownPct = value.holdDownPct;
    else invalid(out, "/setup/holdDownPct", "Hold-down", "a percentage from 0 to 100", value.holdDownPct);
  }
  const gap = readDualLength(value, "bladeGap", "Blade gap", out);
  const crown = readDualLength(value, "crown", "Crown", out);
  const retract = readDualLength(value, "backgaugeRetract", "Backgauge retract", out);
  return {
    given: { rakeDeg, gapMm: gap.mm, holdDownPct, crownMm: crown.mm, retractMm: retract.mm },
    gapPointer: gap.pointer,
  };
}

/** Each group's pieces can be turned by one group only: a second taker is invalid and skipped. */
function checkTurnedOnce(cuts: readonly FlowCut[], skip: boolean[], out: Finding[]): void {
  const takenBy = new Map<number, number>();
  cuts.forEach((cut, index) => {
    if (!cut.turn || index === 0 || skip[index]) return;
    const source = cut.from ?? index - 1;
    const earlier = takenBy.get(source);
    if (earlier === undefined) {
      takenBy.set(source, index);
      return;
    }
    const message = `Group ${index + 1} turns the pieces of group ${source + 1}, but group ${earlier + 1} already took them; each group's pieces can be turned once.`;
    out.push(
      finding(
        "value_invalid",
        `/cuts/${index}/${cut.from === null || cut.from === undefined ? "turn" : "from"}`,
        message,
      ),
    );
    skip[index] = true;
  });
}

/** Read a program; null when nothing can be checked (not an object, or no usable units). */
export function readProgram(input: unknown, out: Finding[]): ProgramRead | null {
  if (!isObject(input)) {
    invalid(out, "", "The program", "a JSON object", input);
    return null;
  }
  if (!isLengthUnit(input.units)) {
    out.push(
      finding(
        "units_inconsistent",
        "/units",
        `"units" must be "in" or "mm"; got ${describe(input.units)}. Nothing else can be checked without it.`,
      ),
    );
    return null;
  }
  const units = input.units;
  let gradeCode: string | null = null;
  if (typeof input.grade === "string" && input.grade.trim() !== "") gradeCode = input.grade;
  else out.push(finding("grade_unknown", "/grade", `The program must name a grade; got ${describe(input.grade)}.`));
  const thickness = readThickness(input.thickness, units, out);
  const sheet = readSheet(input.sheet, units, out);
  const cuts: FlowCut[] = [];
  const skip: boolean[] = [];
  const cutsIsArray = Array.isArray(input.cuts);
  if (cutsIsArray) {
    (input.cuts as unknown[]).forEach((value, index) => {
      const read = readCut(value, index, units, out);
      cuts.push(read.cut);
      skip.push(!read.usable);
    });
    checkTurnedOnce(cuts, skip, out);
  } else {
    invalid(out, "/cuts", "Cuts", "a list of cut groups", input.cuts);
  }
  const setup = readSetup(input.setup, out);
  return {
    units,
    gradeCode,
    thickness,
    sheet,
    cutsIsArray,
    cuts,
    skip,
    given: setup.given,
    gapPointer: setup.gapPointer,
  };
}
