import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";

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
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
