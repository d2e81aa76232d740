"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { zodErrors } from "@/lib/api/route-input";
import { memberAction } from "@/lib/auth/action";
import { invalidRequest } from "@/lib/errors";
import { SettingsPatchSchema } from "@/lib/schemas/settings";
import { StockAdjustInputSchema, StockItemInputSchema } from "@/lib/schemas/stock";
import { z } from "@/lib/schemas/zod";
import * as settings from "@/lib/services/settings";
import * as stock from "@/lib/services/stock";

// The API's own schemas, fed from form fields (numbers arrive as text).
const fields = StockItemInputSchema.shape;
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
      delta: zfd.numeric(StockAdjustInputSchema.shape.delta),
      reason: zfd.text(StockAdjustInputSchema.shape.reason),
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

/** The shop's settings: how work without a shear is routed, and the smallest offcut kept as a remnant. */
export const settingsAction = memberAction("settings:manage")
  .inputSchema(
    zfd.formData({
      routingRule: zfd.text(SettingsPatchSchema.shape.routingRule),
      remnantMinMm: zfd.text(z.string().max(20).optional()),
    }),
  )
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const size = parsedInput.remnantMinMm === undefined ? null : Number(parsedInput.remnantMinMm);
    const patch = SettingsPatchSchema.safeParse({ routingRule: parsedInput.routingRule, remnantMinMm: size });
    if (!patch.success) throw invalidRequest("Some fields need attention.", zodErrors("body", patch.error));
    await settings.updateSettings(em, member.shopId, patch.data);
    revalidatePath("/console/shears");
    return done({ message: "Settings saved." });
  });
