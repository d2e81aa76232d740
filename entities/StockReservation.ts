import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { RESERVATION_STATUSES } from "../lib/schemas/enums";
import { Shop } from "./Shop";
import { StockItem } from "./StockItem";

/** Sheets of a stock item held for a program (or by hand) until they are cut or given back. */
export const StockReservation = defineEntity({
  name: "StockReservation",
  tableName: "stock_reservations",
  indexes: [{ properties: ["shop", "id"] }, { properties: ["program", "status"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("stockReservation")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    item: () => p.manyToOne(StockItem).deleteRule("restrict"),
    quantity: p.integer(),
    status: p.enum([...RESERVATION_STATUSES]).default("open"),
    /** the program the sheets are for; null when reserved by hand */
    program: p.string().nullable(),
    note: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    closedAt: p.datetime().nullable(),
  },
});
