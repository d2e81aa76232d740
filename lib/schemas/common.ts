import { z } from "./zod";

export const ProblemSchema = z
  .object({
    type: z.string().openapi({ example: "/problems/not-found" }),
    title: z.string(),
    status: z.number().int(),
    detail: z.string(),
    instance: z.string().optional(),
    requestId: z.string().optional(),
    errors: z
      .array(
        z.object({ location: z.enum(["body", "query", "path", "header"]), pointer: z.string(), message: z.string() }),
      )
      .optional()
      .openapi({
        description: "For schema errors: where each problem is, as a JSON pointer into that part of the request.",
      }),
  })
  .catchall(z.unknown())
  .openapi("Problem", { description: "An error, as application/problem+json (RFC 9457)." });

export const idParam = (prefix: string, what: string) =>
  z.object({
    id: z
      .string()
      .min(1)
      .max(64)
      .openapi({
        param: { name: "id", in: "path" },
        example: `${prefix}_01JEXAMPLE0000000000000000`,
        description: `The ${what}'s id.`,
      }),
  });

export const PaginationSchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50).openapi({ description: "Page size, 1 to 200." }),
  cursor: z.string().max(200).optional().openapi({ description: "The `next_cursor` of the previous page." }),
});

export const listOf = <T extends z.ZodType>(item: T, name: string) =>
  z
    .object({
      data: z.array(item),
      next_cursor: z
        .string()
        .nullable()
        .openapi({ description: "Pass as `cursor` for the next page; null on the last page." }),
    })
    .openapi(name);
