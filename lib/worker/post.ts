/** Posting one webhook: signed (Standard Webhooks), to the address that passed the address check, with a timeout, no redirects, and the answer kept short. */
import http from "node:http";
import https from "node:https";
import { Webhook } from "svix";
import { type WebhookEndpointEntity } from "../../entities";
import { pinnedLookup, resolveReceiver, type CheckedAddress } from "../network";

export const TIMEOUT_MS = 15_000;
const EXCERPT_CHARS = 2000;
/** Response headers kept per attempt, and the longest value kept of each. */
const HEADERS_KEPT = 40;
const HEADER_CHARS = 500;

export function keptHeaders(headers: Record<string, string | string[] | undefined>): Record<string, string> {
  return Object.fromEntries(
    Object.entries(headers)
      .slice(0, HEADERS_KEPT)
      .filter((entry): entry is [string, string | string[]] => entry[1] !== undefined)
      .map(([name, value]) => [name, (Array.isArray(value) ? value.join(", ") : value).slice(0, HEADER_CHARS)]),
  );
}
export const USER_AGENT = "Shearwire-Webhooks/1";
// Connections to receivers are kept open between deliveries (a socket is only ever opened to an address that passed the check).
const agents = {
  http: new http.Agent({ keepAlive: true, maxSockets: 64 }),
  https: new https.Agent({ keepAlive: true, maxSockets: 64 }),
};

export interface HttpResult {
  status: number | null;
  headers: Record<string, string | string[] | undefined>;
  excerpt: string | null;
  error: string | null;
  latencyMs: number;
}

const signers = new Map<string, Webhook>();
/** One signer per secret (decoding the secret once). */
function signer(secret: string): Webhook {
  let webhook = signers.get(secret);
  if (!webhook) {
    if (signers.size > 1000) signers.clear();
    webhook = new Webhook(secret);
    signers.set(secret, webhook);
  }
  return webhook;
}

/** Sign a payload with every secret that is currently valid for the endpoint. */
export function signatures(
  endpoint: Pick<WebhookEndpointEntity, "secret" | "previousSecret" | "previousSecretExpiresAt">,
  id: string,
  at: Date,
  payload: string,
  now = new Date(),
): string {
  const secrets = [endpoint.secret];
  if (endpoint.previousSecret && endpoint.previousSecretExpiresAt && endpoint.previousSecretExpiresAt > now)
    secrets.push(endpoint.previousSecret);
  return secrets.map((s) => signer(s).sign(id, at, payload)).join(" ");
}

/** POST to the receiver at the address that passed the address check. */
export async function post(urlText: string, body: string, headers: Record<string, string>): Promise<HttpResult> {
  const started = performance.now();
  const done = (result: Omit<HttpResult, "latencyMs">): HttpResult => ({
    ...result,
    latencyMs: Math.round((performance.now() - started) * 10) / 10,
  });
  let url: URL;
  let targets: CheckedAddress[];
  try {
    url = new URL(urlText);
    targets = await resolveReceiver(url);
  } catch (err) {
    return done({ status: null, headers: {}, excerpt: null, error: (err as Error).message });
  }
  const secure = url.protocol === "https:";
  const client = secure ? https : http;
  return new Promise((resolve) => {
    const req = client.request(url, {
      method: "POST",
      headers: {
        ...headers,
        "content-type": "application/json",
        "content-length": Buffer.byteLength(body),
        "user-agent": USER_AGENT,
      },
      lookup: pinnedLookup(targets) as unknown as http.RequestOptions["lookup"],
      timeout: TIMEOUT_MS,
      agent: secure ? agents.https : agents.http,
    });
    const timer = setTimeout(() => req.destroy(new Error(`no answer within ${TIMEOUT_MS / 1000} s`)), TIMEOUT_MS);
    req.on("timeout", () => req.destroy(new Error(`no answer within ${TIMEOUT_MS / 1000} s`)));
    req.on("error", (err) => {
      clearTimeout(timer);
      resolve(done({ status: null, headers: {}, excerpt: null, error: err.message }));
    });
    req.on("response", (res) => {
      let text = "";
      res.setEncoding("utf8");
      res.on("data", (chunk: string) => {
        if (text.length < EXCERPT_CHARS) text += chunk;
      });
      const finish = () => {
        clearTimeout(timer);
        resolve(
          done({
            status: res.statusCode ?? null,
            headers: res.headers,
            excerpt: text.slice(0, EXCERPT_CHARS) || null,
            error: null,
          }),
        );
      };
      res.on("end", finish);
      res.on("error", finish);
    });
    req.end(body);
  });
}
