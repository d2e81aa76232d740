/**
 * The shear core: checks a cut program against a shear and a grade, works out
 * the setup, the piece flow (yield) and the cycle estimate.
 *
 * Pure: no I/O, no clock, no framework. Never throws on any input; problems
 * come back as findings. Never changes the program.
 */
import type {
  CheckContext,
  CheckResult,
  CutProgram,
  Finding,
  ForceReport,
  GradeProfile,
  LengthUnit,
  SetupReport,
  ShearProfile,
  ThicknessReport,
} from "./types";
import { finding, validationOf, checkThickness, checkForce, checkHardness, checkGivenSetup, checkGroups } from "./findings";
import { simulateFlow, yieldReport, type FlowCut, type FlowResult } from "./flow";
import { cutForce, forceReport, maxThicknessForGradeMm, rakedForceKn, ratedForceKn, straightForceKn, type CutForce } from "./force";
import { DEFAULT_SHEAR_TENSILE_RATIO, gradeShearStrengthMpa, gradeTensile, sameGradeCode, type GradeTensile } from "./grades";
import { GAUGE_FAMILY_NAMES, GAUGE_RANGES, gaugeThicknessMm } from "./gauges";
import { resolveSetup, NOTHING_GIVEN, type GivenSetup, type ResolvedSetup } from "./setup";
import { estimateCycle, estimateReport } from "./estimate";
import { fmtLength, inToMm, isLengthUnit, lengthToMm, mmToIn, showLength } from "./units";

export * from "./types";
export * from "./units";
export * from "./gauges";
export * from "./grades";
export * from "./force";
export * from "./setup";
export * from "./flow";
export * from "./findings";
export * from "./estimate";

// ---------------------------------------------------------------------------
// Reading the program (defensive: the input may be anything)
// ---------------------------------------------------------------------------

type Thickness = { kind: "value"; mm: number; raw: number; pointer: string } | { kind: "gauge"; gauge: number; pointer: string };

interface ReadProgram {
  units: LengthUnit;
  gradeCode: string | null;
  thickness: Thickness | null;
  sheet: { lengthMm: number; widthMm: number; count: number; rawLength: number } | null;
  cutsIsArray: boolean;
  cuts: FlowCut[];
  skip: boolean[];
  given: GivenSetup;
  gapPointer: string;
}

type Obj = Record<string, unknown>;
const isObject = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);
const isPositive = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;
const isNonNegative = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v >= 0;
const isAbsent = (v: unknown): boolean => v === undefined || v === null;
const numberOrNull = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);
const describe = (v: unknown): string => (typeof v === "string" ? `"${v.slice(0, 40)}"` : v === null ? "null" : typeof v === "number" ? String(v) : typeof v);

function invalid(out: Finding[], pointer: string, label: string, rule: string, actual: unknown): void {
  out.push(finding("value_invalid", pointer, `${label} must be ${rule}; got ${describe(actual)}.`, null, numberOrNull(actual), null));
}

function readThickness(v: unknown, u: LengthUnit, out: Finding[]): Thickness | null {
  if (!isObject(v)) {
    invalid(out, "/thickness", "Thickness", 'an object with "value" or "gauge"', v);
    return null;
  }
  const hasValue = !isAbsent(v.value);
  const hasGauge = !isAbsent(v.gauge);
  if (hasValue && hasGauge) {
    out.push(finding("value_invalid", "/thickness", 'Thickness must give either "value" or "gauge", not both.'));
    return null;
  }
  if (hasValue) {
    if (isPositive(v.value)) return { kind: "value", mm: lengthToMm(v.value, u), raw: v.value, pointer: "/thickness/value" };
    invalid(out, "/thickness/value", "Thickness", "a number greater than zero", v.value);
    return null;
  }
  if (hasGauge) {
    if (typeof v.gauge === "number" && Number.isFinite(v.gauge)) return { kind: "gauge", gauge: v.gauge, pointer: "/thickness/gauge" };
    invalid(out, "/thickness/gauge", "Gauge", "a number", v.gauge);
    return null;
  }
  invalid(out, "/thickness", "Thickness", 'an object with "value" or "gauge"', v);
  return null;
}

function readSheet(v: unknown, u: LengthUnit, out: Finding[]): ReadProgram["sheet"] {
  if (!isObject(v)) {
    invalid(out, "/sheet", "The sheet", "an object with length, width and count", v);
    return null;
  }
  let ok = true;
  if (!isPositive(v.length)) ok = (invalid(out, "/sheet/length", "Sheet length", "a number greater than zero", v.length), false);
  if (!isPositive(v.width)) ok = (invalid(out, "/sheet/width", "Sheet width", "a number greater than zero", v.width), false);
  if (!(Number.isInteger(v.count) && (v.count as number) > 0)) ok = (invalid(out, "/sheet/count", "Sheet count", "a whole number of at least 1", v.count), false);
  if (!ok) return null;
  const length = v.length as number;
  return { lengthMm: lengthToMm(length, u), widthMm: lengthToMm(v.width as number, u), count: v.count as number, rawLength: length };
}

function readCut(v: unknown, i: number, u: LengthUnit, out: Finding[]): { cut: FlowCut; ok: boolean } {
  const at = `/cuts/${i}`;
  const group = `Group ${i + 1}`;
  if (!isObject(v)) {
    invalid(out, at, `${group}`, "an object with backgauge and count", v);
    return { cut: { backgaugeMm: 0, count: 0, lengthMm: null, turn: false, from: null, scrap: false }, ok: false };
  }
  let ok = true;
  const fail = (field: string, label: string, rule: string): void => {
    invalid(out, `${at}/${field}`, `${group} ${label}`, rule, v[field]);
    ok = false;
  };
  if (!isPositive(v.backgauge)) fail("backgauge", "backgauge", "a number greater than zero");
  if (!(Number.isInteger(v.count) && (v.count as number) >= 0)) fail("count", "count", "a whole number, 0 or more");
  if (!isAbsent(v.length) && !isPositive(v.length)) fail("length", "length of cut", "a number greater than zero");
  if (!isAbsent(v.turn) && typeof v.turn !== "boolean") fail("turn", "turn", "true or false");
  if (!isAbsent(v.scrap) && typeof v.scrap !== "boolean") fail("scrap", "scrap", "true or false");
  const turn = v.turn === true;
  if (!isAbsent(v.from)) {
    if (!turn) fail("from", "from", "given only with turn: true");
    else if (!(Number.isInteger(v.from) && (v.from as number) >= 0 && (v.from as number) < i)) fail("from", "from", `the index of an earlier group (0 to ${i - 1})`);
  }
  const from = turn && ok && !isAbsent(v.from) ? (v.from as number) : null;
  if (!ok) return { cut: { backgaugeMm: 0, count: 0, lengthMm: null, turn, from: null, scrap: false }, ok };
  return {
    cut: {
      backgaugeMm: lengthToMm(v.backgauge as number, u),
      count: v.count as number,
      lengthMm: isAbsent(v.length) ? null : lengthToMm(v.length as number, u),
      turn,
      from,
      scrap: v.scrap === true,
    },
    ok,
  };
}

/** Same length given twice (…Mm and …In) must agree to within this, mm. */
const DUAL_UNIT_AGREEMENT_MM = 0.001;

/** A length given as `<base>Mm` or `<base>In` (either, or both if they agree). */
function readDualLength(s: Obj, base: string, label: string, out: Finding[]): { mm: number | null; pointer: string } {
  const mmKey = `${base}Mm`;
  const inKey = `${base}In`;
  const mmPtr = `/setup/${mmKey}`;
  const inPtr = `/setup/${inKey}`;
  let mm: number | null = null;
  let inches: number | null = null;
  if (!isAbsent(s[mmKey])) {
    if (isNonNegative(s[mmKey])) mm = s[mmKey] as number;
    else invalid(out, mmPtr, label, "a number, 0 or more", s[mmKey]);
  }
  if (!isAbsent(s[inKey])) {
    if (isNonNegative(s[inKey])) inches = s[inKey] as number;
    else invalid(out, inPtr, label, "a number, 0 or more", s[inKey]);
  }
  if (mm !== null && inches !== null) {
    if (Math.abs(mm - inToMm(inches)) > DUAL_UNIT_AGREEMENT_MM) {
      out.push(
        finding(
          "units_inconsistent",
          inPtr,
          `${label} is given twice and the two disagree: ${mm} mm in "${mmKey}" but ${inches} in (${inToMm(inches).toFixed(3)} mm) in "${inKey}". The millimetre value is used for the other checks.`,
          mm,
          inToMm(inches),
          "mm",
        ),
      );
    }
    return { mm, pointer: mmPtr };
  }
  if (mm !== null) return { mm, pointer: mmPtr };
  if (inches !== null) return { mm: inToMm(inches), pointer: inPtr };
  return { mm: null, pointer: mmPtr };
}

function readSetup(v: unknown, out: Finding[]): { given: GivenSetup; gapPointer: string } {
  if (isAbsent(v)) return { given: NOTHING_GIVEN, gapPointer: "/setup/bladeGapMm" };
  if (!isObject(v)) {
    invalid(out, "/setup", "Setup", "an object", v);
    return { given: NOTHING_GIVEN, gapPointer: "/setup/bladeGapMm" };
  }
  let rakeDeg: number | null = null;
  if (!isAbsent(v.rakeDeg)) {
    if (isNonNegative(v.rakeDeg)) rakeDeg = v.rakeDeg;
    else invalid(out, "/setup/rakeDeg", "Rake", "a number of degrees, 0 or more", v.rakeDeg);
  }
  let holdDownPct: number | null = null;
  if (!isAbsent(v.holdDownPct)) {
    if (isNonNegative(v.holdDownPct) && v.holdDownPct <= 100) holdDownPct = v.holdDownPct;
    else invalid(out, "/setup/holdDownPct", "Hold-down", "a percentage from 0 to 100", v.holdDownPct);
  }
  const gap = readDualLength(v, "bladeGap", "Blade gap", out);
  const crown = readDualLength(v, "crown", "Crown", out);
  const retract = readDualLength(v, "backgaugeRetract", "Backgauge retract", out);
  return { given: { rakeDeg, gapMm: gap.mm, holdDownPct, crownMm: crown.mm, retractMm: retract.mm }, gapPointer: gap.pointer };
}

function readProgram(input: unknown, out: Finding[]): ReadProgram | null {
  if (!isObject(input)) {
    invalid(out, "", "The program", "a JSON object", input);
    return null;
  }
  if (!isLengthUnit(input.units)) {
    out.push(finding("units_inconsistent", "/units", `"units" must be "in" or "mm"; got ${describe(input.units)}. Nothing else can be checked without it.`));
    return null;
  }
  const u = input.units;
  let gradeCode: string | null = null;
  if (typeof input.grade === "string" && input.grade.trim() !== "") gradeCode = input.grade;
  else out.push(finding("grade_unknown", "/grade", `The program must name a grade; got ${describe(input.grade)}.`));
  const thickness = readThickness(input.thickness, u, out);
  const sheet = readSheet(input.sheet, u, out);
  const cuts: FlowCut[] = [];
  const skip: boolean[] = [];
  const cutsIsArray = Array.isArray(input.cuts);
  if (cutsIsArray) {
    (input.cuts as unknown[]).forEach((c, i) => {
      const r = readCut(c, i, u, out);
      cuts.push(r.cut);
      skip.push(!r.ok);
    });
    // Each group's pieces can be taken by one turning group only.
    const takenBy = new Map<number, number>();
    cuts.forEach((c, i) => {
      if (!c.turn || i === 0 || skip[i]) return;
      const source = c.from ?? i - 1;
      const earlier = takenBy.get(source);
      if (earlier === undefined) {
        takenBy.set(source, i);
        return;
      }
      out.push(finding("value_invalid", `/cuts/${i}/${c.from === null ? "turn" : "from"}`, `Group ${i + 1} turns the pieces of group ${source + 1}, but group ${earlier + 1} already took them; each group's pieces can be turned once.`));
      skip[i] = true;
    });
  } else {
    invalid(out, "/cuts", "Cuts", "a list of cut groups", input.cuts);
  }
  const setup = readSetup(input.setup, out);
  return { units: u, gradeCode, thickness, sheet, cutsIsArray, cuts, skip, given: setup.given, gapPointer: setup.gapPointer };
}

// ---------------------------------------------------------------------------
// Context
// ---------------------------------------------------------------------------

const SHEAR_POSITIVE_FIELDS = ["ratedThicknessMm", "ratedTensileMpa", "ratedRakeDeg", "bladeLengthMm", "strokesPerMin", "backgaugeSpeedMmPerS", "rakeMaxDeg", "gapMaxMm", "backgaugeMaxMm"] as const;
const SHEAR_NON_NEGATIVE_FIELDS = ["backgaugeMinMm", "rakeMinDeg", "gapMinMm", "handlingSecondsPerTurn", "handlingSecondsPerSheet"] as const;

/** The shear profile if it is usable (a clean copy), else a finding. */
function usableShear(shear: unknown, out: Finding[]): ShearProfile | null {
  if (!isObject(shear)) {
    out.push(finding("shear_unknown", "/shear", "No shear profile was found for this program, so capacity, setup and time cannot be checked."));
    return null;
  }
  const bad = [
    ...SHEAR_POSITIVE_FIELDS.filter((f) => !isPositive(shear[f])),
    ...SHEAR_NON_NEGATIVE_FIELDS.filter((f) => !isNonNegative(shear[f])),
  ];
  if (bad.length > 0) {
    out.push(finding("shear_unknown", "/shear", `The shear profile is incomplete (${bad.join(", ")}), so capacity, setup and time cannot be checked.`));
    return null;
  }
  const clean: Record<string, unknown> = {};
  for (const f of [...SHEAR_POSITIVE_FIELDS, ...SHEAR_NON_NEGATIVE_FIELDS]) clean[f] = shear[f];
  clean.maxBladeHardnessHb = isPositive(shear.maxBladeHardnessHb) ? shear.maxBladeHardnessHb : null;
  if (isNonNegative(shear.crownAtRatedMm)) clean.crownAtRatedMm = shear.crownAtRatedMm;
  if (isObject(shear.gradeThicknessLimitsMm)) {
    const limits: Record<string, number> = {};
    for (const [code, mm] of Object.entries(shear.gradeThicknessLimitsMm)) if (isPositive(mm)) limits[code] = mm;
    clean.gradeThicknessLimitsMm = limits;
  }
  return clean as unknown as ShearProfile;
}

const GRADE_FAMILIES: ReadonlySet<unknown> = new Set(["carbon-steel", "hsla-steel", "stainless", "aluminium", "copper", "abrasion-resistant"]);
const GAUGE_FAMILIES: ReadonlySet<unknown> = new Set(["msg", "galvanized", "ussg", "awg"]);
const positiveOrNull = (v: unknown): number | null => (isPositive(v) ? v : null);

/** The grade's catalogue entry if it is the program's grade (a clean copy), else a finding. */
function resolveGrade(code: string | null, grade: unknown, out: Finding[]): GradeProfile | null {
  if (code === null) return null;
  if (!isObject(grade)) {
    out.push(finding("grade_unknown", "/grade", `Grade "${code}" is not in the catalogue.`));
    return null;
  }
  if (typeof grade.code !== "string" || !sameGradeCode(grade.code, code)) {
    out.push(finding("grade_unknown", "/grade", `The program names grade "${code}" but the catalogue entry given is for ${describe(grade.code)}.`));
    return null;
  }
  if (!GRADE_FAMILIES.has(grade.family)) {
    out.push(finding("grade_incomplete", "/grade", `The catalogue entry for ${grade.code} has no known material family, so it cannot be checked.`));
    return null;
  }
  const family = grade.family as GradeProfile["family"];
  return {
    code: grade.code,
    family,
    standard: typeof grade.standard === "string" ? grade.standard : "",
    yieldMpa: positiveOrNull(grade.yieldMpa),
    tensileMinMpa: positiveOrNull(grade.tensileMinMpa),
    tensileTypicalMpa: positiveOrNull(grade.tensileTypicalMpa),
    tensileMaxMpa: positiveOrNull(grade.tensileMaxMpa),
    valuesAreTypical: grade.valuesAreTypical === true,
    shearTensileRatio: isPositive(grade.shearTensileRatio) ? grade.shearTensileRatio : DEFAULT_SHEAR_TENSILE_RATIO[family],
    gaugeFamily: GAUGE_FAMILIES.has(grade.gaugeFamily) ? (grade.gaugeFamily as GradeProfile["gaugeFamily"]) : null,
    hardnessHb: positiveOrNull(grade.hardnessHb),
  };
}

function resolveTensile(grade: GradeProfile | null, out: Finding[]): GradeTensile | null {
  if (grade === null) return null;
  const t = gradeTensile(grade);
  if (t === null) out.push(finding("grade_incomplete", "/grade", `Grade ${grade.code} has no tensile strength in the catalogue, so force and capacity cannot be checked.`));
  return t;
}

function resolveThickness(t: Thickness | null, grade: GradeProfile | null, gradeCode: string | null, out: Finding[]): number | null {
  if (t === null) return null;
  if (t.kind === "value") return t.mm;
  if (grade === null) {
    out.push(finding("gauge_unknown", t.pointer, `Gauge ${t.gauge} cannot be resolved because the grade${gradeCode ? ` "${gradeCode}"` : ""} is unknown.`, null, t.gauge, "gauge"));
    return null;
  }
  const family = grade.gaugeFamily;
  if (family === null) {
    out.push(finding("gauge_unknown", t.pointer, `${grade.code} has no gauge system; give the thickness as a value.`, null, t.gauge, "gauge"));
    return null;
  }
  const mm = gaugeThicknessMm(family, t.gauge);
  if (mm === null) {
    const r = GAUGE_RANGES[family];
    out.push(finding("gauge_unknown", t.pointer, `Gauge ${t.gauge} is not defined in the ${GAUGE_FAMILY_NAMES[family]} used for ${grade.code} (whole numbers ${r.min} to ${r.max}).`, null, t.gauge, "gauge"));
  }
  return mm;
}

/**
 * Inch programs whose sizes look like millimetres (ours): a sheet edge more than
 * UNITS_SUSPECT_FACTOR × the blade length in inches, or a thickness more than
 * that many times the rated thickness, that would fit if read as millimetres.
 */
export const UNITS_SUSPECT_FACTOR = 4;

function checkUnitsSuspect(p: ReadProgram, shear: ShearProfile): Finding[] {
  if (p.units !== "in") return [];
  const looksMm = (raw: number, limitMm: number): boolean => raw > UNITS_SUSPECT_FACTOR * mmToIn(limitMm) && raw <= limitMm;
  const t = p.thickness;
  let what: string | null = null;
  if (p.sheet !== null && looksMm(p.sheet.rawLength, shear.bladeLengthMm)) {
    what = `a ${p.sheet.rawLength} in sheet edge is far longer than the ${fmtLength(shear.bladeLengthMm, "in")} blade`;
  } else if (t !== null && t.kind === "value" && looksMm(t.raw, shear.ratedThicknessMm)) {
    what = `a ${t.raw} in thickness is far over the ${fmtLength(shear.ratedThicknessMm, "in")} rating`;
  }
  if (what === null) return [];
  return [finding("units_suspect", "/units", `The program is in inches, but ${what}; read as millimetres it would fit. Check "units".`)];
}

// ---------------------------------------------------------------------------
// The check
// ---------------------------------------------------------------------------

interface ForceResult {
  setup: ResolvedSetup;
  report: ForceReport;
  findings: Finding[];
}

function computeForceAndSetup(
  p: ReadProgram,
  flow: FlowResult | null,
  shear: ShearProfile,
  grade: GradeProfile,
  tensile: GradeTensile,
  thicknessMm: number,
  thicknessPointer: string,
): ForceResult {
  const shearMpa = gradeShearStrengthMpa(grade) ?? tensile.mpa;
  const cuts: Array<{ group: number; cutLengthMm: number }> =
    flow === null
      ? [{ group: -1, cutLengthMm: shear.bladeLengthMm }]
      : flow.groups.filter((g) => g.strokes > 0 && g.cutLengthMm > 0 && !p.skip[g.index]).map((g) => ({ group: g.index, cutLengthMm: g.cutLengthMm }));
  const forceAt = (lengthMm: number, rakeDeg: number): CutForce => cutForce({ tensileMpa: tensile.mpa, shearMpa, thicknessMm, lengthMm, rakeDeg });
  // The raked force does not depend on the length of cut and the straight-blade cap grows with it,
  // so the longest cut needs the most force.
  const longestMm = cuts.reduce((m, c) => Math.max(m, c.cutLengthMm), 0);
  const requiredKnAt = (rakeDeg: number): number => (longestMm > 0 ? forceAt(longestMm, rakeDeg).kn : 0);
  const ratedKn = ratedForceKn(shear);
  const setup = resolveSetup({ grade, tensileMpa: tensile.mpa, thicknessMm, shear, ratedKn, units: p.units, given: p.given, requiredKnAt });
  const maxThickness = maxThicknessForGradeMm(shear, grade.code, tensile.mpa);
  const findings = [
    ...checkThickness(thicknessMm, maxThickness, grade.code, thicknessPointer, p.units),
    ...(setup.requiredKn > 0 ? checkForce(setup.requiredKn, ratedKn, setup.rakeDeg, p.given.rakeDeg !== null ? "/setup/rakeDeg" : thicknessPointer, p.units) : []),
  ];
  const report = forceReport({
    units: p.units,
    requiredKn: setup.requiredKn,
    ratedKn,
    rakeDeg: setup.rakeDeg,
    tensile,
    maxThickness,
    gradeCode: grade.code,
    shear,
    byGroup: flow === null ? [] : groupForces(cuts, tensile.mpa, shearMpa, thicknessMm, setup.rakeDeg),
  });
  return { setup, report, findings };
}

/** Force of each group at one rake (the raked force is computed once: it does not depend on the length of cut). */
function groupForces(
  cuts: ReadonlyArray<{ group: number; cutLengthMm: number }>,
  tensileMpa: number,
  shearMpa: number,
  thicknessMm: number,
  rakeDeg: number,
): Array<{ group: number; cutLengthMm: number; force: CutForce }> {
  const raked = rakedForceKn(tensileMpa, thicknessMm, rakeDeg);
  return cuts.map((c) => {
    const straight = straightForceKn(shearMpa, c.cutLengthMm, thicknessMm);
    const force: CutForce = straight < raked ? { kn: straight, model: "straight" } : { kn: raked, model: "raked" };
    return { group: c.group, cutLengthMm: c.cutLengthMm, force };
  });
}

function thicknessReport(t: Thickness, mm: number, grade: GradeProfile | null, u: LengthUnit): ThicknessReport {
  return {
    value: showLength(mm, u),
    unit: u,
    source: t.kind,
    gauge: t.kind === "gauge" ? t.gauge : null,
    gaugeFamily: t.kind === "gauge" ? (grade?.gaugeFamily ?? null) : null,
  };
}

const emptyResult = (findings: Finding[], units: LengthUnit | null): CheckResult => ({
  validation: validationOf(findings),
  units,
  findings,
  thickness: null,
  setup: null,
  force: null,
  yield: null,
  estimate: null,
});

/**
 * Check a cut program against its shear and grade.
 *
 * @param input the cut program as submitted (any value is accepted; problems become findings)
 * @param context the shear profile and the grade's catalogue entry (null when the catalogue has none)
 */
export function checkProgram(input: CutProgram | unknown, context: CheckContext): CheckResult {
  const findings: Finding[] = [];
  const p = readProgram(input, findings);
  if (p === null) return emptyResult(findings, null);
  const u = p.units;
  const ctx: Partial<CheckContext> = isObject(context) ? context : {};
  const shear = usableShear(ctx.shear, findings);
  const grade = resolveGrade(p.gradeCode, ctx.grade, findings);
  const tensile = resolveTensile(grade, findings);
  const thicknessMm = resolveThickness(p.thickness, grade, p.gradeCode, findings);
  if (shear !== null) findings.push(...checkUnitsSuspect(p, shear));
  const flow = p.sheet !== null ? simulateFlow(p.sheet, p.cuts) : null;

  let forced: ForceResult | null = null;
  if (shear !== null && grade !== null && tensile !== null && thicknessMm !== null && p.thickness !== null) {
    forced = computeForceAndSetup(p, flow, shear, grade, tensile, thicknessMm, p.thickness.pointer);
    findings.push(...forced.findings);
  }
  if (shear !== null && grade !== null) findings.push(...checkHardness(grade, shear));
  if (shear !== null) findings.push(...checkGivenSetup(p.given, p.gapPointer, shear, u));
  if (flow !== null && p.cutsIsArray) findings.push(...checkGroups({ flow, cuts: p.cuts, skip: p.skip, shear, thicknessMm, units: u }));

  const estimate =
    flow !== null && shear !== null && p.sheet !== null
      ? estimateReport(
          estimateCycle({
            flow,
            cuts: p.cuts,
            sheets: p.sheet.count,
            shear,
            rakeDeg: forced?.setup.rakeDeg ?? p.given.rakeDeg ?? shear.ratedRakeDeg,
            thicknessMm: thicknessMm ?? 0,
          }),
        )
      : null;

  return {
    validation: validationOf(findings),
    units: u,
    findings,
    thickness: p.thickness !== null && thicknessMm !== null ? thicknessReport(p.thickness, thicknessMm, grade, u) : null,
    setup: forced?.setup.report ?? null,
    force: forced?.report ?? null,
    yield: flow !== null && p.sheet !== null ? yieldReport(flow, p.sheet.count, u) : null,
    estimate,
  };
}

export interface SetupRecommendation {
  setup: SetupReport;
  force: ForceReport;
}

/**
 * Setup recommendation for a grade × thickness × shear, for a full-length cut
 * (or `cutLengthMm`). Null when the grade has no tensile strength.
 */
export function recommendSetup(args: {
  grade: GradeProfile;
  shear: ShearProfile;
  thicknessMm: number;
  units: LengthUnit;
  cutLengthMm?: number;
}): SetupRecommendation | null {
  const tensile = gradeTensile(args.grade);
  if (tensile === null || !isPositive(args.thicknessMm)) return null;
  const shearMpa = gradeShearStrengthMpa(args.grade) ?? tensile.mpa;
  const lengthMm = args.cutLengthMm ?? args.shear.bladeLengthMm;
  const at = (rakeDeg: number): CutForce => cutForce({ tensileMpa: tensile.mpa, shearMpa, thicknessMm: args.thicknessMm, lengthMm, rakeDeg });
  const ratedKn = ratedForceKn(args.shear);
  const setup = resolveSetup({
    grade: args.grade,
    tensileMpa: tensile.mpa,
    thicknessMm: args.thicknessMm,
    shear: args.shear,
    ratedKn,
    units: args.units,
    given: NOTHING_GIVEN,
    requiredKnAt: (r) => at(r).kn,
  });
  const force = forceReport({
    units: args.units,
    requiredKn: setup.requiredKn,
    ratedKn,
    rakeDeg: setup.rakeDeg,
    tensile,
    maxThickness: maxThicknessForGradeMm(args.shear, args.grade.code, tensile.mpa),
    gradeCode: args.grade.code,
    shear: args.shear,
    byGroup: [{ group: -1, cutLengthMm: lengthMm, force: at(setup.rakeDeg) }],
  });
  return { setup: setup.report, force };
}
