/**
 * The OpenAPI document: valid OpenAPI 3.1 (an independent validator), the committed copy in
 * openapi/ equal to what the code generates, and the route files equal to its operations.
 */
import { readdirSync, readFileSync } from "node:fs";
import { Validator } from "@seriousme/openapi-schema-validator";
import { describe, expect, it } from "vitest";
import { cutProgramJsonSchema, openApiDocument } from "../../lib/api/document";
import { operations } from "../../lib/api/operations";

const committed = (file: string) => JSON.parse(readFileSync(`openapi/${file}`, "utf8"));
const regenerate = "run `npm run openapi` and commit openapi/";

describe("OpenAPI document", () => {
  it("is valid OpenAPI 3.1", async () => {
    const validator = new Validator();
    const result = await validator.validate(structuredClone(openApiDocument()) as unknown as Record<string, unknown>);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(validator.version).toBe("3.1");
  });

  it("is committed as generated", () => {
    expect(committed("openapi.json"), regenerate).toEqual(JSON.parse(JSON.stringify(openApiDocument())));
    expect(committed("cut-program.schema.json"), regenerate).toEqual(
      JSON.parse(JSON.stringify(cutProgramJsonSchema())),
    );
  });

  it("has exactly the operations the route files export", async () => {
    const fromFiles: string[] = [];
    const routeFiles = (readdirSync("app/api/v1", { recursive: true }) as string[])
      .filter((f) => f.endsWith("route.ts"))
      .map((f) => `app/api/v1/${f}`);
    for (const file of routeFiles) {
      const path = `/${file.replace(/^app\//, "").replace(/\/route\.ts$/, "")}`.replace(/\[(\w+)\]/g, "{$1}");
      const mod = await import(`../../${file}`);
      for (const method of ["GET", "POST", "PATCH", "PUT", "DELETE"])
        if (mod[method]) fromFiles.push(`${method.toLowerCase()} ${path}`);
    }
    const fromDoc = Object.entries(openApiDocument().paths ?? {}).flatMap(([path, item]) =>
      Object.keys(item as object).map((method) => `${method} ${path}`),
    );
    expect(fromFiles.sort()).toEqual(fromDoc.sort());
    expect(new Set(operations.map((o) => o.operationId)).size).toBe(operations.length);
  });

  it("gives every operation a summary, a tag and the scope it needs", () => {
    for (const op of operations) {
      expect(op.summary.length, op.operationId).toBeGreaterThan(3);
      expect(op.tags.length, op.operationId).toBeGreaterThan(0);
    }
    const doc = openApiDocument();
    const create = doc.paths?.["/api/v1/programs"]?.post;
    expect(create?.security).toEqual([{ apiKey: ["programs:write"] }]);
    expect(create?.parameters?.some((p) => "name" in p && p.name === "Idempotency-Key")).toBe(true);
  });
});
