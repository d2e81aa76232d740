/**
 * A whole order, planned: the request's lengths put on an integer grid (`order-limits.ts`, which
 * also refuses orders outside the limits), the planner run on the grid, every sheet pattern
 * written as a cut program and checked by the shear core, and the answer turned back into the
 * order's units with its findings. Pure: no I/O; the caller supplies the shear and grade
 * profiles and receives plain data. The API's service calls `checkOrderLimits` on the web
 * process (cheap) and the worker thread calls `planOrder` (the CPU-heavy part).
 */
import { checkProgram } from "../shear";
import { checkOrderLimits, MM_PER_UNIT, percent, round, type Order, type OrderBlank } from "./order-limits";
import type { PlanProgress } from "./plan";
import { planRemnantsFirst } from "./remnants-first";
import { compressStrips, type PlanContext, type PlanFinding, type PlannedOrder, type PlannedPattern } from "./planned";

export { PLAN_LIMITS, type Order } from "./order-limits";

/** A, B … Z, AA, AB …: the key of the pattern at this index. */
const patternKey = (index: number): string =>
  index < 26
    ? String.fromCharCode(65 + index)
    : `${patternKey(Math.floor(index / 26) - 1)}${String.fromCharCode(65 + (index % 26))}`;

/**
 * Plan an order: the CPU-heavy part. Lengths go onto the order's grid, the planner lays out
 * the sheets, and each pattern's program is checked by the shear core. `onProgress` hears
 * after every sheet pattern found.
 */
export async function planOrder(
  order: Order,
  context: PlanContext,
  onProgress?: (progress: PlanProgress) => void,
): Promise<PlannedOrder> {
  const profile = context.shear;
  const grid = checkOrderLimits(order, profile);
  const unitMm = MM_PER_UNIT[order.units];
  const toGrid = (value: number) => Math.round(value * grid);
  const fromGrid = (value: number) => round(value / grid, 9); // exact on every grid (1/64 in = 0.015625); 9 places only drop float noise
  const options = order.options ?? {};
  const canTurn = (blank: OrderBlank) => blank.canTurn ?? true;
  const reusable = options.reusableOffcut
    ? {
        length: Math.ceil(options.reusableOffcut.length * grid - 1e-9),
        width: Math.ceil(options.reusableOffcut.width * grid - 1e-9),
      }
    : null;
  const planned = await planRemnantsFirst(
    order.stock.map((sheet) => ({
      length: toGrid(sheet.length),
      width: toGrid(sheet.width),
      count: sheet.count ?? null,
    })),
    order.blanks.map((blank) => ({
      label: blank.label,
      length: toGrid(blank.length),
      width: toGrid(blank.width),
      quantity: blank.quantity,
      canTurn: canTurn(blank),
    })),
    order.stock.map((sheet) => sheet.remnant === true),
    {
      objective: options.objective ?? "fewest_sheets",
      trim: toGrid(options.trim ?? 0),
      overProductionPct: options.overProductionPct ?? 0,
      reusable,
      offcutsAsStock: options.offcutsAsStock ?? false,
      limits: {
        bladeLength: Math.floor((profile.bladeLengthMm / unitMm) * grid + 1e-9),
        backgaugeMin: Math.ceil((profile.backgaugeMinMm / unitMm) * grid - 1e-9),
        backgaugeMax: Math.floor((profile.backgaugeMaxMm / unitMm) * grid + 1e-9),
      },
      mmPerUnit: unitMm / grid,
      show: (value) => `${fromGrid(value)} ${order.units}`,
      onProgress,
    },
  );

  let estimateSeconds = 0;
  const findings: PlanFinding[] = [];
  const patterns: PlannedPattern[] = planned.patterns.map((pattern, index) => {
    const key = patternKey(index);
    const cuts = pattern.cuts.map((cut) => ({ ...cut, backgauge: fromGrid(cut.backgauge) }));
    const program = {
      reference: key,
      shear: order.shear,
      grade: order.grade,
      thickness: order.thickness,
      units: order.units,
      sheet: { length: fromGrid(pattern.length), width: fromGrid(pattern.width), count: pattern.repeats },
      cuts,
    };
    const check = checkProgram(program, context);
    estimateSeconds += check.estimate?.seconds.total ?? 0;
    if (check.validation === "fail") {
      findings.push({
        code: "pattern_not_releasable",
        severity: "warning",
        pointer: `/patterns/${index}`,
        actual: null,
        message: `Pattern ${key}'s program has errors the shear core will not release (${[...new Set(check.findings.filter((finding) => finding.severity === "error").map((finding) => finding.code))].join(", ")}).`,
      });
    }
    return {
      key,
      stock: pattern.stock,
      sheet: { length: fromGrid(pattern.length), width: fromGrid(pattern.width) },
      rotated: pattern.rotated,
      repeats: pattern.repeats,
      utilisationPct: percent(pattern.utilisation),
      strips: compressStrips(
        pattern.strips.map((strip) => ({
          y: fromGrid(strip.y),
          width: fromGrid(strip.width),
          pieces: strip.pieces.map((piece) => ({
            blank: piece.blank,
            label: order.blanks[piece.blank].label,
            x: fromGrid(piece.x),
            y: fromGrid(piece.y),
            length: fromGrid(piece.length),
            width: fromGrid(piece.width),
            turned: piece.turned,
          })),
        })),
      ),
      offcuts: pattern.offcuts.map((offcut) => ({
        x: fromGrid(offcut.x),
        y: fromGrid(offcut.y),
        length: fromGrid(offcut.length),
        width: fromGrid(offcut.width),
        kind: offcut.kind,
        reusable: offcut.reusable,
      })),
      strokes: pattern.strokes,
      turns: pattern.turns,
      cuts,
      check: { validation: check.validation, findings: check.findings, estimate: check.estimate },
    };
  });

  const short = order.blanks.map(() => 0);
  for (const unplaced of planned.unplaced) {
    short[unplaced.blank] += unplaced.quantity;
    const label = order.blanks[unplaced.blank].label;
    findings.push({
      code: unplaced.kind === "unplaceable" ? "blank_unplaceable" : "stock_short",
      severity: "error",
      pointer: `/blanks/${unplaced.blank}`,
      actual: unplaced.quantity,
      message:
        unplaced.kind === "unplaceable"
          ? `"${label}": ${unplaced.quantity} not planned. ${unplaced.reason}.`
          : `"${label}": ${unplaced.quantity} not planned: not enough stock on hand.`,
    });
  }
  planned.extra.forEach((extra, index) => {
    if (extra <= 0) return;
    const blank = order.blanks[index];
    findings.push({
      code: "over_production",
      severity: "warning",
      pointer: `/blanks/${index}`,
      actual: extra,
      message: `"${blank.label}": ${extra} more than the ${blank.quantity} asked (within the ${options.overProductionPct ?? 0} % allowance).`,
    });
  });
  const trim = options.trim ?? 0;
  const travel = { min: profile.backgaugeMinMm / unitMm, max: profile.backgaugeMaxMm / unitMm };
  if (trim > 0 && (trim < travel.min - 1e-9 || trim > travel.max + 1e-9)) {
    findings.push({
      code: "trim_out_of_travel",
      severity: "error",
      pointer: "/options/trim",
      actual: trim,
      message: `A trim of ${trim} ${order.units} is outside this shear's backgauge travel (${round(travel.min, 4)} to ${round(travel.max, 4)} ${order.units}): the trim cut cannot be gauged, and the programs will not release.`,
    });
  }
  for (const index of planned.unusableStock) {
    const stock = order.stock[index];
    const why =
      Math.max(stock.length, stock.width) <= trim
        ? `is no wider than the ${trim} ${order.units} trim`
        : `is longer than this shear's blade both ways round`;
    findings.push({
      code: "stock_unusable",
      severity: "warning",
      pointer: `/stock/${index}`,
      actual: null,
      message: `Stock ${stock.length} × ${stock.width} ${order.units} ${why}; it was not used.`,
    });
  }

  const used = order.stock.map(() => 0);
  for (const pattern of planned.patterns) used[pattern.stock] += pattern.repeats;
  const asked = order.blanks.reduce((total, blank) => total + blank.quantity, 0);
  const sum = (values: number[]) => values.reduce((total, value) => total + value, 0);
  const shortTotal = sum(short);
  return {
    coverage: shortTotal > 0 ? "partial" : "complete",
    stock: order.stock.map((sheet, index) => ({ ...sheet, count: sheet.count ?? null, used: used[index] })),
    blanks: order.blanks.map((blank, index) => ({
      ...blank,
      canTurn: canTurn(blank),
      planned: planned.produced[index],
      extra: planned.extra[index],
      short: short[index],
    })),
    options: {
      objective: options.objective ?? "fewest_sheets",
      trim: options.trim ?? 0,
      overProductionPct: options.overProductionPct ?? 0,
      reusableOffcut: options.reusableOffcut ?? null,
      offcutsAsStock: options.offcutsAsStock ?? false,
    },
    summary: {
      sheets: planned.sheetsUsed,
      patterns: planned.patterns.length,
      blanksAsked: asked,
      blanksPlanned: sum(planned.produced),
      extra: sum(planned.extra),
      short: shortTotal,
      utilisationPct: percent(planned.utilisation),
      netUtilisationPct: percent(planned.netUtilisation),
      strokes: planned.strokes,
      turns: planned.turns,
      estimateSeconds: round(estimateSeconds, 1),
      lowerBoundSheets: planned.lowerBound,
      provenFewest: planned.provenFewest,
      bounds: { areaSheets: planned.bounds.area, apartSheets: planned.bounds.apart, lpSheets: planned.bounds.lp },
      method: planned.method,
      methodNote: planned.methodNote,
    },
    patterns,
    reusableOffcuts: planned.reusable.map((offcut) => ({
      length: fromGrid(offcut.length),
      width: fromGrid(offcut.width),
      count: offcut.count,
    })),
    findings,
  };
}
