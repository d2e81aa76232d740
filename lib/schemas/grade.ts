/** The grade resource: a material in the shop's catalog, strengths in MPa. */
import { GAUGE_FAMILIES, GRADE_FAMILIES } from "./enums";
import { z } from "./zod";

const mpa = (description: string) =>
  z
    .number()
    .positive()
    .max(3000)
    .nullable()
    .openapi({ description: `${description} (MPa)` });

const GradeFields = z.object({
  code: z
    .string()
    .trim()
    .min(1)
    .max(50)
    .regex(/^[\w.\-/ ]+$/)
    .openapi({ description: "The code programs use", example: "A36" }),
  name: z.string().trim().min(1).max(200),
  family: z.enum(GRADE_FAMILIES),
  standard: z
    .string()
    .trim()
    .min(1)
    .max(200)
    .openapi({ description: "The standard the values come from, or why there is none", example: "ASTM A36/A36M" }),
  yieldMpa: mpa("Yield strength"),
  tensileMinMpa: mpa("Minimum tensile strength from the standard"),
  tensileTypicalMpa: mpa("Typical tensile strength, used when no minimum is given").optional(),
  tensileMaxMpa: mpa("Upper end of the tensile range").optional(),
  valuesAreTypical: z
    .boolean()
    .optional()
    .openapi({ description: "True when the strengths are typical values, not a standard's minimums" }),
  shearTensileRatio: z
    .number()
    .gt(0)
    .lte(1)
    .optional()
    .openapi({ description: "Shear strength over tensile strength; default by family" }),
  gaugeFamily: z.enum(GAUGE_FAMILIES).nullable().optional(),
  hardnessHb: z
    .number()
    .positive()
    .max(800)
    .nullable()
    .optional()
    .openapi({ description: "Highest hardness to expect (Brinell)" }),
  note: z.string().max(1000).nullable().optional(),
});

const needsTensile = <T extends z.ZodType<Partial<z.infer<typeof GradeFields>>>>(schema: T) =>
  schema.superRefine((grade, ctx) => {
    if (grade.tensileMinMpa == null && grade.tensileTypicalMpa == null && "tensileMinMpa" in grade) {
      ctx.addIssue({ code: "custom", path: ["tensileMinMpa"], message: "give tensileMinMpa or tensileTypicalMpa" });
    }
  });

export const GradeInputSchema = needsTensile(GradeFields.strict()).openapi("GradeInput");
export const GradePatchSchema = GradeFields.omit({ code: true }).partial().strict().openapi("GradePatch");

export const GradeSchema = GradeFields.extend({
  id: z.string().openapi({ example: "grd_01JEXAMPLE0000000000000000" }),
  tensileTypicalMpa: z.number().nullable(),
  tensileMaxMpa: z.number().nullable(),
  valuesAreTypical: z.boolean(),
  shearTensileRatio: z.number(),
  gaugeFamily: z.enum(GAUGE_FAMILIES).nullable(),
  hardnessHb: z.number().nullable(),
  note: z.string().nullable(),
  archivedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
}).openapi("Grade");

export type GradeInputT = z.infer<typeof GradeInputSchema>;
export type GradePatchT = z.infer<typeof GradePatchSchema>;
export type GradeT = z.infer<typeof GradeSchema>;
