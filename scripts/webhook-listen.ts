/**
 * A sample webhook receiver: verifies each delivery's Standard Webhooks signature, skips
 * webhook-ids it has seen (delivery is at least once), and prints the events.
 *   npm run webhook:listen -- --port 4000 --secret whsec_…
 * Register http://localhost:4000/ as an endpoint (the local install allows receivers on this machine).
 */
import http from "node:http";
import { parseArgs } from "node:util";
import { Webhook } from "standardwebhooks";

const { values } = parseArgs({ options: { port: { type: "string" }, secret: { type: "string" } } });
const secret = values.secret ?? process.env.SHEARWIRE_WEBHOOK_SECRET;
if (!secret) {
  console.error("usage: npm run webhook:listen -- --port 4000 --secret whsec_…");
  process.exit(2);
}
const verifier = new Webhook(secret.replace(/^whsec_/, ""));
const seen = new Set<string>();
const port = Number(values.port ?? 4000);

http
  .createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      const headers = {
        "webhook-id": String(req.headers["webhook-id"]),
        "webhook-timestamp": String(req.headers["webhook-timestamp"]),
        "webhook-signature": String(req.headers["webhook-signature"]),
      };
      try {
        const event = verifier.verify(body, headers) as {
          type: string;
          timestamp: string;
          data: { program?: { id: string; status: string; reference: string } };
        };
        const id = headers["webhook-id"];
        if (seen.has(id)) {
          console.log(`${new Date().toISOString()} duplicate ${id} (already handled)`);
        } else {
          seen.add(id);
          const program = event.data.program;
          console.log(
            `${new Date().toISOString()} ${event.type.padEnd(22)} ${id}${program ? `  ${program.id} ${program.reference} → ${program.status}` : ""}`,
          );
        }
        res.writeHead(204).end();
      } catch (err) {
        console.log(`${new Date().toISOString()} rejected: ${(err as Error).message}`);
        res.writeHead(400).end("bad signature");
      }
    });
  })
  .listen(port, "127.0.0.1", () =>
    console.log(`listening on http://127.0.0.1:${port}/ (signatures checked with standardwebhooks)`),
  );
