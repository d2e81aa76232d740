/**
 * The check: a cut program against its shear and grade (findings, setup,
 * force, yield, cycle estimate), and the setup recommendation for a grade ×
 * thickness × shear without a program.
 */
import type { CheckContext, CutProgram, Finding, GradeProfile, LengthUnit, ShearProfile } from "./types";
import type { CheckResult, ForceReport, SetupReport, ThicknessReport } from "./reports";
import type { ProgramRead, ThicknessRead } from "./read";
import { readProgram } from "./read";
import { isObject, isPositive } from "./values";
import { checkUnitsSuspect, resolveGrade, resolveTensile, resolveThickness, usableShear } from "./context";
import { validationOf, checkThickness, checkForce, checkHardness, checkGivenSetup } from "./findings";
import { checkGroups } from "./groups";
import { remnantToleranceMm, simulateFlow, type FlowResult } from "./flow";
import { yieldReport } from "./yields";
import {
  cutForce,
  forceReport,
  maxThicknessForGradeMm,
  rakedForceKn,
  ratedForceKn,
  straightForceKn,
  type CutForce,
} from "./force";
import { gradeShearStrengthMpa, gradeTensile, type GradeTensile } from "./grades";
import { resolveSetup, NOTHING_GIVEN, type ResolvedSetup } from "./setup";
import { estimateCycle, estimateReport } from "./estimate";
import { showLength } from "./units";

interface ForceAndSetup {
  setup: ResolvedSetup;
  report: ForceReport;
  findings: Finding[];
}

interface GroupCut {
  group: number;
  cutLengthMm: number;
}

function computeForceAndSetup(
  program: ProgramRead,
  flow: FlowResult | null,
  shear: ShearProfile,
  grade: GradeProfile,
  tensile: GradeTensile,
  thicknessMm: number,
  thicknessPointer: string,
): ForceAndSetup {
  const shearMpa = gradeShearStrengthMpa(grade) ?? tensile.mpa;
  const cuts: GroupCut[] =
    flow === null
      ? [{ group: -1, cutLengthMm: shear.bladeLengthMm }]
      : flow.groups
          .filter((group) => group.strokes > 0 && group.cutLengthMm > 0 && !program.skip[group.index])
          .map((group) => ({ group: group.index, cutLengthMm: group.cutLengthMm }));
  const forceAt = (lengthMm: number, rakeDeg: number): CutForce =>
    cutForce({ tensileMpa: tensile.mpa, shearMpa, thicknessMm, lengthMm, rakeDeg });
  // The raked force does not depend on the length of cut and the straight-blade cap grows with it,
  // so the longest cut needs the most force.
  const longestMm = cuts.reduce((longest, cut) => Math.max(longest, cut.cutLengthMm), 0);
  const requiredKnAt = (rakeDeg: number): number => (longestMm > 0 ? forceAt(longestMm, rakeDeg).kn : 0);
  const ratedKn = ratedForceKn(shear);
  const setup = resolveSetup({
    grade,
    tensileMpa: tensile.mpa,
    thicknessMm,
    shear,
    ratedKn,
    units: program.units,
    given: program.given,
    requiredKnAt,
  });
  const maxThickness = maxThicknessForGradeMm(shear, grade.code, tensile.mpa);
  const rakePointer = program.given.rakeDeg !== null ? "/setup/rakeDeg" : thicknessPointer;
  const findings = [
    ...checkThickness(thicknessMm, maxThickness, grade.code, thicknessPointer, program.units),
    ...(setup.requiredKn > 0 ? checkForce(setup.requiredKn, ratedKn, setup.rakeDeg, rakePointer, program.units) : []),
  ];
  const report = forceReport({
    units: program.units,
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
  cuts: readonly GroupCut[],
  tensileMpa: number,
  shearMpa: number,
  thicknessMm: number,
  rakeDeg: number,
): Array<GroupCut & { force: CutForce }> {
  const raked = rakedForceKn(tensileMpa, thicknessMm, rakeDeg);
  return cuts.map((cut) => {
    const straight = straightForceKn(shearMpa, cut.cutLengthMm, thicknessMm);
    const force: CutForce = straight < raked ? { kn: straight, model: "straight" } : { kn: raked, model: "raked" };
    return { group: cut.group, cutLengthMm: cut.cutLengthMm, force };
  });
}

function thicknessReport(
  thickness: ThicknessRead,
  mm: number,
  grade: GradeProfile | null,
  units: LengthUnit,
): ThicknessReport {
  return {
    value: showLength(mm, units),
    unit: units,
    source: thickness.kind,
    gauge: thickness.kind === "gauge" ? thickness.gauge : null,
    gaugeFamily: thickness.kind === "gauge" ? (grade?.gaugeFamily ?? null) : null,
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
 *
 * The sheet as cut (where each piece lies) is not part of the check: `programLayout` places it, for
 * the callers that draw it (placing is the costliest part for many pieces).
 */
export function checkProgram(input: CutProgram | unknown, context: CheckContext): CheckResult {
  const findings: Finding[] = [];
  const program = readProgram(input, findings);
  if (program === null) return emptyResult(findings, null);
  const units = program.units;
  const given: Partial<CheckContext> = isObject(context) ? context : {};
  const shear = usableShear(given.shear, findings);
  const grade = resolveGrade(program.gradeCode, given.grade, findings);
  const tensile = resolveTensile(grade, findings);
  const thicknessMm = resolveThickness(program.thickness, grade, program.gradeCode, findings);
  if (shear !== null) findings.push(...checkUnitsSuspect(program, shear));
  const toleranceMm = remnantToleranceMm(shear);
  const flow = program.sheet !== null ? simulateFlow(program.sheet, program.cuts, { toleranceMm }) : null;

  let forced: ForceAndSetup | null = null;
  if (shear !== null && grade !== null && tensile !== null && thicknessMm !== null && program.thickness !== null) {
    forced = computeForceAndSetup(program, flow, shear, grade, tensile, thicknessMm, program.thickness.pointer);
    findings.push(...forced.findings);
  }
  if (shear !== null && grade !== null) findings.push(...checkHardness(grade, shear));
  if (shear !== null) findings.push(...checkGivenSetup(program.given, program.gapPointer, shear, units));
  if (flow !== null && program.cutsIsArray) {
    const rakeDeg = forced?.setup.rakeDeg ?? program.given.rakeDeg;
    findings.push(...checkGroups({ flow, cuts: program.cuts, skip: program.skip, shear, thicknessMm, rakeDeg, units }));
  }

  const estimate =
    flow !== null && shear !== null && program.sheet !== null
      ? estimateReport(
          estimateCycle({
            flow,
            cuts: program.cuts,
            sheets: program.sheet.count,
            shear,
            rakeDeg: forced?.setup.rakeDeg ?? program.given.rakeDeg ?? shear.ratedRakeDeg,
            thicknessMm: thicknessMm ?? 0,
          }),
        )
      : null;

  return {
    validation: validationOf(findings),
    units,
    findings,
    thickness:
      program.thickness !== null && thicknessMm !== null
        ? thicknessReport(program.thickness, thicknessMm, grade, units)
        : null,
    setup: forced?.setup.report ?? null,
    force: forced?.report ?? null,
    yield: flow !== null && program.sheet !== null ? yieldReport(flow, program.sheet.count, units, toleranceMm) : null,
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
  const forceAt = (rakeDeg: number): CutForce =>
    cutForce({ tensileMpa: tensile.mpa, shearMpa, thicknessMm: args.thicknessMm, lengthMm, rakeDeg });
  const ratedKn = ratedForceKn(args.shear);
  const setup = resolveSetup({
    grade: args.grade,
    tensileMpa: tensile.mpa,
    thicknessMm: args.thicknessMm,
    shear: args.shear,
    ratedKn,
    units: args.units,
    given: NOTHING_GIVEN,
    requiredKnAt: (rakeDeg) => forceAt(rakeDeg).kn,
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
    byGroup: [{ group: -1, cutLengthMm: lengthMm, force: forceAt(setup.rakeDeg) }],
  });
  return { setup: setup.report, force };
}
