/**
 * Plans: order lines (blanks) and the stock on hand in; sheet patterns a shear can cut, the
 * demand they meet, and the cut programs they become, out. One schema validates requests,
 * types the service and documents the API.
 */
import { Check, CutGroupInput, Finding, jobFields, Program, Thickness } from "./program";
import { PLAN_OBJECTIVES } from "./enums";
import { z } from "./zod";

const length = (d: string) =>
  z
    .number()
    .positive()
    .max(100_000)
    .openapi({ description: `${d}, in the plan's units` });

export { PLAN_OBJECTIVES };

export const StockInput = z
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
  })
  .strict()
  .openapi("PlanStock");

export const BlankInput = z
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

export const PlanOptionsInput = z
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
      .array(StockInput)
      .min(1)
      .max(1_000)
      .openapi({ description: "Stock sizes on hand (a plan takes at most 10: limit `stockSizes`)" }),
    blanks: z.array(BlankInput).min(1).max(10_000).openapi({
      description:
        "Order lines (a plan takes at most 200 blank types: limit `blankTypes`, and 20,000 pieces in all: limit `totalPieces`)",
    }),
    options: PlanOptionsInput.optional(),
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

export const PlanInput = PlanShape.openapi("PlanInput", { example: EXAMPLE_PLAN });

const Piece = z
  .object({
    blank: z.number().int().openapi({ description: "Index into `blanks`" }),
    label: z.string(),
    x: z
      .number()
      .openapi({ description: "Distance along the blade from the sheet's corner, of the first piece of the run" }),
    y: z
      .number()
      .openapi({ description: "Distance from the first edge (toward the backgauge), in the strip's first copy" }),
    length: z.number().openapi({ description: "Along the blade" }),
    width: z.number().openapi({ description: "Toward the backgauge" }),
    turned: z.boolean().openapi({ description: "Lies turned 90° to the stock sheet's length" }),
    count: z
      .number()
      .int()
      .min(1)
      .openapi({ description: "Pieces in this run, side by side along the blade (each `length` further on)" }),
  })
  .openapi("PlanPieceRun");

export const PlanPattern = z
  .object({
    key: z.string().openapi({ description: "A, B, C …; the program written for it ends in this", example: "A" }),
    stock: z.number().int().openapi({ description: "Index into `stock`" }),
    sheet: z
      .object({ length: z.number(), width: z.number() })
      .openapi({ description: "The sheet as presented: length along the blade" }),
    rotated: z.boolean().openapi({ description: "The stock sheet's width is presented to the blade" }),
    repeats: z.number().int().openapi({
      description:
        "Sheets cut to this pattern (the program's `sheet.count`); a pattern is stored once, however many sheets repeat it",
    }),
    utilisationPct: z.number(),
    strips: z
      .array(
        z.object({
          y: z.number(),
          height: z.number(),
          repeat: z.number().int().min(1).openapi({
            description:
              "Identical strips one after another (each `height` further on); a plan's size follows its patterns, not its pieces",
          }),
          pieces: z.array(Piece),
        }),
      )
      .openapi({
        description:
          "Strips ripped across the sheet, as runs: identical strips once with `repeat`, identical pieces once with `count`",
      }),
    offcuts: z.array(
      z.object({
        x: z.number(),
        y: z.number(),
        length: z.number(),
        width: z.number(),
        kind: z.enum(["trim", "sheet-end", "strip-end", "piece-trim"]),
        reusable: z.boolean(),
      }),
    ),
    strokes: z.number().int().openapi({ description: "Per sheet" }),
    turns: z.number().int().openapi({ description: "Pieces turned, per sheet" }),
    cuts: z.array(CutGroupInput).openapi({ description: "The cut groups of the program this pattern becomes" }),
    check: z
      .object({ validation: Check.shape.validation, findings: z.array(Finding), estimate: Check.shape.estimate })
      .openapi({
        description: "The shear core's check of that program: findings and the cycle estimate for all its sheets",
      }),
  })
  .openapi("PlanPattern");

export const PlanFinding = z
  .object({
    code: z.enum([
      "blank_unplaceable",
      "stock_short",
      "over_production",
      "stock_unusable",
      "trim_out_of_travel",
      "pattern_not_releasable",
    ]),
    severity: z.enum(["error", "warning"]),
    message: z.string(),
    pointer: z.string().openapi({ description: "JSON pointer into the plan request", example: "/blanks/2" }),
    actual: z.number().nullable(),
  })
  .openapi("PlanFinding");

export const PLAN_STATUSES = ["queued", "running", "complete", "failed", "cancelled"] as const;
export const PLAN_FAILURES = ["time_limit", "worker_lost", "out_of_memory", "error"] as const;

const PlanSummaryFigures = z
  .object({
    sheets: z.number().int(),
    patterns: z.number().int(),
    blanksAsked: z.number().int(),
    blanksPlanned: z.number().int(),
    extra: z.number().int(),
    short: z.number().int(),
    utilisationPct: z.number().openapi({ description: "Blank area over the area of the sheets used" }),
    netUtilisationPct: z
      .number()
      .openapi({ description: "Blank area over the sheets' area less the reusable offcuts" }),
    strokes: z.number().int(),
    turns: z.number().int(),
    estimateSeconds: z.number().openapi({ description: "The shear core's cycle estimate for every sheet of the plan" }),
    lowerBoundSheets: z.number().int().openapi({
      description:
        "No plan of two-stage patterns (rip, then crosscut, then trim: the cuts this planner writes) can cut the blanks this plan places from fewer sheets; for a `complete` plan, everything asked for. The larger of `bounds.areaSheets` and `bounds.lpSheets`.",
      example: 2,
    }),
    provenFewest: z.boolean().openapi({
      description: "`sheets` equals `lowerBoundSheets`: provably no plan of two-stage patterns uses fewer sheets",
    }),
    bounds: z
      .object({
        areaSheets: z.number().int().openapi({
          description:
            "The blank area placed over the largest usable sheet on hand (after the trim), rounded up: a bound for any way of cutting",
        }),
        lpSheets: z.number().int().nullable().openapi({
          description:
            "The linear-programming bound over every two-stage pattern the shear can cut (all sheets planned together), rounded up; null when it was not computed (the area bound already proves the plan, the work budget was not given, or the plan is `partial`)",
        }),
      })
      .openapi({ description: "The lower bounds behind `lowerBoundSheets`" }),
    method: z.enum(["column_generation", "greedy"]).openapi({
      description:
        "`column_generation`: all sheets planned together (a linear program over two-stage patterns, then whole sheets); `greedy`: pattern by pattern, the fullest sheet first (chosen when it was as good, or the work budget ran out)",
    }),
    methodNote: z.string().nullable().openapi({
      description: "Why the work budget made the plan, or its last sheets, pattern by pattern; null when it did not",
    }),
  })
  .openapi("PlanFigures");

export const PlanResult = z
  .object({
    coverage: z
      .enum(["complete", "partial"])
      .openapi({ description: "`partial`: some blanks could not be placed; see `findings`" }),
    stock: z.array(
      z
        .object({
          length: z.number(),
          width: z.number(),
          count: z.number().int().nullable(),
          label: z.string().optional(),
          used: z.number().int().openapi({ description: "Sheets of this size the plan uses" }),
        })
        .openapi("PlanStockUse"),
    ),
    blanks: z.array(
      z
        .object({
          label: z.string(),
          length: z.number(),
          width: z.number(),
          quantity: z.number().int(),
          canTurn: z.boolean(),
          planned: z.number().int().openapi({ description: "Pieces the patterns make" }),
          extra: z.number().int().openapi({ description: "Pieces beyond the quantity (within the allowance)" }),
          short: z.number().int().openapi({ description: "Pieces not planned; see `findings`" }),
        })
        .openapi("PlanDemand"),
    ),
    options: z.object({
      objective: z.enum(PLAN_OBJECTIVES),
      trim: z.number(),
      overProductionPct: z.number(),
      reusableOffcut: z.object({ length: z.number(), width: z.number() }).nullable(),
      offcutsAsStock: z.boolean(),
    }),
    summary: PlanSummaryFigures,
    patterns: z.array(PlanPattern),
    reusableOffcuts: z.array(z.object({ length: z.number(), width: z.number(), count: z.number().int() })),
    findings: z.array(PlanFinding),
  })
  .openapi("PlanResult", { description: "What the planner made of the order, in its units" });

const PlanCommon = {
  id: z.string().openapi({ example: "pln_01JEXAMPLE0000000000000000" }),
  status: z.enum(PLAN_STATUSES).openapi({
    description:
      "`queued` → `running` → `complete` | `failed` | `cancelled`. A plan is computed by a worker, never by the server answering requests; read it again (or use `Prefer: wait`, or the `plan.completed` and `plan.failed` webhooks) to learn when it is done.",
  }),
  reference: z.string().nullable(),
  title: z.string().nullable(),
  shear: z.string(),
  grade: z.string(),
  thickness: Thickness,
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

export const Plan = z
  .object({
    ...PlanCommon,
    result: PlanResult.nullable().openapi({ description: "The plan itself, once `complete`; null before" }),
  })
  .openapi("Plan");

export const PlanSummary = z
  .object({
    ...PlanCommon,
    coverage: z
      .enum(["complete", "partial"])
      .nullable()
      .openapi({ description: "Once complete: were all blanks placed?" }),
    summary: PlanSummaryFigures.nullable().openapi({
      description: "Once complete: the plan's figures (read the plan for its patterns)",
    }),
  })
  .openapi("PlanSummary");

export const PlanPreview = PlanResult.extend({
  reference: z.string().nullable(),
  title: z.string().nullable(),
  shear: z.string(),
  grade: z.string(),
  thickness: Thickness,
  units: z.enum(["in", "mm"]),
}).openapi("PlanPreview", { description: "A plan computed and answered, not stored" });

export const WriteProgramsInput = z
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

export const WrittenPrograms = z.object({ plan: z.string(), data: z.array(Program) }).openapi("WrittenPrograms");

export type PlanInputT = z.infer<typeof PlanInput>;
export type PlanT = z.infer<typeof Plan>;
export type PlanSummaryT = z.infer<typeof PlanSummary>;
export type PlanResultT = z.infer<typeof PlanResult>;
export type PlanPreviewT = z.infer<typeof PlanPreview>;
export type WriteProgramsInputT = z.infer<typeof WriteProgramsInput>;
