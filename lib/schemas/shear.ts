/** The shear resource: a machine's capacity profile. Millimetres, MPa, degrees, seconds. */
import { z } from "./zod";

const mm = (description: string) =>
  z
    .number()
    .positive()
    .max(100_000)
    .openapi({ description: `${description} (mm)` });
const deg = (description: string) =>
  z
    .number()
    .min(0)
    .max(45)
    .openapi({ description: `${description} (degrees)` });

const ShearFields = z.object({
  name: z.string().trim().min(1).max(100).openapi({ example: "Bay 1 sheet shear" }),
  description: z.string().max(1000).nullable().optional(),
  ratedThicknessMm: mm("Thickness of the rating material the shear cuts at the rated rake"),
  ratedTensileMpa: z.number().positive().max(3000).openapi({
    description: "Tensile strength of the rating material (MPa); mild steel is usually rated at about 414 MPa (60 ksi)",
  }),
  ratedRakeDeg: deg("Rake at which the rating applies"),
  bladeLengthMm: mm("Blade length"),
  backgaugeMinMm: z.number().min(0).max(100_000).openapi({ description: "Shortest backgauge setting (mm)" }),
  backgaugeMaxMm: mm("Longest backgauge setting"),
  rakeMinDeg: deg("Lowest rake"),
  rakeMaxDeg: deg("Highest rake"),
  gapMinMm: z.number().min(0).max(50).openapi({ description: "Smallest blade gap (mm)" }),
  gapMaxMm: z.number().positive().max(50).openapi({ description: "Largest blade gap (mm)" }),
  strokesPerMin: z.number().positive().max(200).openapi({ description: "Strokes per minute at full stroke" }),
  backgaugeSpeedMmPerS: z.number().positive().max(10_000).openapi({ description: "Backgauge travel speed (mm/s)" }),
  backgaugeRepeatabilityMm: z.number().positive().max(5).nullable().optional().openapi({
    description:
      "The backgauge's stated repeatability, ± (mm): settings closer than this cannot be told apart, and a remnant within it of the backgauge is a piece; null = not stated (0.1 mm is used for the piece flow)",
  }),
  handlingSecondsPerTurn: z.number().min(0).max(3600).openapi({ description: "Handling time to turn one piece (s)" }),
  handlingSecondsPerSheet: z.number().min(0).max(3600).openapi({ description: "Handling time to load one sheet (s)" }),
  maxBladeHardnessHb: z
    .number()
    .positive()
    .max(800)
    .nullable()
    .optional()
    .openapi({ description: "Hardest material the fitted blades are meant for (Brinell); null = not checked" }),
  gradeThicknessLimitsMm: z
    .record(z.string().min(1).max(50), z.number().positive().max(1000))
    .optional()
    .openapi({
      description: "Explicit maximum thickness per grade code (mm); wins over the derived value",
      example: { "304": 4 },
    }),
  crownAtRatedMm: z.number().min(0).max(5).nullable().optional().openapi({
    description:
      "Force-proportional part of the crown (centre gap tighter than the ends) at full rated force (mm); null = the default",
  }),
  crownBaselineMm: z.number().min(0).max(1).nullable().optional().openapi({
    description:
      "Gap at the blade ends less the gap at the centre with no load, for blade and seat straightness and the beam's geometry (mm); null = the default, 0.0508 mm (0.002 in)",
  }),
});

function ranges<T extends z.ZodType<Partial<z.infer<typeof ShearFields>>>>(schema: T) {
  return schema.superRefine((shear, ctx) => {
    const pairs: [keyof typeof shear, keyof typeof shear][] = [
      ["backgaugeMinMm", "backgaugeMaxMm"],
      ["rakeMinDeg", "rakeMaxDeg"],
      ["gapMinMm", "gapMaxMm"],
    ];
    for (const [lo, hi] of pairs) {
      if (
        typeof shear[lo] === "number" &&
        typeof shear[hi] === "number" &&
        (shear[lo] as number) > (shear[hi] as number)
      ) {
        ctx.addIssue({ code: "custom", path: [lo as string], message: `must not exceed ${String(hi)}` });
      }
    }
  });
}

export const ShearInputSchema = ranges(ShearFields.strict()).openapi("ShearInput");
export const ShearPatchSchema = ranges(ShearFields.partial().strict()).openapi("ShearPatch");

export const ShearSchema = ShearFields.extend({
  id: z.string().openapi({ example: "shr_01JEXAMPLE0000000000000000" }),
  description: z.string().nullable(),
  maxBladeHardnessHb: z.number().nullable(),
  gradeThicknessLimitsMm: z.record(z.string(), z.number()),
  crownAtRatedMm: z.number().nullable(),
  crownBaselineMm: z.number().nullable(),
  backgaugeRepeatabilityMm: z.number().nullable(),
  archivedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
}).openapi("Shear");

export type ShearInputT = z.infer<typeof ShearInputSchema>;
export type ShearPatchT = z.infer<typeof ShearPatchSchema>;
export type ShearT = z.infer<typeof ShearSchema>;

/**
 * The demo shop's two machines (invented figures, a scenario of our own): the seed creates
 * them, and the API reference's examples show the first, so "try it" works against the demo.
 */
export const DEMO_SHEARS = [
  {
    name: "Bay 1 sheet shear",
    description: "3 m light shear for sheet up to 6.35 mm mild steel. Demo machine.",
    ratedThicknessMm: 6.35,
    ratedTensileMpa: 414,
    ratedRakeDeg: 1.5,
    bladeLengthMm: 3100,
    backgaugeMinMm: 5,
    backgaugeMaxMm: 1000,
    rakeMinDeg: 0.5,
    rakeMaxDeg: 2.5,
    gapMinMm: 0.03,
    gapMaxMm: 1.0,
    strokesPerMin: 30,
    backgaugeSpeedMmPerS: 250,
    handlingSecondsPerTurn: 6,
    handlingSecondsPerSheet: 30,
    maxBladeHardnessHb: 300,
    gradeThicknessLimitsMm: { "304": 4.0, "316": 4.0 },
    crownBaselineMm: 0.05,
    backgaugeRepeatabilityMm: 0.05,
  },
  {
    name: "Bay 3 plate shear",
    description: "3 m plate shear for plate up to 12.7 mm mild steel. Demo machine.",
    ratedThicknessMm: 12.7,
    ratedTensileMpa: 414,
    ratedRakeDeg: 2.0,
    bladeLengthMm: 3100,
    backgaugeMinMm: 10,
    backgaugeMaxMm: 1000,
    rakeMinDeg: 1.0,
    rakeMaxDeg: 3.0,
    gapMinMm: 0.1,
    gapMaxMm: 2.0,
    strokesPerMin: 12,
    backgaugeSpeedMmPerS: 150,
    handlingSecondsPerTurn: 15,
    handlingSecondsPerSheet: 60,
    maxBladeHardnessHb: 450,
    gradeThicknessLimitsMm: {},
    crownBaselineMm: 0.08,
    backgaugeRepeatabilityMm: 0.1,
  },
] satisfies z.infer<typeof ShearInputSchema>[];
