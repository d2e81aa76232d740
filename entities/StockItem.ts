import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { STOCK_KINDS } from "../lib/schemas/enums";
import { Shop } from "./Shop";

const measure = () => p.float().columnType("double precision");

/**
 * Material on the shop's racks: `quantity` sheets of one grade, thickness and size at one
 * location, full sheets or remnants (a remnant names the program and run it was cut from).
 * `reserved` of them are held by open reservations; quantity never drops below it.
 */
export const StockItem = defineEntity({
  name: "StockItem",
  tableName: "stock_items",
  indexes: [{ properties: ["shop", "id"] }, { properties: ["shop", "gradeCode", "thicknessMm"] }],
  checks: [{ name: "stock_items_reserved_check", expression: "reserved >= 0 and reserved <= quantity" }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("stockItem")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    kind: p.enum([...STOCK_KINDS]),
    gradeCode: p.text(),
    thicknessMm: measure(),
    lengthMm: measure(),
    widthMm: measure(),
    quantity: p.integer(),
    reserved: p.integer().default(0),
    location: p.text().nullable(),
    note: p.text().nullable(),
    /** for a remnant: the program and the run it was cut in */
    sourceProgram: p.string().nullable(),
    sourceRun: p.text().nullable(),
    archivedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
