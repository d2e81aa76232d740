import { ApiReference } from "@scalar/nextjs-api-reference";

// The interactive API reference, fully offline: our own copy of the script, no web fonts,
// no assistant; "try it" sends to this server with the API key you enter.
const palette = `
.light-mode, .light-mode .dark-mode {
  --scalar-color-accent: #0b777c;
  --scalar-background-1: #ffffff;
  --scalar-background-2: #f6f7f8;
  --scalar-background-3: #eceef1;
  --scalar-color-1: #161b22;
  --scalar-color-2: #5b6573;
  --scalar-border-color: #d9dde3;
}
:root { --scalar-font: system-ui, -apple-system, "Segoe UI", sans-serif; --scalar-font-code: ui-monospace, "DejaVu Sans Mono", monospace; }
`;

const reference = ApiReference({
  url: "/api/v1/openapi.json",
  cdn: "/vendor/scalar/standalone.js",
  pageTitle: "Shearwire API reference",
  withDefaultFonts: false,
  agent: { disabled: true },
  theme: "none",
  customCss: palette,
  hideClientButton: false,
  showDeveloperTools: "never",
  telemetry: false,
  authentication: { preferredSecurityScheme: "apiKey" },
  defaultHttpClient: { targetKey: "shell", clientKey: "curl" },
  metaData: { title: "Shearwire API reference" },
});

/** The reference page, its scripts carrying this request's CSP nonce (proxy.ts sets it) so the strict policy admits them. */
export async function GET(request: Request): Promise<Response> {
  const page = await reference();
  const nonce = request.headers.get("x-nonce");
  if (!nonce || !/^[A-Za-z0-9+/=]+$/.test(nonce)) return page;
  const html = (await page.text()).replace(/<script(?=[\s>])/g, `<script nonce="${nonce}"`);
  const headers = new Headers(page.headers);
  headers.delete("content-length");
  return new Response(html, { status: page.status, headers });
}
