/**
 * The cut program: what an ERP sends (ProgramInput), and what Shearwire answers (Program),
 * with the shear core's check. This one schema validates requests, types the services,
 * and is the JSON Schema served at /api/v1/schemas/cut-program.json.
 */
import { CheckSchema, SheetLayoutSchema } from "./check";
import { ProblemSchema } from "./common";
import { RoutingSchema } from "./settings";
import { PROGRAM_STATUSES } from "./enums";
import { z } from "./zod";

const length = (description: string) =>
  z
    .number()
    .positive()
    .max(100_000)
    .openapi({ description: `${description}, in the program's units` });

export const CutGroupInputSchema = z
  .object({
    backgauge: length("Backgauge distance: the width of each piece this group cuts off"),
    count: z
      .number()
      .int()
      .min(0)
      .max(1000)
      .openapi({ description: "Strokes at this setting, per workpiece the group runs on" }),
    length: length("Length of cut; defaults to the presented edge, shorter for a partial stroke").optional(),
    turn: z.boolean().optional().openapi({
      description:
        "Take every piece the previous group made (or group `from` made), turned 90°, and run this group on each",
    }),
    from: z.number().int().min(0).max(499).optional().openapi({
      description:
        "With `turn`: the 0-based index of the earlier group whose pieces this group takes (default: the group just before). Lets one program rip strips of several widths and then crosscut each kind.",
    }),
    scrap: z.boolean().optional().openapi({ description: "The pieces of this group are offcut (a trim cut)" }),
    note: z.string().max(200).optional(),
  })
  .strict()
  .openapi("CutGroup");

export const SetupOverridesInputSchema = z
  .object({
    rakeDeg: z.number().min(0).max(45).optional().openapi({ description: "Rake angle (degrees)" }),
    bladeGapMm: z.number().min(0).max(50).optional(),
    bladeGapIn: z.number().min(0).max(2).optional(),
    holdDownPct: z
      .number()
      .min(0)
      .max(100)
      .optional()
      .openapi({ description: "Hold-down as a percentage of the machine's full hold-down force" }),
    crownMm: z.number().min(0).max(5).optional(),
    crownIn: z.number().min(0).max(0.2).optional(),
    backgaugeRetractMm: z.number().min(0).max(100).optional(),
    backgaugeRetractIn: z.number().min(0).max(4).optional(),
  })
  .strict()
  .openapi("SetupOverrides", {
    description: "Setup values the program fixes itself; each overrides the computed one and is still checked.",
  });

export const ThicknessSchema = z
  .union([
    z.object({ value: length("Thickness") }).strict(),
    z
      .object({
        gauge: z.number().int().min(0).max(50).openapi({ description: "Gauge number in the grade's gauge system" }),
      })
      .strict(),
  ])
  .openapi("Thickness", {
    description: '`{ "value": n }` in the program\'s units, or `{ "gauge": n }` in the grade\'s gauge system.',
  });

/** What a program or a plan is cut on and from: the shear, the grade and its thickness. */
export const jobFields = () => ({
  shear: z.string().trim().min(1).max(100).optional().openapi({
    description:
      "The shear: its id, or its name as the catalog has it (any case). Stored as the id. Leave it out to have the shop's active shears checked and one chosen by the shop's `routingRule` (the answer's `routing` says which and why).",
    example: "Bay 1 sheet shear",
  }),
  grade: z.string().trim().min(1).max(50).openapi({ description: "The grade's code in your catalog", example: "A36" }),
  thickness: ThicknessSchema,
});

const programFields = {
  reference: z
    .string()
    .trim()
    .min(1)
    .max(100)
    .openapi({ description: "Your order reference; unique per shop", example: "SO-2291/4" }),
  title: z.string().max(200).optional(),
  ...jobFields(),
  units: z.enum(["in", "mm"]).openapi({ description: "Units of every length in this program" }),
  sheet: z
    .object({
      length: length("The edge presented to the blade"),
      width: length("The dimension running toward the backgauge"),
      count: z.number().int().min(1).max(10_000).openapi({ description: "Sheets; each runs the same program" }),
    })
    .strict()
    .openapi("StockSheet"),
  cuts: z.array(CutGroupInputSchema).min(1).max(500),
  setup: SetupOverridesInputSchema.optional(),
  priority: z.number().int().min(0).max(9).optional().openapi({ description: "0 (lowest) to 9 (highest); default 5" }),
  dueAt: z.iso.datetime({ offset: true }).optional().openapi({ example: "2026-12-08T14:00:00Z" }),
  metadata: z
    .record(z.string().min(1).max(64), z.string().max(500))
    .refine((m) => Object.keys(m).length <= 50, { message: "at most 50 metadata keys" })
    .optional()
    .openapi({ description: "Your own key-value pairs, returned as given", example: { erpLine: "4" } }),
};

/** The worked example of the cut-program documentation: two 120 × 48 in sheets of 10 ga A36, ripped and crosscut to 16 × 12 in blanks. */
const ProgramShape = z.object(programFields).strict();

export const EXAMPLE_PROGRAM: z.infer<typeof ProgramShape> = {
  reference: "SO-2291/4",
  title: "Side panels, lot 4",
  shear: "Bay 1 sheet shear",
  grade: "A36",
  thickness: { gauge: 10 },
  units: "in",
  sheet: { length: 120, width: 48, count: 2 },
  cuts: [
    { backgauge: 12, count: 3, note: "rip strips" },
    { turn: true, backgauge: 16, length: 12, count: 7 },
  ],
  setup: { rakeDeg: 1.5 },
  priority: 5,
  dueAt: "2026-12-08T14:00:00Z",
  metadata: { erpLine: "4" },
};

export const ProgramInputSchema = ProgramShape.openapi("ProgramInput", { example: EXAMPLE_PROGRAM });
export const ProgramPatchSchema = z
  .object(programFields)
  .partial()
  .strict()
  .refine((p) => Object.keys(p).length > 0, { message: "send at least one field to change" })
  .openapi("ProgramPatch", {
    description: "Fields to replace; `cuts`, `sheet`, `setup` and `metadata` are replaced whole.",
  });

// ---------------------------------------------------------------- the check (the shear core's answer)

export const ProgramSchema = z
  .object({
    id: z.string().openapi({ example: "prg_01JEXAMPLE0000000000000000" }),
    status: z.enum(PROGRAM_STATUSES),
    revision: z.number().int().openapi({ description: "Bumped by every change; the ETag is its quoted form" }),
    ...programFields,
    shear: z.string().openapi({ description: "The shear's id" }),
    routing: RoutingSchema.nullable(),
    title: z.string().nullable(),
    priority: z.number().int(),
    dueAt: z.string().nullable(),
    metadata: z.record(z.string(), z.string()),
    validation: z.enum(["pass", "warn", "fail"]),
    check: CheckSchema,
    acknowledged: z.array(z.string()).openapi({ description: "Warning codes acknowledged at release" }),
    releasedAt: z.string().nullable(),
    cancelledAt: z.string().nullable(),
    run: z
      .object({
        claimedBy: z.string().nullable().openapi({ description: "The gateway key holding the lease" }),
        claimedAt: z.string().nullable(),
        leaseExpiresAt: z.string().nullable(),
        leaseExpiries: z
          .number()
          .int()
          .openapi({ description: "How often a gateway went quiet and the program went back to `released`" }),
        startedAt: z.string().nullable(),
        finishedAt: z.string().nullable(),
        progress: z
          .object({
            groupsDone: z.number().int(),
            strokesDone: z.number().int(),
            piecesDone: z.number().int().optional(),
          })
          .nullable(),
        outcome: z
          .record(z.string(), z.unknown())
          .nullable()
          .openapi({ description: "The completion or failure report" }),
      })
      .openapi("ProgramRun", { description: "What happened at the machine." }),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .openapi("Program");

/** At most this many programs in one batch. */
export const BATCH_LIMIT = 100;

export const ProgramBatchInputSchema = z
  .object({
    programs: z
      .array(z.unknown())
      .min(1)
      .max(BATCH_LIMIT)
      .openapi({
        items: { $ref: "#/components/schemas/ProgramInput" },
        description: `1 to ${BATCH_LIMIT} programs, each as \`POST /programs\` takes it; each is checked on its own, so one program's problems point into \`/programs/{index}\`.`,
      }),
    atomic: z.boolean().default(true).openapi({
      description:
        "`true` (the default): all or nothing, one problem naming every program that cannot be created. `false`: every program that can be created is, and the answer (207) lists each program's result or problem in order.",
    }),
  })
  .strict()
  .openapi("ProgramBatchInput");

export const ProgramBatchSchema = z
  .object({ data: z.array(ProgramSchema).openapi({ description: "The created programs, in the order sent" }) })
  .openapi("ProgramBatch");

export const ProgramBatchResultSchema = z
  .union([
    z.object({ index: z.number().int(), status: z.literal(201), program: ProgramSchema }),
    z.object({
      index: z.number().int(),
      status: z.number().int().openapi({ description: "What creating this program alone would have answered" }),
      problem: ProblemSchema,
    }),
  ])
  .openapi("ProgramBatchResult", { description: "One program's result: the program, or its problem." });

export const ProgramBatchResultsSchema = z
  .object({
    data: z.array(ProgramBatchResultSchema).openapi({ description: "One result per program, in the order sent" }),
  })
  .openapi("ProgramBatchResults");

export const ReleaseInputSchema = z
  .object({
    acknowledge: z
      .array(z.string().max(64))
      .max(50)
      .optional()
      .openapi({ description: "Warning codes you have read and accept", example: ["strip_narrow"] }),
  })
  .strict()
  .openapi("ReleaseInput");

export const CancelInputSchema = z
  .object({ reason: z.string().max(500).optional() })
  .strict()
  .openapi("CancelInput");

export const ProgramListQuerySchema = z.object({
  status: z.enum(PROGRAM_STATUSES).optional(),
  shear: z.string().max(64).optional().openapi({ description: "Only programs for this shear id" }),
  reference: z.string().max(100).optional().openapi({ description: "Only the program with this reference" }),
  search: z
    .string()
    .min(1)
    .max(100)
    .optional()
    .openapi({ description: "Only programs whose reference or title contains this, in any case" }),
  updatedSince: z.iso
    .datetime({ offset: true })
    .optional()
    .openapi({ description: "Only programs changed at or after this time" }),
  updated_since: z.iso
    .datetime({ offset: true })
    .optional()
    .openapi({ description: "The earlier spelling of `updatedSince`, still accepted", deprecated: true }),
});

export const ProgramValidationSchema = CheckSchema.extend({
  routing: RoutingSchema.nullable().openapi({
    description: "When the program names no shear: which of the shop's active shears can cut it, and the one chosen",
  }),
}).openapi("ProgramValidation", {
  description:
    "The check of the program on its shear (or, when it names none, on the shear chosen; when none can cut it, on the first by name).",
});

export const ProgramLayoutSchema = z
  .object({
    id: z.string().openapi({ description: "The program's id", example: "prg_01JEXAMPLE0000000000000000" }),
    revision: z.number().int().openapi({ description: "The revision the layout is of (the program's ETag)" }),
    layout: SheetLayoutSchema.nullable(),
  })
  .openapi("ProgramLayout", {
    description:
      "One sheet of the program as it is cut, placed from the same piece flow as its check's yield, with the remnant tolerance the check counted with (`check.yield.remnantToleranceMm`): for drawing it. Not part of the check, so creates, lists and webhooks stay small. `layout` is null when the sheet has too many pieces and strokes to place (more than 20 000), or when the program's sheet or cuts cannot be read.",
  });

export type ProgramInputT = z.infer<typeof ProgramInputSchema>;
export type ProgramLayoutT = z.infer<typeof ProgramLayoutSchema>;
export type ProgramPatchT = z.infer<typeof ProgramPatchSchema>;
export type ProgramT = z.infer<typeof ProgramSchema>;
export type ProgramBatchResultT = z.infer<typeof ProgramBatchResultSchema>;
export type ProgramValidationT = z.infer<typeof ProgramValidationSchema>;
