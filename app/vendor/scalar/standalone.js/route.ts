import { readFile } from "node:fs/promises";
import path from "node:path";

// The API reference's browser bundle, served by us so /docs makes no request to any CDN.
const FILE = path.join(process.cwd(), "node_modules", "@scalar", "api-reference", "dist", "browser", "standalone.js");
let cached: Promise<Buffer> | undefined;

export async function GET() {
  cached ??= readFile(FILE);
  return new Response(new Uint8Array(await cached), {
    headers: {
      "Content-Type": "application/javascript; charset=utf-8",
      "Cache-Control": "public, max-age=86400",
    },
  });
}
