/**
 * Plans: order lines (blanks) and the stock on hand in; sheet patterns a shear can cut, the
 * demand they meet, and the cut programs they become, out. One schema validates requests,
 * types the service and documents the API.
 */
import { jobFields, ProgramSchema, ThicknessSchema } from "./program";
import { RoutingSchema } from "./settings";
import { PLAN_FAILURES, PlanResultSchema, PlanSummaryFiguresSchema } from "./plan-result";
import { PLAN_STATUSES } from "./enums";
import { PLAN_OBJECTIVES } from "./enums";
import { z } from "./zod";

const length = (description: string) =>
  z
    .number()
    .positive()
    .max(100_000)
    .openapi({ description: `${description}, in the plan's units` });

export { PLAN_OBJECTIVES };

export const StockInputSchema = z
  .object({
    length: length(
      "The sheet's length (its rolling direction; presented to the blade unless it is longer than the blade)",
    ),
    width: length("The sheet's width"),
    count: z
      .number()
      .int()
      .min(0)
      .max(100_000)
      .nullable()
      .optional()
      .openapi({ description: "Sheets on hand; omit or null for as many as needed" }),
    label: z.string().max(100).optional(),
    remnant: z.boolean().optional().openapi({
      description: "A remnant: rows marked so are planned first, and only what they cannot take goes onto the others",
    }),
    item: z.string().max(64).optional().openapi({
      description:
        "The stock item this row is drawn from (its id); writing the plan's programs reserves the sheets each pattern uses",
    }),
  })
  .strict()
  .openapi("PlanStock");

export const BlankInputSchema = z
  .object({
    label: z.string().trim().min(1).max(100).openapi({
      description: "Your name for the blank: an order line, a part number",
      example: "SO-2291/4 side panel",
    }),
    length: length("The blank's length (along the sheet's length unless turned)"),
    width: length("The blank's width"),
    quantity: z.number().int().min(1).max(100_000),
    canTurn: z.boolean().optional().openapi({
      description:
        "May the blank lie turned 90° on the sheet? Default true; send false when grain or finish direction must follow the sheet's length.",
    }),
  })
  .strict()
  .openapi("PlanBlank");

export const PlanOptionsInputSchema = z
  .object({
    objective: z.enum(PLAN_OBJECTIVES).optional().openapi({
      description:
        "`fewest_sheets` (default): the most blank area per sheet; `least_waste`: the highest share of each sheet used (reusable offcuts count as used when `offcutsAsStock`); `fewest_strokes`: the fewest strokes and turns per blank among patterns within 5 points of the fullest.",
    }),
    trim: z.number().min(0).max(1000).optional().openapi({
      description: "Trim cut off the sheet's first edge before ripping, in the plan's units (0 or omitted: none)",
    }),
    overProductionPct: z.number().min(0).max(100).optional().openapi({
      description:
        "Extra pieces allowed per blank, as a percentage of its quantity (rounded down). 0 (default): never more than asked.",
    }),
    reusableOffcut: z
      .object({
        length: length("Shortest long edge of a reusable offcut"),
        width: length("Shortest short edge of a reusable offcut"),
      })
      .strict()
      .optional()
      .openapi({ description: "Leftovers at least this size (either way round) are listed as reusable offcuts." }),
    offcutsAsStock: z.boolean().optional().openapi({
      description: "Count reusable offcuts as stock returned: not waste in the objective or the net utilisation.",
    }),
  })
  .strict()
  .openapi("PlanOptions");

const PlanShape = z
  .object({
    reference: z.string().trim().min(1).max(80).optional().openapi({
      description: "Your reference; the programs written from the plan are named `<reference>/A`, `/B`, …",
      example: "WK49-A36-10GA",
    }),
    title: z.string().max(200).optional(),
    ...jobFields(),
    units: z.enum(["in", "mm"]).openapi({ description: "Units of every length in this plan" }),
    // The planner's own limits (10 stock sizes, 200 blank types, …) are checked after the schema, so a refusal names the limit and the value.
    stock: z
      .union([
        z.literal("on_hand"),
        z
          .array(StockInputSchema)
          .min(1)
          .max(1_000)
          .openapi({ description: "Stock sizes on hand (a plan takes at most 10: limit `stockSizes`)" }),
      ])
      .openapi({
        description:
          "The sheets to plan on: explicit rows, or `\"on_hand\"` for the shop's stock of the plan's grade and thickness (remnants first; at most 10 items). The stored plan lists the rows drawn, each naming its stock item.",
      }),
    blanks: z.array(BlankInputSchema).min(1).max(10_000).openapi({
      description:
        "Order lines (a plan takes at most 200 blank types: limit `blankTypes`, and 20,000 pieces in all: limit `totalPieces`)",
    }),
    options: PlanOptionsInputSchema.optional(),
  })
  .strict();

/** An example order (invented): this week's 10 ga A36 side panels and gussets on 120 × 48 in and 96 × 48 in sheets. */
export const EXAMPLE_PLAN: z.infer<typeof PlanShape> = {
  reference: "WK49-A36-10GA",
  title: "Week 49, 10 ga A36",
  shear: "Bay 1 sheet shear",
  grade: "A36",
  thickness: { gauge: 10 },
  units: "in",
  stock: [
    { length: 120, width: 48, count: 10 },
    { length: 96, width: 48 },
  ],
  blanks: [
    { label: "side panel", length: 16, width: 12, quantity: 56 },
    { label: "gusset", length: 10, width: 8, quantity: 40, canTurn: false },
  ],
  options: { objective: "fewest_sheets", trim: 0.25, reusableOffcut: { length: 24, width: 12 } },
};

export const PlanInputSchema = PlanShape.openapi("PlanInput", { example: EXAMPLE_PLAN });

const PlanCommon = {
  id: z.string().openapi({ example: "pln_01JEXAMPLE0000000000000000" }),
  status: z.enum(PLAN_STATUSES).openapi({
    description:
      "`queued` → `running` → `complete` | `failed` | `cancelled`. A plan is computed by a worker, never by the server answering requests; read it again (or use `Prefer: wait`, or the `plan.completed` and `plan.failed` webhooks) to learn when it is done.",
  }),
  reference: z.string().nullable(),
  title: z.string().nullable(),
  shear: z.string(),
  routing: RoutingSchema.nullable(),
  grade: z.string(),
  thickness: ThicknessSchema,
  units: z.enum(["in", "mm"]),
  progress: z
    .object({
      patterns: z.number().int().openapi({ description: "Sheet patterns found so far" }),
      piecesPlaced: z
        .number()
        .int()
        .openapi({ description: "Pieces those patterns place (within the quantities asked)" }),
      piecesWanted: z.number().int().openapi({ description: "Pieces the stock can take at all" }),
    })
    .nullable()
    .openapi({ description: "How far the planner has come; null until it starts" }),
  failure: z
    .object({ reason: z.enum(PLAN_FAILURES), message: z.string() })
    .nullable()
    .openapi({ description: "Why a `failed` plan failed" }),
  attempts: z.number().int().openapi({
    description:
      "Times a worker started on the plan (more than one when a worker was lost mid-plan and another took it over)",
  }),
  programs: z
    .array(z.object({ pattern: z.string(), id: z.string() }))
    .openapi({ description: "The programs written from this plan; empty until `POST /plans/{id}/programs`" }),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
};

export const PlanSchema = z
  .object({
    ...PlanCommon,
    result: PlanResultSchema.nullable().openapi({ description: "The plan itself, once `complete`; null before" }),
  })
  .openapi("Plan");

export const PlanSummarySchema = z
  .object({
    ...PlanCommon,
    coverage: z
      .enum(["complete", "partial"])
      .nullable()
      .openapi({ description: "Once complete: were all blanks placed?" }),
    summary: PlanSummaryFiguresSchema.nullable().openapi({
      description: "Once complete: the plan's figures (read the plan for its patterns)",
    }),
  })
  .openapi("PlanSummary");

export const PlanPreviewSchema = PlanResultSchema.extend({
  reference: z.string().nullable(),
  title: z.string().nullable(),
  shear: z.string(),
  routing: RoutingSchema.nullable(),
  grade: z.string(),
  thickness: ThicknessSchema,
  units: z.enum(["in", "mm"]),
}).openapi("PlanPreview", { description: "A plan computed and answered, not stored" });

export const WriteProgramsInputSchema = z
  .object({
    referencePrefix: z
      .string()
      .trim()
      .min(1)
      .max(90)
      .optional()
      .openapi({ description: "Programs are named `<prefix>/A`, `/B`, …; default the plan's reference, or its id" }),
    priority: z.number().int().min(0).max(9).optional(),
    dueAt: z.iso.datetime({ offset: true }).optional(),
    metadata: z
      .record(z.string().min(1).max(64), z.string().max(500))
      .refine((m) => Object.keys(m).length <= 40, { message: "at most 40 metadata keys" })
      .optional(),
  })
  .strict()
  .openapi("WriteProgramsInput");

export const WrittenProgramsSchema = z
  .object({ plan: z.string(), data: z.array(ProgramSchema) })
  .openapi("WrittenPrograms");

export type PlanInputT = z.infer<typeof PlanInputSchema>;
/** A plan's order once its stock is drawn: explicit rows (what is stored and planned). */
export type PlanOrderT = Omit<PlanInputT, "stock"> & { stock: z.infer<typeof StockInputSchema>[] };
export type PlanT = z.infer<typeof PlanSchema>;
export type PlanSummaryT = z.infer<typeof PlanSummarySchema>;
export type PlanPreviewT = z.infer<typeof PlanPreviewSchema>;
export type WriteProgramsInputT = z.infer<typeof WriteProgramsInputSchema>;
