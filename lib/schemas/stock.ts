/**
 * Stock on hand: full sheets and remnants per grade, thickness and size, with how many of them
 * are held by reservations; the reservations themselves; and the requests that change them.
 * Lengths are millimetres (the field names say so), whatever a program's units.
 */
import { RESERVATION_STATUSES, STOCK_KINDS } from "./enums";
import { z } from "./zod";

const mm = (description: string) =>
  z
    .number()
    .positive()
    .max(100_000)
    .openapi({ description: `${description}, mm` });
const text = (max: number) => z.string().trim().min(1).max(max);

export const StockItemInputSchema = z
  .object({
    kind: z.enum(STOCK_KINDS).openapi({ description: "`sheet`: full sheets as bought; `remnant`: kept from a cut" }),
    grade: text(50).openapi({ description: "The grade's code in your catalog", example: "A36" }),
    thicknessMm: mm("Thickness"),
    lengthMm: mm("Length"),
    widthMm: mm("Width"),
    quantity: z.number().int().min(0).max(100_000).openapi({ description: "Sheets of this size on hand" }),
    location: text(100).optional().openapi({ description: "Where they are: a rack, a bay", example: "Rack B2" }),
    note: z.string().max(500).optional(),
    sourceProgram: z
      .string()
      .max(64)
      .optional()
      .openapi({ description: "For a remnant: the program it was cut from (its id)" }),
    sourceRun: z.string().max(200).optional().openapi({ description: "For a remnant: the run it was cut in" }),
  })
  .strict()
  .openapi("StockItemInput", {
    example: {
      kind: "sheet",
      grade: "A36",
      thicknessMm: 3,
      lengthMm: 2500,
      widthMm: 1250,
      quantity: 12,
      location: "Rack B2",
    },
  });

export const StockItemSchema = z
  .object({
    id: z.string().openapi({ example: "stk_01JEXAMPLE0000000000000000" }),
    kind: z.enum(STOCK_KINDS),
    grade: z.string(),
    thicknessMm: z.number(),
    lengthMm: z.number(),
    widthMm: z.number(),
    quantity: z.number().int().openapi({ description: "Sheets on hand, reserved ones included" }),
    reserved: z.number().int().openapi({ description: "Sheets held by open reservations" }),
    available: z.number().int().openapi({ description: "`quantity` − `reserved`: free to plan and reserve" }),
    location: z.string().nullable(),
    note: z.string().nullable(),
    sourceProgram: z.string().nullable(),
    sourceRun: z.string().nullable(),
    archivedAt: z.string().nullable(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .openapi("StockItem");

export const StockListQuerySchema = z.object({
  grade: z.string().max(50).optional().openapi({ description: "Only this grade code" }),
  thicknessMm: z.coerce.number().positive().max(1_000).optional().openapi({ description: "Only this thickness, mm" }),
  kind: z.enum(STOCK_KINDS).optional(),
  includeArchived: z.enum(["true", "false"]).optional().openapi({ description: "`true` includes archived items" }),
});

export const StockAdjustInputSchema = z
  .object({
    delta: z
      .number()
      .int()
      .min(-100_000)
      .max(100_000)
      .refine((d) => d !== 0, { message: "a change of 0 changes nothing" })
      .openapi({ description: "Sheets to add (positive) or take away (negative)" }),
    reason: text(500).openapi({ description: "Why: a count, damage, a delivery", example: "Counted on the rack" }),
  })
  .strict()
  .openapi("StockAdjustInput");

export const ReserveInputSchema = z
  .object({
    quantity: z.number().int().min(1).max(100_000),
    program: z.string().max(64).optional().openapi({
      description: "The program the sheets are for (its id); cancelling it gives them back",
    }),
    note: z.string().max(500).optional(),
  })
  .strict()
  .openapi("ReserveInput");

export const StockReservationSchema = z
  .object({
    id: z.string().openapi({ example: "srv_01JEXAMPLE0000000000000000" }),
    item: z.string().openapi({ description: "The stock item's id" }),
    quantity: z.number().int(),
    status: z.enum(RESERVATION_STATUSES),
    program: z.string().nullable(),
    note: z.string().nullable(),
    createdAt: z.string(),
    closedAt: z.string().nullable(),
  })
  .openapi("StockReservation");

export type StockItemInputT = z.infer<typeof StockItemInputSchema>;
export type StockItemT = z.infer<typeof StockItemSchema>;
export type StockAdjustInputT = z.infer<typeof StockAdjustInputSchema>;
export type ReserveInputT = z.infer<typeof ReserveInputSchema>;
export type StockReservationT = z.infer<typeof StockReservationSchema>;
