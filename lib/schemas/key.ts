/** API keys as the console creates them (keys have no public API: they are made in the console or from the shell). */
import { SCOPES } from "../../entities/ApiKey";
import { z } from "./zod";

export const KeyInput = z
  .object({
    name: z.string().trim().min(1, "Give the key a name, e.g. the system that will use it.").max(100),
    scopes: z.array(z.enum(SCOPES)).min(1, "Choose at least one scope.").max(SCOPES.length),
    /** shear ids the key is bound to (gateway keys); empty = every shear of the shop */
    shears: z.array(z.string().min(1).max(64)).max(100).default([]),
    /** last day the key works (UTC), yyyy-mm-dd */
    expires: z.iso
      .date()
      .refine((day) => new Date(`${day}T23:59:59Z`) > new Date(), "The expiry date must be in the future.")
      .optional(),
  })
  .strict();

export type KeyInputT = z.infer<typeof KeyInput>;
