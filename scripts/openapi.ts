/** `npm run openapi`: write the committed copies of the OpenAPI document and the cut-program JSON Schema. */
import { writeFileSync } from "node:fs";
import { cutProgramJsonSchema, openApiDocument } from "../lib/api/document";

const write = (file: string, value: unknown) => writeFileSync(file, `${JSON.stringify(value, null, 2)}\n`);
write("openapi/openapi.json", openApiDocument());
write("openapi/cut-program.schema.json", cutProgramJsonSchema());
console.log("wrote openapi/openapi.json and openapi/cut-program.schema.json");
