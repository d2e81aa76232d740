/**
 * Stock on hand: list, add, read, adjust (with a reason), archive, and reservations that hold
 * sheets for a program. Every quantity changes in one conditional UPDATE inside a transaction
 * with its event, so two reservations can never take the same sheet: the second finds too few
 * available and is refused.
 */
import type { EntityManager, FilterQuery } from "@mikro-orm/postgresql";
import { Program, Shop, StockItem, StockReservation } from "../../entities";
import type { StockItemEntity, StockReservationEntity } from "../../entities";
import { ApiError, conflict, invalidRequest, notFound } from "../errors";
import { findPage } from "../db/paging";
import type {
  ReserveInputT,
  StockAdjustInputT,
  StockItemInputT,
  StockItemT,
  StockReservationT,
} from "../schemas/stock";
import type { StockKind } from "../schemas/enums";
import { recordEvent } from "./events";
import { readsOf } from "../db/reads";

const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;

export function viewStockItem(stockItem: StockItemEntity): StockItemT {
  return {
    id: stockItem.id,
    kind: stockItem.kind,
    grade: stockItem.gradeCode,
    thicknessMm: stockItem.thicknessMm,
    lengthMm: stockItem.lengthMm,
    widthMm: stockItem.widthMm,
    quantity: stockItem.quantity,
    reserved: stockItem.reserved,
    available: stockItem.quantity - stockItem.reserved,
    location: stockItem.location ?? null,
    note: stockItem.note ?? null,
    sourceProgram: stockItem.sourceProgram ?? null,
    sourceRun: stockItem.sourceRun ?? null,
    archivedAt: iso(stockItem.archivedAt),
    createdAt: stockItem.createdAt.toISOString(),
    updatedAt: stockItem.updatedAt.toISOString(),
  };
}

export function viewReservation(stockReservation: StockReservationEntity): StockReservationT {
  return {
    id: stockReservation.id,
    item: stockReservation.item.id,
    quantity: stockReservation.quantity,
    status: stockReservation.status,
    program: stockReservation.program ?? null,
    note: stockReservation.note ?? null,
    createdAt: stockReservation.createdAt.toISOString(),
    closedAt: iso(stockReservation.closedAt),
  };
}

async function findStockItem(em: EntityManager, shopId: string, id: string): Promise<StockItemEntity> {
  const item = await em.findOne(StockItem, { id, shop: shopId }, { refresh: true });
  if (!item) throw notFound("stock item");
  return item;
}

export async function getStockItem(em: EntityManager, shopId: string, id: string): Promise<StockItemT> {
  return viewStockItem(await findStockItem(em, shopId, id));
}

export async function listStock(
  em: EntityManager,
  shopId: string,
  query: {
    limit: number;
    cursor?: string;
    grade?: string;
    thicknessMm?: number;
    kind?: StockKind;
    includeArchived?: string;
  },
) {
  const where: FilterQuery<StockItemEntity> = {
    shop: shopId,
    ...(query.grade ? { gradeCode: { $ilike: query.grade.replace(/[\\%_]/g, (c) => `\\${c}`) } } : {}),
    ...(query.thicknessMm !== undefined ? { thicknessMm: query.thicknessMm } : {}),
    ...(query.kind ? { kind: query.kind } : {}),
    ...(query.includeArchived === "true" ? {} : { archivedAt: null }),
  };
  return findPage(em, StockItem, where, query, viewStockItem);
}

export async function createStockItem(em: EntityManager, shopId: string, input: StockItemInputT): Promise<StockItemT> {
  if (input.kind === "sheet" && (input.sourceProgram || input.sourceRun)) {
    const message = "only a remnant names the program and run it came from";
    throw invalidRequest(`A full sheet has no source: ${message}.`, [
      { location: "body", pointer: input.sourceProgram ? "/sourceProgram" : "/sourceRun", message },
    ]);
  }
  return em.transactional(async (tx) => {
    const item = tx.create(StockItem, {
      shop: tx.getReference(Shop, shopId),
      kind: input.kind,
      gradeCode: input.grade,
      thicknessMm: input.thicknessMm,
      lengthMm: input.lengthMm,
      widthMm: input.widthMm,
      quantity: input.quantity,
      location: input.location ?? null,
      note: input.note ?? null,
      sourceProgram: input.sourceProgram ?? null,
      sourceRun: input.sourceRun ?? null,
    });
    await tx.flush();
    const view = viewStockItem(item);
    await recordEvent(tx, shopId, "stock.created", item.id, { item: view });
    return view;
  });
}

/** Run one conditional UPDATE on a stock item; true when it changed a row. */
async function changed(tx: EntityManager, sql: string, params: unknown[]): Promise<boolean> {
  const rows: unknown[] = await tx
    .getConnection()
    .execute(`${sql} returning id`, params, "all", tx.getTransactionContext());
  return rows.length > 0;
}

export async function adjustStock(
  em: EntityManager,
  shopId: string,
  id: string,
  input: StockAdjustInputT,
): Promise<StockItemT> {
  await findStockItem(em, shopId, id);
  return em.transactional(async (tx) => {
    const ok = await changed(
      tx,
      `update stock_items set quantity = quantity + ?, updated_at = now() where id = ? and shop_id = ? and archived_at is null and quantity + ? >= reserved`,
      [input.delta, id, shopId, input.delta],
    );
    const item = await findStockItem(tx, shopId, id);
    if (!ok) {
      if (item.archivedAt)
        throw conflict("An archived stock item cannot be adjusted.", { archivedAt: iso(item.archivedAt) });
      throw conflict(
        `That would leave ${item.quantity + input.delta} sheets, fewer than the ${item.reserved} reserved; release reservations first.`,
        { quantity: item.quantity, reserved: item.reserved },
      );
    }
    const view = viewStockItem(item);
    await recordEvent(tx, shopId, "stock.adjusted", id, { item: view, delta: input.delta, reason: input.reason });
    return view;
  });
}

export async function archiveStockItem(em: EntityManager, shopId: string, id: string): Promise<StockItemT> {
  await findStockItem(em, shopId, id);
  return em.transactional(async (tx) => {
    const ok = await changed(
      tx,
      `update stock_items set archived_at = now(), updated_at = now() where id = ? and shop_id = ? and archived_at is null and reserved = 0`,
      [id, shopId],
    );
    const item = await findStockItem(tx, shopId, id);
    if (!ok) {
      throw item.archivedAt
        ? conflict("This stock item is already archived.", { archivedAt: iso(item.archivedAt) })
        : conflict(`${item.reserved} sheets of this item are reserved; release them before archiving.`, {
            reserved: item.reserved,
          });
    }
    const view = viewStockItem(item);
    await recordEvent(tx, shopId, "stock.archived", id, { item: view });
    return view;
  });
}

/**
 * Hold sheets of a stock item in the caller's transaction: one UPDATE that succeeds only while
 * enough are available, so concurrent reservations never take the same sheet twice.
 */
export async function reserveIn(
  tx: EntityManager,
  shopId: string,
  itemId: string,
  quantity: number,
  extra: { program?: string | null; note?: string | null } = {},
): Promise<{ item: StockItemT; reservation: StockReservationT }> {
  const ok = await changed(
    tx,
    `update stock_items set reserved = reserved + ?, updated_at = now() where id = ? and shop_id = ? and archived_at is null and quantity - reserved >= ?`,
    [quantity, itemId, shopId, quantity],
  );
  const item = await findStockItem(tx, shopId, itemId);
  if (!ok) {
    throw new ApiError(
      409,
      "stock-not-available",
      "Not enough stock available",
      item.archivedAt
        ? "That stock item is archived."
        : `${quantity} asked, ${item.quantity - item.reserved} available (${item.quantity} on hand, ${item.reserved} reserved).`,
      { item: itemId, asked: quantity, available: item.archivedAt ? 0 : item.quantity - item.reserved },
    );
  }
  const reservation = tx.create(StockReservation, {
    shop: tx.getReference(Shop, shopId),
    item,
    quantity,
    program: extra.program ?? null,
    note: extra.note ?? null,
  });
  await tx.flush();
  const views = { item: viewStockItem(item), reservation: viewReservation(reservation) };
  await recordEvent(tx, shopId, "stock.reserved", itemId, views);
  return views;
}

export async function reserveStock(
  em: EntityManager,
  shopId: string,
  itemId: string,
  input: ReserveInputT,
): Promise<StockReservationT> {
  await findStockItem(em, shopId, itemId);
  if (input.program) {
    const program = await em.findOne(Program, { id: input.program, shop: shopId }, { fields: ["status"] });
    if (!program || ["completed", "failed", "cancelled"].includes(program.status)) {
      const message = program ? `the program is ${program.status}` : "no program in this shop has that id";
      throw invalidRequest(`Sheets cannot be reserved for that program: ${message}.`, [
        { location: "body", pointer: "/program", message },
      ]);
    }
  }
  return em.transactional(async (tx) => (await reserveIn(tx, shopId, itemId, input.quantity, input)).reservation);
}

/** Give back open reservations (matched by `where`) in the caller's transaction, each with its event. */
async function releaseWhere(tx: EntityManager, shopId: string, where: string, params: unknown[], reason: string) {
  const rows: { id: string; item_id: string; quantity: number }[] = await tx
    .getConnection()
    .execute(
      `update stock_reservations set status = 'released', closed_at = now() where shop_id = ? and status = 'open' and ${where} returning id, item_id, quantity`,
      [shopId, ...params],
      "all",
      tx.getTransactionContext(),
    );
  const released: StockReservationT[] = [];
  for (const row of rows) {
    await changed(tx, `update stock_items set reserved = reserved - ?, updated_at = now() where id = ?`, [
      row.quantity,
      row.item_id,
    ]);
    const [item, reservation] = await readsOf(
      tx,
      () => findStockItem(tx, shopId, row.item_id),
      () => tx.findOneOrFail(StockReservation, { id: row.id }, { refresh: true }),
    );
    const view = viewReservation(reservation);
    await recordEvent(tx, shopId, "stock.released", row.item_id, {
      item: viewStockItem(item),
      reservation: view,
      reason,
    });
    released.push(view);
  }
  return released;
}

/** A cancelled program's sheets go back to stock (called in the cancelling transaction). */
export async function releaseForProgram(tx: EntityManager, shopId: string, programId: string) {
  return releaseWhere(tx, shopId, "program = ?", [programId], `program ${programId} was cancelled`);
}

export async function releaseReservation(em: EntityManager, shopId: string, id: string): Promise<StockReservationT> {
  const found = await em.findOne(StockReservation, { id, shop: shopId });
  if (!found) throw notFound("reservation");
  return em.transactional(async (tx) => {
    const [released] = await releaseWhere(tx, shopId, "id = ?", [id], "released by hand");
    if (!released) {
      const now = await tx.findOneOrFail(StockReservation, { id }, { refresh: true });
      throw conflict(`This reservation is ${now.status}.`, { currentStatus: now.status });
    }
    return released;
  });
}
