/**
 * An order as the API receives it, and the limits every order must keep before any work
 * starts: sizes and counts, the integer grid its lengths are planned on, and the estimated
 * work. Cheap: `checkOrderLimits` is safe to call on the process answering requests.
 */
import type { LengthUnit, ShearProfile } from "../shear";
import type { Objective } from "./types";

export interface OrderStock {
  length: number;
  width: number;
  count?: number | null;
  label?: string;
  /** a remnant: planned before the rows that are not */
  remnant?: boolean;
  /** the stock item the row was drawn from (the service reserves it when the programs are written) */
  item?: string;
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
  shear?: string;
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
  stockSizes: 10,
  /** grid steps along either side of a sheet (the planner's tables run along the sheet in steps) */
  gridSteps: 60_000,
  /** a sheet's longer side, as a multiple of the shear's blade length */
  sheetToBlade: 10,
  /** estimated table cells for one round of strip filling: grid steps along the blade × blank presentations × strip widths */
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

export const MM_PER_UNIT: Record<LengthUnit, number> = { mm: 1, in: 25.4 };
/** Grid steps tried, finest last: whole units, halves … 1/64 in, tenths, hundredths, thousandths. */
const GRIDS: Record<LengthUnit, number[]> = { mm: [1, 2, 10, 100], in: [1, 2, 4, 8, 16, 32, 64, 10, 100, 1000] };

export const round = (value: number, places = 4) => Math.round(value * 10 ** places) / 10 ** places;
export const percent = (value: number) => round(value * 100, 2);
const stepName = (units: LengthUnit, grid: number) =>
  units === "mm" ? `${1 / grid} mm` : grid === 64 ? "1/64 in" : `${1 / grid} in`;

/** The coarsest grid (steps per unit) on which every length of the order lies exactly. */
export function gridFor(order: Order): number {
  const lengths: { value: number; pointer: string }[] = [];
  order.stock.forEach((sheet, index) =>
    lengths.push(
      { value: sheet.length, pointer: `/stock/${index}/length` },
      { value: sheet.width, pointer: `/stock/${index}/width` },
    ),
  );
  order.blanks.forEach((blank, index) =>
    lengths.push(
      { value: blank.length, pointer: `/blanks/${index}/length` },
      { value: blank.width, pointer: `/blanks/${index}/width` },
    ),
  );
  if (order.options?.trim) lengths.push({ value: order.options.trim, pointer: "/options/trim" });
  const longest = Math.max(...order.stock.map((sheet) => Math.max(sheet.length, sheet.width)));
  const onGrid = (value: number, grid: number) => Math.abs(value * grid - Math.round(value * grid)) < 1e-6;
  for (const grid of GRIDS[order.units]) {
    if (longest * grid > PLAN_LIMITS.gridSteps) break;
    if (lengths.every((entry) => onGrid(entry.value, grid))) return grid;
  }
  const finest = GRIDS[order.units].filter((grid) => longest * grid <= PLAN_LIMITS.gridSteps).pop();
  if (finest === undefined) {
    const at = order.stock.findIndex((sheet) => Math.max(sheet.length, sheet.width) === longest);
    const coarsest = GRIDS[order.units][0];
    throw new OrderRefused(
      `A sheet side of ${longest} ${order.units} is ${Math.round(longest * coarsest)} steps of ${stepName(order.units, coarsest)}; the planner takes at most ${PLAN_LIMITS.gridSteps} steps along a side.`,
      "gridSteps",
      `/stock/${at}`,
      Math.round(longest * coarsest),
      PLAN_LIMITS.gridSteps,
    );
  }
  const off = lengths.find((entry) => !onGrid(entry.value, finest)) ?? lengths[0];
  const step = stepName(order.units, finest);
  throw new OrderRefused(
    `The planner works on a ${step} grid for sheets this size; ${off.value} is not a multiple of it.`,
    "grid",
    off.pointer,
    off.value,
    null,
  );
}

/**
 * Refuse an order outside `PLAN_LIMITS` (throws `OrderRefused` naming the limit and the value);
 * returns the grid it will be planned on. Cheap: safe to call on the process answering requests.
 */
export function checkOrderLimits(order: Order, shear: Pick<ShearProfile, "bladeLengthMm">): number {
  const refuse = (limit: PlanLimit, what: string, value: number, pointer: string) => {
    throw new OrderRefused(
      `${what} is ${value}; a plan takes at most ${PLAN_LIMITS[limit]} (limit \`${limit}\`).`,
      limit,
      pointer,
      value,
      PLAN_LIMITS[limit],
    );
  };
  if (order.blanks.length > PLAN_LIMITS.blankTypes)
    refuse("blankTypes", "The number of blank types", order.blanks.length, "/blanks");
  if (order.stock.length > PLAN_LIMITS.stockSizes)
    refuse("stockSizes", "The number of stock sizes", order.stock.length, "/stock");
  const pieces = order.blanks.reduce((sum, blank) => sum + blank.quantity, 0);
  if (pieces > PLAN_LIMITS.totalPieces) refuse("totalPieces", "The number of pieces asked for", pieces, "/blanks");
  const unitMm = MM_PER_UNIT[order.units];
  order.stock.forEach((sheet, index) => {
    const ratio = (Math.max(sheet.length, sheet.width) * unitMm) / shear.bladeLengthMm;
    if (ratio > PLAN_LIMITS.sheetToBlade) {
      throw new OrderRefused(
        `Stock ${sheet.length} × ${sheet.width} ${order.units} is ${round(ratio, 1)} times this shear's blade (${round(shear.bladeLengthMm / unitMm, 3)} ${order.units}); a plan takes sheets at most ${PLAN_LIMITS.sheetToBlade} times the blade (limit \`sheetToBlade\`).`,
        "sheetToBlade",
        `/stock/${index}`,
        round(ratio, 3),
        PLAN_LIMITS.sheetToBlade,
      );
    }
  });
  const grid = gridFor(order);
  const bladeSteps = Math.floor((shear.bladeLengthMm / unitMm) * grid + 1e-9);
  const alongSteps = Math.max(
    ...order.stock.map((sheet) => Math.min(Math.max(sheet.length, sheet.width), bladeSteps / grid) * grid),
  );
  const presentations = order.blanks.reduce(
    (sum, blank) => sum + ((blank.canTurn ?? true) && blank.length !== blank.width ? 2 : 1),
    0,
  );
  // either side may run across a strip: a turned blank, or any blank on a sheet presented the other way round
  const stripWidths = new Set(order.blanks.flatMap((blank) => [blank.length, blank.width])).size;
  const work = Math.round(alongSteps * presentations * stripWidths);
  if (work > PLAN_LIMITS.work) {
    throw new OrderRefused(
      `This order needs about ${work.toExponential(2)} table cells per round of strip filling (${Math.round(alongSteps)} steps of ${stepName(order.units, grid)} along the blade × ${presentations} blank presentations × ${stripWidths} strip widths); a plan may need at most ${PLAN_LIMITS.work.toExponential(0)} (limit \`work\`). Use coarser sizes or fewer blank types.`,
      "work",
      "/blanks",
      work,
      PLAN_LIMITS.work,
    );
  }
  return grid;
}
