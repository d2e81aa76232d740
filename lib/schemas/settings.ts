/**
 * The shop's settings as the API shows them, and how a program or plan that names no shear was
 * given one (`routing`: the shear chosen, and every other active shear with its reason).
 */
import { ROUTING_RULES } from "./enums";
import { z } from "./zod";

const routingRule = z.enum(ROUTING_RULES).openapi({
  description:
    "How a program or plan that names no shear is given one: `least_capacity` (default) picks the shear that can cut it with the least of its capacity used (the largest of force, thickness and cut length against its ratings); `shortest_queue` the one with the fewest released programs waiting (then the least capacity).",
});

const remnantMinMm = z.number().positive().max(100_000).nullable().openapi({
  description:
    "The shortest side, in mm, of an offcut worth keeping: when a run completes, its offcuts at least this long both ways are booked in as remnants. Null (default): none are booked.",
});

export const SettingsSchema = z.object({ routingRule, remnantMinMm }).openapi("Settings");

export const SettingsPatchSchema = z
  .object({ routingRule: routingRule.optional(), remnantMinMm: remnantMinMm.optional() })
  .strict()
  .refine((p) => Object.keys(p).length > 0, { message: "send at least one setting to change" })
  .openapi("SettingsPatch");

export const RoutedShearSchema = z
  .object({
    shear: z.string().openapi({ description: "The shear's id" }),
    name: z.string(),
    canCut: z.boolean().openapi({ description: "Its check has no finding of severity `error`" }),
    capacityUsedPct: z.number().nullable().openapi({
      description:
        "The largest of force, thickness and longest cut against the shear's ratings, in percent; null when the check could not work it out",
    }),
    releasedPrograms: z.number().int().openapi({ description: "Programs released to it and not yet claimed" }),
    reason: z.string().nullable().openapi({ description: "Why it was not chosen; null for the chosen shear" }),
  })
  .openapi("RoutedShear");

export const RoutingSchema = z
  .object({
    rule: z.enum(ROUTING_RULES),
    chosen: z.string().nullable().openapi({ description: "The shear chosen; null when none can cut it" }),
    shears: z.array(RoutedShearSchema).openapi({ description: "Every active shear of the shop, the chosen one first" }),
  })
  .openapi("Routing", {
    description: "How the shear was chosen when the request named none; null when it named one.",
  });

export type SettingsT = z.infer<typeof SettingsSchema>;
export type SettingsPatchT = z.infer<typeof SettingsPatchSchema>;
export type RoutingT = z.infer<typeof RoutingSchema>;
