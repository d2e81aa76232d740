/**
 * A plan's answer as the API shows it: its sheet patterns (strips and pieces, stored once per
 * repeated pattern), its findings, and its summary with the bound it proves.
 */
import { CheckSchema, FindingSchema } from "./check";
import { PLAN_OBJECTIVES } from "./enums";
import { CutGroupInputSchema } from "./program";
import { z } from "./zod";
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

export const PlanPatternSchema = z
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
          width: z.number().openapi({ description: "The strip's width, toward the backgauge" }),
          repeat: z.number().int().min(1).openapi({
            description:
              "Identical strips one after another (each `width` further on); a plan's size follows its patterns, not its pieces",
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
    cuts: z.array(CutGroupInputSchema).openapi({ description: "The cut groups of the program this pattern becomes" }),
    check: z
      .object({
        validation: CheckSchema.shape.validation,
        findings: z.array(FindingSchema),
        estimate: CheckSchema.shape.estimate,
      })
      .openapi({
        description: "The shear core's check of that program: findings and the cycle estimate for all its sheets",
      }),
  })
  .openapi("PlanPattern");

export const PlanFindingSchema = z
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

export const PLAN_FAILURES = ["time_limit", "worker_lost", "out_of_memory", "error"] as const;

export const PlanSummaryFiguresSchema = z
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
        "No plan of two-stage patterns (rip, then crosscut, then trim: the cuts this planner writes) can cut the blanks this plan places from fewer sheets; for a `complete` plan, everything asked for. The largest of `bounds.areaSheets`, `bounds.apartSheets` and `bounds.lpSheets`.",
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
        apartSheets: z.number().int().nullable().openapi({
          description:
            "Pieces that cannot share a sheet: two pieces fit on one sheet only side by side (along or across it), so pieces no two of which fit side by side on any sheet on hand, either way round they may lie, each need a sheet of their own; with them, at least the area's worth of sheets for the pieces that can share a sheet with none of them. A bound for any way of cutting, and often the strongest for large blanks. Null when not computed (plans that cut remnants first, and plans stored before it was reported)",
          example: 1,
        }),
        lpSheets: z.number().int().nullable().openapi({
          description:
            "A bound from the linear program over every two-stage pattern the shear can cut (all sheets planned together), rounded up: the best the planner proved within its work budget. It reaches the linear program's optimum only when pricing can show that no pattern is left to improve it, so it can be weaker than `areaSheets` (with many small blanks, most of all); `lowerBoundSheets` takes the larger. Null when it was not computed (the area bound already proves the plan, the work budget was not given, or the plan is `partial`)",
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

export const PlanResultSchema = z
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
          remnant: z.boolean().optional(),
          item: z.string().optional().openapi({ description: "The stock item the row was drawn from" }),
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
    summary: PlanSummaryFiguresSchema,
    patterns: z.array(PlanPatternSchema),
    reusableOffcuts: z.array(z.object({ length: z.number(), width: z.number(), count: z.number().int() })),
    findings: z.array(PlanFindingSchema),
  })
  .openapi("PlanResult", { description: "What the planner made of the order, in its units" });

export type PlanResultT = z.infer<typeof PlanResultSchema>;
