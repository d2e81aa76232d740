/** The team of a shop as the console changes it: invitations, roles, accepting an invitation. */
import { ROLES } from "./enums";
import { z } from "./zod";

export const MIN_PASSWORD = 10;

export const InviteInputSchema = z
  .object({
    email: z.string().trim().toLowerCase().max(254).pipe(z.email("That is not an e-mail address.")),
    role: z.enum(ROLES),
  })
  .strict();

export const AcceptInputSchema = z
  .object({
    token: z.string().min(1).max(200),
    name: z.string().trim().min(1, "Tell us your name.").max(100),
    password: z.string().min(MIN_PASSWORD, `Choose a password of at least ${MIN_PASSWORD} characters.`).max(200),
  })
  .strict();
