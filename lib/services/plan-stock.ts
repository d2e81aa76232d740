/**
 * A plan's sheets drawn from the shop's stock (`"stock": "on_hand"`): the items of the plan's
 * grade and thickness with sheets available, remnants first (smallest first), each as a row
 * naming its item, so writing the plan's programs can reserve exactly the sheets each pattern
 * uses. Sizes go into the plan's units rounded down (whole mm, or 1/16 in), so a row never
 * claims more sheet than the rack holds and stays on a grid the planner takes.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { StockItem, type GradeEntity } from "../../entities";
import { invalidRequest } from "../errors";
import { PLAN_LIMITS } from "../planner/order";
import type { PlanInputT, PlanOrderT } from "../schemas/plan";
import { gaugeThicknessMm, lengthToMm, MM_PER_IN, type GaugeFamily } from "../shear";
import { reserveIn } from "./stock";

/** Stock counts as the plan's thickness within 0.5 % or 0.01 mm, whichever is larger (a figure of ours). */
const sameThickness = (a: number, b: number) => Math.abs(a - b) <= Math.max(0.01, 0.005 * b);

function thicknessMm(input: PlanInputT, grade: GradeEntity | null): number | null {
  if ("value" in input.thickness) return lengthToMm(input.thickness.value, input.units);
  return grade?.gaugeFamily ? gaugeThicknessMm(grade.gaugeFamily as GaugeFamily, input.thickness.gauge) : null;
}

const inUnits = (mm: number, units: PlanInputT["units"]) =>
  units === "mm" ? Math.floor(mm + 1e-9) : Math.floor((mm / MM_PER_IN) * 16 + 1e-9) / 16;

/**
 * At most the planner's number of stock sizes: every full-sheet item keeps its place first (the
 * order must be cuttable from what the racks hold), and the remnants fill the places left,
 * smallest first as listed, so a rack full of small remnants never crowds the full sheets out.
 */
function keepWithinLimit<T extends { remnant: boolean }>(rows: T[]): T[] {
  const sheets = rows.filter((r) => !r.remnant).slice(0, PLAN_LIMITS.stockSizes);
  const remnants = rows.filter((r) => r.remnant).slice(0, PLAN_LIMITS.stockSizes - sheets.length);
  return [...remnants, ...sheets];
}

/** The order with its stock as explicit rows; `"on_hand"` is drawn from the shop's stock (422 when there is none). */
export async function drawStock(
  em: EntityManager,
  shopId: string,
  input: PlanInputT,
  grade: GradeEntity | null,
): Promise<PlanOrderT> {
  if (input.stock !== "on_hand") return { ...input, stock: input.stock };
  const mm = thicknessMm(input, grade);
  const items =
    mm === null
      ? []
      : (
          await em.find(
            StockItem,
            { shop: shopId, gradeCode: input.grade, archivedAt: null },
            { orderBy: { id: "asc" }, refresh: true },
          )
        ).filter((s) => sameThickness(s.thicknessMm, mm) && s.quantity > s.reserved);
  items.sort(
    (a, b) =>
      Number(a.kind !== "remnant") - Number(b.kind !== "remnant") ||
      a.lengthMm * a.widthMm - b.lengthMm * b.widthMm ||
      (a.id < b.id ? -1 : 1),
  );
  const usable = items
    .map((item) => ({
      length: inUnits(item.lengthMm, input.units),
      width: inUnits(item.widthMm, input.units),
      count: item.quantity - item.reserved,
      label: [item.kind === "remnant" ? "remnant" : "sheet", item.location].filter(Boolean).join(" · "),
      remnant: item.kind === "remnant",
      item: item.id,
    }))
    .filter((r) => r.length > 0 && r.width > 0);
  const rows = keepWithinLimit(usable);
  if (!rows.length) {
    const message = `no ${input.grade} stock of this thickness has sheets available`;
    throw invalidRequest(`The plan cannot draw on stock: ${message}.`, [
      { location: "body", pointer: "/stock", message },
    ]);
  }
  return { ...input, stock: rows };
}

/** Reserve the sheets a written pattern uses from the item its row names (in the writing transaction). */
export async function reservePattern(
  tx: EntityManager,
  shopId: string,
  order: PlanOrderT,
  pattern: { stock: number; repeats: number },
  programId: string,
) {
  const item = order.stock[pattern.stock]?.item;
  if (item) await reserveIn(tx, shopId, item, pattern.repeats, { program: programId });
}
