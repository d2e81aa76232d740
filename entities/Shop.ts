import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { ROUTING_RULES } from "../lib/schemas/enums";

/** A fabrication shop: the tenant every other record belongs to. */
export const Shop = defineEntity({
  name: "Shop",
  tableName: "shops",
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("shop")),
    name: p.text(),
    slug: p.string().unique(),
    /** how a program or plan that names no shear is given one */
    routingRule: p.enum([...ROUTING_RULES]).default("least_capacity"),
    /** offcuts at least this long both ways are booked in as remnants when a run completes; null = none */
    remnantMinMm: p.float().columnType("double precision").nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
