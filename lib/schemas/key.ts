/** API keys as the console creates them (keys have no public API: they are made in the console or from the shell). */
import { SCOPES } from "../../lib/schemas/enums";
import { z } from "./zod";

export const KeyInputSchema = z
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

/** What each scope lets a key do, in a sentence (the console and the reference show these). */
export const SCOPE_WORDS: Record<(typeof SCOPES)[number], string> = {
  "programs:read": "Read programs and plans, and check programs without storing them.",
  "programs:write":
    "Create and change draft programs, plan order lines, write a plan's programs, cancel programs and plans.",
  "programs:release": "Release checked programs to the shear (the gateway can then claim and run them).",
  gateway: "For the gateway beside a shear: claim released programs and report the run (bind it to its shears).",
  "catalog:read": "Read shears, grades, gauges and setup recommendations.",
  "catalog:write": "Add and change shears and grades.",
  "events:read": "Read events and their webhook deliveries.",
  "webhooks:write": "Add, change and test webhook endpoints, rotate their secrets, resend events.",
  "settings:write": "Change the shop's settings: how work without a shear is routed, the remnant size kept.",
  "stock:read": "Read the stock on hand and its reservations.",
  "stock:write": "Add, adjust, reserve, release and archive stock.",
};

/** Ready-made sets of scopes for the usual kinds of key. */
export const KEY_PRESETS: { name: string; label: string; scopes: (typeof SCOPES)[number][]; note: string }[] = [
  {
    name: "erp",
    label: "ERP integration",
    scopes: ["programs:read", "programs:write", "programs:release", "catalog:read", "events:read", "webhooks:write"],
    note: "pushes orders, releases them, hears back through webhooks",
  },
  {
    name: "gateway",
    label: "Machine gateway",
    scopes: ["gateway", "programs:read"],
    note: "runs beside one shear: bind it to that shear below",
  },
  {
    name: "read-only",
    label: "Read-only",
    scopes: ["programs:read", "catalog:read", "events:read"],
    note: "dashboards and reports; the only kind a developer may create",
  },
];

/** Scopes a developer may give a key of their own making: reading only. */
export const READ_ONLY_SCOPES: readonly (typeof SCOPES)[number][] = ["programs:read", "catalog:read", "events:read"];
