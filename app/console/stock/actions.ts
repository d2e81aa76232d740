"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { StockAdjustInput, StockItemInput } from "@/lib/schemas/stock";
import { z } from "@/lib/schemas/zod";
import * as stock from "@/lib/services/stock";

// The API's own schemas, fed from form fields (numbers arrive as text).
const fields = StockItemInput.shape;
const done = <T extends object>(value: T) => {
  revalidatePath("/console/stock");
  return value;
};

export const addStockAction = memberAction("stock:manage")
  .inputSchema(
    zfd.formData({
      kind: zfd.text(fields.kind),
      grade: zfd.text(fields.grade),
      thicknessMm: zfd.numeric(fields.thicknessMm),
      lengthMm: zfd.numeric(fields.lengthMm),
      widthMm: zfd.numeric(fields.widthMm),
      quantity: zfd.numeric(fields.quantity),
      location: zfd.text(fields.location),
    }),
  )
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await stock.createStockItem(em, member.shopId, parsedInput);
    return done({ message: "Stock added." });
  });

export const adjustStockAction = memberAction("stock:manage")
  .inputSchema(
    zfd.formData({
      id: zfd.text(z.string().max(64)),
      delta: zfd.numeric(StockAdjustInput.shape.delta),
      reason: zfd.text(StockAdjustInput.shape.reason),
    }),
  )
  .action(async ({ parsedInput: { id, ...input }, ctx: { member, em } }) => {
    const item = await stock.adjustStock(em, member.shopId, id, input);
    return done({ message: `Now ${item.quantity} on hand.` });
  });

export const archiveStockAction = memberAction("stock:manage")
  .inputSchema(zfd.formData({ id: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput: { id }, ctx: { member, em } }) => {
    await stock.archiveStockItem(em, member.shopId, id);
    return done({ message: "Archived." });
  });
