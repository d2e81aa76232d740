/**
 * A run's material, booked in the transaction that records its end: the sheets it used come out
 * of the stock reserved for its program (the rest go back), and, when it completed, each offcut
 * of its check at least the shop's remnant size both ways goes onto the racks as a remnant that
 * names the program and the run.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Shop, StockItem, StockReservation, type ProgramEntity } from "../../entities";
import type { CheckT } from "../schemas/check";
import { lengthToMm, roundTo } from "../shear";
import { recordEvent } from "./events";
import { viewReservation, viewStockItem } from "./stock";

const exec = (tx: EntityManager, sql: string, params: unknown[]) =>
  tx.getConnection().execute(sql, params, "run", tx.getTransactionContext());

/** Book `sheetsUsed` sheets out of the program's open reservations (oldest first); give back the rest. */
async function consume(tx: EntityManager, shopId: string, program: ProgramEntity, sheetsUsed: number) {
  const open = await tx.find(
    StockReservation,
    { shop: shopId, program: program.id, status: "open" },
    { orderBy: { id: "asc" }, refresh: true },
  );
  let left = sheetsUsed;
  for (const reservation of open) {
    const used = Math.min(left, reservation.quantity);
    left -= used;
    // one statement per item: the sheets used leave the rack, the whole hold is lifted
    await exec(
      tx,
      `update stock_items set quantity = quantity - ?, reserved = reserved - ?, updated_at = now() where id = ?`,
      [used, reservation.quantity, reservation.item.id],
    );
    const held = reservation.quantity;
    reservation.status = used > 0 ? "consumed" : "released";
    reservation.quantity = used > 0 ? used : held;
    reservation.closedAt = new Date();
    await tx.flush();
    const item = viewStockItem(await tx.findOneOrFail(StockItem, { id: reservation.item.id }, { refresh: true }));
    const view = viewReservation(reservation);
    if (used > 0)
      await recordEvent(tx, shopId, "stock.consumed", item.id, {
        item,
        reservation: view,
        program: program.id,
        sheets: used,
      });
    if (held > used)
      await recordEvent(tx, shopId, "stock.released", item.id, {
        item,
        reservation: { ...view, quantity: held - used },
        reason: `program ${program.id}'s run used ${used} of the ${held} sheets held`,
      });
  }
}

/** Each reusable offcut of the program's sheets (per sheet count × sheets cut), merged by size. */
function remnantsOf(check: CheckT, sheetsUsed: number, minMm: number) {
  const sizes = new Map<string, { lengthMm: number; widthMm: number; quantity: number }>();
  const y = check.yield;
  if (!y || !y.sheets) return [];
  for (const piece of y.offcuts) {
    const [alongMm, acrossMm] = [lengthToMm(piece.length, y.lengthUnit), lengthToMm(piece.width, y.lengthUnit)];
    const [lengthMm, widthMm] = [roundTo(Math.max(alongMm, acrossMm), 2), roundTo(Math.min(alongMm, acrossMm), 2)];
    const quantity = Math.floor(piece.count / y.sheets) * sheetsUsed;
    if (widthMm < minMm || quantity <= 0) continue;
    const key = `${lengthMm}x${widthMm}`;
    const had = sizes.get(key);
    sizes.set(key, { lengthMm, widthMm, quantity: (had?.quantity ?? 0) + quantity });
  }
  return [...sizes.values()];
}

/**
 * Book a run's material: `sheetsUsed` out of the program's reservations, and, for a completed
 * run (`remnants`), its reusable offcuts in as remnants.
 */
export async function bookRun(
  tx: EntityManager,
  shopId: string,
  program: ProgramEntity,
  sheetsUsed: number,
  remnants: boolean,
) {
  await consume(tx, shopId, program, sheetsUsed);
  const shop = await tx.findOneOrFail(Shop, { id: shopId }, { fields: ["remnantMinMm"] });
  const check = program.check;
  if (!remnants || !shop.remnantMinMm || !check.thickness) return;
  const thicknessMm = roundTo(lengthToMm(check.thickness.value, check.thickness.unit), 3);
  const run = `${program.id} run ended ${(program.finishedAt ?? new Date()).toISOString()}`;
  for (const size of remnantsOf(check, sheetsUsed, shop.remnantMinMm)) {
    const item = tx.create(StockItem, {
      shop: tx.getReference(Shop, shopId),
      kind: "remnant",
      gradeCode: program.gradeCode,
      thicknessMm,
      ...size,
      location: null,
      note: null,
      sourceProgram: program.id,
      sourceRun: run,
    });
    await tx.flush();
    await recordEvent(tx, shopId, "stock.remnant_added", item.id, { item: viewStockItem(item), program: program.id });
  }
}
