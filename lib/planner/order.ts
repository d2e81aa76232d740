/**
 * A whole order, planned: the request's lengths put on an integer grid, the limits every
 * order must keep before any work starts, the planner run on the grid, every sheet pattern
 * written as a cut program and checked by the shear core, and the answer turned back into
 * the order's units with its findings. Pure: no I/O; the caller supplies the shear and
 * grade profiles and receives plain data. The API's service calls `checkOrderLimits` on the
 * web process (cheap) and the worker thread calls `planOrder` (the CPU-heavy part).
 */
import { checkProgram, type CheckResult, type GradeProfile, type LengthUnit, type ShearProfile } from "../shear";
import { planBlanks, type Objective, type PlanProgress } from "./plan";

export interface OrderStock {
  length: number;
  width: number;
  count?: number | null;
  label?: string;
}

export interface OrderBlank {
  label: string;
  length: number;
  width: number;
  quantity: number;
  canTurn?: boolean;
}

export interface OrderOptions {
  objective?: Objective;
  trim?: number;
  overProductionPct?: number;
  reusableOffcut?: { length: number; width: number };
  offcutsAsStock?: boolean;
}

/** An order as the API receives it (lengths in `units`). */
export interface Order {
  reference?: string;
  title?: string;
  shear: string;
  grade: string;
  thickness: { value: number } | { gauge: number };
  units: LengthUnit;
  stock: OrderStock[];
  blanks: OrderBlank[];
  options?: OrderOptions;
}

/**
 * What one plan may ask for, checked before any work starts. The planner's own work is also
 * counted as it runs (`PLAN_WORK_BUDGET` in `plan.ts`), and the worker stops a plan at a
 * wall-clock limit; these keep an order from being hopeless before it is queued.
 */
export const PLAN_LIMITS = {
  /** blank types (order lines) in one plan */
  blankTypes: 200,
  /** pieces asked for, over all blank types */
  totalPieces: 20_000,
  /** stock sizes offered */
  stockSizes: 20,
  /** grid steps along either side of a sheet (the planner's tables run along the sheet in steps) */
  gridSteps: 60_000,
  /** a sheet's longer side, as a multiple of the shear's blade length */
  sheetToBlade: 10,
  /** estimated table cells for one round of strip filling: grid steps along the blade × blank presentations × strip heights */
  work: 4_000_000_000,
} as const;

export type PlanLimit = keyof typeof PLAN_LIMITS;

/** An order outside what the planner takes: the limit, the value sent, and where. */
export class OrderRefused extends Error {
  constructor(
    message: string,
    readonly limit: PlanLimit | "grid",
    readonly pointer: string,
    readonly value: number,
    readonly max: number | null,
  ) {
    super(message);
  }
}

const MM_PER_UNIT: Record<LengthUnit, number> = { mm: 1, in: 25.4 };
/** Grid steps tried, finest last: whole units, halves … 1/64 in, tenths, hundredths, thousandths. */
const GRIDS: Record<LengthUnit, number[]> = { mm: [1, 2, 10, 100], in: [1, 2, 4, 8, 16, 32, 64, 10, 100, 1000] };

const round = (value: number, places = 4) => Math.round(value * 10 ** places) / 10 ** places;
const percent = (value: number) => round(value * 100, 2);
const stepName = (units: LengthUnit, grid: number) => (units === "mm" ? `${1 / grid} mm` : grid === 64 ? "1/64 in" : `${1 / grid} in`);

/** The coarsest grid (steps per unit) on which every length of the order lies exactly. */
export function gridFor(order: Order): number {
  const lengths: { value: number; pointer: string }[] = [];
  order.stock.forEach((s, i) => lengths.push({ value: s.length, pointer: `/stock/${i}/length` }, { value: s.width, pointer: `/stock/${i}/width` }));
  order.blanks.forEach((b, i) => lengths.push({ value: b.length, pointer: `/blanks/${i}/length` }, { value: b.width, pointer: `/blanks/${i}/width` }));
  if (order.options?.trim) lengths.push({ value: order.options.trim, pointer: "/options/trim" });
  const longest = Math.max(...order.stock.map((s) => Math.max(s.length, s.width)));
  const onGrid = (value: number, grid: number) => Math.abs(value * grid - Math.round(value * grid)) < 1e-6;
  for (const grid of GRIDS[order.units]) {
    if (longest * grid > PLAN_LIMITS.gridSteps) break;
    if (lengths.every((l) => onGrid(l.value, grid))) return grid;
  }
  const finest = GRIDS[order.units].filter((grid) => longest * grid <= PLAN_LIMITS.gridSteps).pop();
  if (finest === undefined) {
    const at = order.stock.findIndex((s) => Math.max(s.length, s.width) === longest);
    const coarsest = GRIDS[order.units][0];
    throw new OrderRefused(
      `A sheet side of ${longest} ${order.units} is ${Math.round(longest * coarsest)} steps of ${stepName(order.units, coarsest)}; the planner takes at most ${PLAN_LIMITS.gridSteps} steps along a side.`,
      "gridSteps", `/stock/${at}`, Math.round(longest * coarsest), PLAN_LIMITS.gridSteps,
    );
  }
  const off = lengths.find((l) => !onGrid(l.value, finest)) ?? lengths[0];
  const step = stepName(order.units, finest);
  throw new OrderRefused(`The planner works on a ${step} grid for sheets this size; ${off.value} is not a multiple of it.`, "grid", off.pointer, off.value, null);
}

/**
 * Refuse an order outside `PLAN_LIMITS` (throws `OrderRefused` naming the limit and the value);
 * returns the grid it will be planned on. Cheap: safe to call on the process answering requests.
 */
export function checkOrderLimits(order: Order, shear: Pick<ShearProfile, "bladeLengthMm">): number {
  const refuse = (limit: PlanLimit, what: string, value: number, pointer: string) => {
    throw new OrderRefused(`${what} is ${value}; a plan takes at most ${PLAN_LIMITS[limit]} (limit \`${limit}\`).`, limit, pointer, value, PLAN_LIMITS[limit]);
  };
  if (order.blanks.length > PLAN_LIMITS.blankTypes) refuse("blankTypes", "The number of blank types", order.blanks.length, "/blanks");
  if (order.stock.length > PLAN_LIMITS.stockSizes) refuse("stockSizes", "The number of stock sizes", order.stock.length, "/stock");
  const pieces = order.blanks.reduce((sum, b) => sum + b.quantity, 0);
  if (pieces > PLAN_LIMITS.totalPieces) refuse("totalPieces", "The number of pieces asked for", pieces, "/blanks");
  const unitMm = MM_PER_UNIT[order.units];
  order.stock.forEach((s, i) => {
    const ratio = (Math.max(s.length, s.width) * unitMm) / shear.bladeLengthMm;
    if (ratio > PLAN_LIMITS.sheetToBlade) {
      throw new OrderRefused(
        `Stock ${s.length} × ${s.width} ${order.units} is ${round(ratio, 1)} times this shear's blade (${round(shear.bladeLengthMm / unitMm, 3)} ${order.units}); a plan takes sheets at most ${PLAN_LIMITS.sheetToBlade} times the blade (limit \`sheetToBlade\`).`,
        "sheetToBlade", `/stock/${i}`, round(ratio, 3), PLAN_LIMITS.sheetToBlade,
      );
    }
  });
  const grid = gridFor(order);
  const bladeSteps = Math.floor((shear.bladeLengthMm / unitMm) * grid + 1e-9);
  const alongSteps = Math.max(...order.stock.map((s) => Math.min(Math.max(s.length, s.width), bladeSteps / grid) * grid));
  const presentations = order.blanks.reduce((sum, b) => sum + ((b.canTurn ?? true) && b.length !== b.width ? 2 : 1), 0);
  const heights = new Set(order.blanks.flatMap((b) => ((b.canTurn ?? true) ? [b.length, b.width] : [b.width, b.length]))).size;
  const work = Math.round(alongSteps * presentations * heights);
  if (work > PLAN_LIMITS.work) {
    throw new OrderRefused(
      `This order needs about ${work.toExponential(2)} table cells per round of strip filling (${Math.round(alongSteps)} steps of ${stepName(order.units, grid)} along the blade × ${presentations} blank presentations × ${heights} strip heights); a plan may need at most ${PLAN_LIMITS.work.toExponential(0)} (limit \`work\`). Use coarser sizes or fewer blank types.`,
      "work", "/blanks", work, PLAN_LIMITS.work,
    );
  }
  return grid;
}

const patternKey = (i: number): string => (i < 26 ? String.fromCharCode(65 + i) : `${patternKey(Math.floor(i / 26) - 1)}${String.fromCharCode(65 + (i % 26))}`);

export interface PlannedCut {
  backgauge: number;
  count: number;
  turn?: boolean;
  from?: number;
  length?: number;
  scrap?: boolean;
  note?: string;
}

export interface PlannedPattern {
  key: string;
  stock: number;
  sheet: { length: number; width: number };
  rotated: boolean;
  repeats: number;
  utilisationPct: number;
  /** runs: identical strips once with `repeat`, identical pieces side by side once with `count` */
  strips: PlannedStrip[];
  offcuts: { x: number; y: number; length: number; width: number; kind: "trim" | "sheet-end" | "strip-end" | "piece-trim"; reusable: boolean }[];
  strokes: number;
  turns: number;
  cuts: PlannedCut[];
  check: Pick<CheckResult, "validation" | "findings" | "estimate">;
}

export interface PieceRun {
  blank: number;
  label: string;
  x: number;
  y: number;
  length: number;
  width: number;
  turned: boolean;
  count: number;
}

export interface PlannedStrip {
  y: number;
  height: number;
  repeat: number;
  pieces: PieceRun[];
}

type PlacedPiece = Omit<PieceRun, "count">;

/**
 * Strips as runs, so a stored plan grows with its patterns, not its pieces: pieces of one blank
 * side by side along the blade become one run, and identical strips one after another one strip.
 */
export function compressStrips(strips: { y: number; height: number; pieces: PlacedPiece[] }[]): PlannedStrip[] {
  const runs = (pieces: PlacedPiece[]) => {
    const out: PieceRun[] = [];
    for (const piece of [...pieces].sort((a, b) => a.x - b.x || a.y - b.y)) {
      const last = out[out.length - 1];
      const follows = last && last.blank === piece.blank && last.turned === piece.turned && last.y === piece.y
        && last.length === piece.length && last.width === piece.width && Math.abs(last.x + last.count * last.length - piece.x) < 1e-9;
      if (follows) last.count += 1;
      else out.push({ ...piece, count: 1 });
    }
    return out;
  };
  // Two strips are alike when their runs are, each relative to the strip's own edge.
  const shape = (strip: { y: number; height: number; pieces: PieceRun[] }) =>
    JSON.stringify([strip.height, strip.pieces.map((r) => [r.blank, r.turned, r.x, r.y - strip.y, r.length, r.width, r.count])]);
  const out: (PlannedStrip & { key: string })[] = [];
  for (const strip of strips) {
    const pieces = runs(strip.pieces);
    const key = shape({ ...strip, pieces });
    const last = out[out.length - 1];
    if (last && last.key === key && Math.abs(last.y + last.repeat * last.height - strip.y) < 1e-9) last.repeat += 1;
    else out.push({ y: strip.y, height: strip.height, repeat: 1, pieces, key });
  }
  return out.map(({ key: _key, ...strip }) => strip);
}

export type PlanFindingCode = "blank_unplaceable" | "stock_short" | "over_production" | "stock_unusable" | "trim_out_of_travel" | "pattern_not_releasable";

export interface PlanFinding {
  code: PlanFindingCode;
  severity: "error" | "warning";
  message: string;
  pointer: string;
  actual: number | null;
}

/** The planner's answer in the order's units. */
export interface PlannedOrder {
  coverage: "complete" | "partial";
  stock: (OrderStock & { count: number | null; used: number })[];
  blanks: (OrderBlank & { canTurn: boolean; planned: number; extra: number; short: number })[];
  options: { objective: Objective; trim: number; overProductionPct: number; reusableOffcut: { length: number; width: number } | null; offcutsAsStock: boolean };
  summary: {
    sheets: number;
    patterns: number;
    blanksAsked: number;
    blanksPlanned: number;
    extra: number;
    short: number;
    utilisationPct: number;
    netUtilisationPct: number;
    strokes: number;
    turns: number;
    estimateSeconds: number;
  };
  patterns: PlannedPattern[];
  reusableOffcuts: { length: number; width: number; count: number }[];
  findings: PlanFinding[];
}

export interface PlanContext {
  shear: ShearProfile;
  grade: GradeProfile | null;
}

/**
 * Plan an order: the CPU-heavy part. Lengths go onto the order's grid, the planner lays out
 * the sheets, and each pattern's program is checked by the shear core. `onProgress` hears
 * after every sheet pattern found.
 */
export function planOrder(order: Order, context: PlanContext, onProgress?: (progress: PlanProgress) => void): PlannedOrder {
  const profile = context.shear;
  const grid = checkOrderLimits(order, profile);
  const unitMm = MM_PER_UNIT[order.units];
  const toGrid = (value: number) => Math.round(value * grid);
  const fromGrid = (value: number) => round(value / grid, 9); // exact on every grid (1/64 in = 0.015625); 9 places only drop float noise
  const options = order.options ?? {};
  const canTurn = (b: OrderBlank) => b.canTurn ?? true;
  const reusable = options.reusableOffcut
    ? { length: Math.ceil(options.reusableOffcut.length * grid - 1e-9), width: Math.ceil(options.reusableOffcut.width * grid - 1e-9) }
    : null;
  const planned = planBlanks(
    order.stock.map((s) => ({ length: toGrid(s.length), width: toGrid(s.width), count: s.count ?? null })),
    order.blanks.map((b) => ({ label: b.label, length: toGrid(b.length), width: toGrid(b.width), quantity: b.quantity, canTurn: canTurn(b) })),
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
  const patterns: PlannedPattern[] = planned.patterns.map((p, i) => {
    const key = patternKey(i);
    const cuts = p.cuts.map((c) => ({ ...c, backgauge: fromGrid(c.backgauge) }));
    const program = {
      reference: key, shear: order.shear, grade: order.grade, thickness: order.thickness, units: order.units,
      sheet: { length: fromGrid(p.length), width: fromGrid(p.width), count: p.repeats }, cuts,
    };
    const check = checkProgram(program, context);
    estimateSeconds += check.estimate?.seconds.total ?? 0;
    if (check.validation === "fail") {
      findings.push({
        code: "pattern_not_releasable", severity: "warning", pointer: `/patterns/${i}`, actual: null,
        message: `Pattern ${key}'s program has errors the shear core will not release (${[...new Set(check.findings.filter((f) => f.severity === "error").map((f) => f.code))].join(", ")}).`,
      });
    }
    return {
      key,
      stock: p.stock,
      sheet: { length: fromGrid(p.length), width: fromGrid(p.width) },
      rotated: p.rotated,
      repeats: p.repeats,
      utilisationPct: percent(p.utilisation),
      strips: compressStrips(p.strips.map((strip) => ({
        y: fromGrid(strip.y),
        height: fromGrid(strip.height),
        pieces: strip.pieces.map((piece) => ({
          blank: piece.blank, label: order.blanks[piece.blank].label, x: fromGrid(piece.x), y: fromGrid(piece.y),
          length: fromGrid(piece.length), width: fromGrid(piece.width), turned: piece.turned,
        })),
      }))),
      offcuts: p.offcuts.map((x) => ({ x: fromGrid(x.x), y: fromGrid(x.y), length: fromGrid(x.length), width: fromGrid(x.width), kind: x.kind, reusable: x.reusable })),
      strokes: p.strokes,
      turns: p.turns,
      cuts,
      check: { validation: check.validation, findings: check.findings, estimate: check.estimate },
    };
  });

  const short = order.blanks.map(() => 0);
  for (const u of planned.unplaced) {
    short[u.blank] += u.quantity;
    findings.push({
      code: u.kind === "unplaceable" ? "blank_unplaceable" : "stock_short",
      severity: "error",
      pointer: `/blanks/${u.blank}`,
      actual: u.quantity,
      message: u.kind === "unplaceable"
        ? `"${order.blanks[u.blank].label}": ${u.quantity} not planned. ${u.reason}.`
        : `"${order.blanks[u.blank].label}": ${u.quantity} not planned: not enough stock on hand.`,
    });
  }
  planned.extra.forEach((n, i) => {
    if (n > 0) findings.push({ code: "over_production", severity: "warning", pointer: `/blanks/${i}`, actual: n, message: `"${order.blanks[i].label}": ${n} more than the ${order.blanks[i].quantity} asked (within the ${options.overProductionPct ?? 0} % allowance).` });
  });
  const trim = options.trim ?? 0;
  const travel = { min: profile.backgaugeMinMm / unitMm, max: profile.backgaugeMaxMm / unitMm };
  if (trim > 0 && (trim < travel.min - 1e-9 || trim > travel.max + 1e-9)) {
    findings.push({
      code: "trim_out_of_travel", severity: "error", pointer: "/options/trim", actual: trim,
      message: `A trim of ${trim} ${order.units} is outside this shear's backgauge travel (${round(travel.min, 4)} to ${round(travel.max, 4)} ${order.units}): the trim cut cannot be gauged, and the programs will not release.`,
    });
  }
  for (const s of planned.unusableStock) {
    const stock = order.stock[s];
    const why = Math.max(stock.length, stock.width) <= trim ? `is no wider than the ${trim} ${order.units} trim` : `is longer than this shear's blade both ways round`;
    findings.push({ code: "stock_unusable", severity: "warning", pointer: `/stock/${s}`, actual: null, message: `Stock ${stock.length} × ${stock.width} ${order.units} ${why}; it was not used.` });
  }

  const used = order.stock.map(() => 0);
  for (const p of planned.patterns) used[p.stock] += p.repeats;
  const asked = order.blanks.reduce((sum, b) => sum + b.quantity, 0);
  const sum = (values: number[]) => values.reduce((total, n) => total + n, 0);
  const shortTotal = sum(short);
  return {
    coverage: shortTotal > 0 ? "partial" : "complete",
    stock: order.stock.map((s, i) => ({ ...s, count: s.count ?? null, used: used[i] })),
    blanks: order.blanks.map((b, i) => ({ ...b, canTurn: canTurn(b), planned: planned.produced[i], extra: planned.extra[i], short: short[i] })),
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
    },
    patterns,
    reusableOffcuts: planned.reusable.map((r) => ({ length: fromGrid(r.length), width: fromGrid(r.width), count: r.count })),
    findings,
  };
}
