/**
 * The fake SMTP server for development and tests: accepts every message on loopback, keeps
 * it as JSON in a folder, and shows the inbox at http://127.0.0.1:<http port>/ (also as JSON
 * at /messages). Nothing leaves this machine.
 *   tsx scripts/mail-server.ts --smtp 2525 --http 2580 --dir .data/mail
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { parseArgs } from "node:util";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const { values } = parseArgs({
  options: { smtp: { type: "string" }, http: { type: "string" }, dir: { type: "string" } },
});
const smtpPort = Number(values.smtp ?? 2525);
const httpPort = Number(values.http ?? 2580);
const dir = path.resolve(values.dir ?? ".data/mail");
mkdirSync(dir, { recursive: true });

interface Stored {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}
let seq = 0;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Shearwire fake SMTP (development only)",
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const receivedAt = new Date();
        const id = `${receivedAt.getTime()}-${process.pid}-${seq++}`;
        const stored: Stored = {
          id,
          receivedAt: receivedAt.toISOString(),
          from: mail.from?.text ?? String(session.envelope.mailFrom && session.envelope.mailFrom.address),
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
        };
        writeFileSync(path.join(dir, `${id}.json`), JSON.stringify(stored, null, 2));
        callback();
      })
      .catch((err) => callback(err));
  },
});
smtp.listen(smtpPort, "127.0.0.1", () =>
  console.log(`[mail] SMTP on 127.0.0.1:${smtpPort}, inbox at http://127.0.0.1:${httpPort}/`),
);

const messages = (): Stored[] =>
  readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .reverse()
    .map((f) => JSON.parse(readFileSync(path.join(dir, f), "utf8")));
const esc = (text: string) =>
  text.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);

http
  .createServer((req, res) => {
    if (req.url === "/messages") {
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(messages()));
      return;
    }
    const list = messages()
      .map(
        (stored) =>
          `<article><h2>${esc(stored.subject)}</h2><p class="meta">${esc(stored.receivedAt)} · from ${esc(stored.from)} · to ${esc(stored.to.join(", "))}</p><pre>${esc(stored.text)}</pre></article>`,
      )
      .join("");
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(
      `<!doctype html><meta charset="utf-8"><title>Shearwire development inbox</title>
<style>body{font:14px system-ui,sans-serif;max-width:860px;margin:2rem auto;color:#161b22}h1{font-size:18px}article{border-top:1px solid #d9dde3;padding:.5rem 0}h2{font-size:15px;margin:.3rem 0}.meta{color:#5b6573;margin:0}pre{white-space:pre-wrap;background:#f6f7f8;padding:.6rem}</style>
<h1>Development inbox (${messages().length})</h1><p class="meta">Every e-mail Shearwire sends on this machine lands here; nothing is sent out.</p>${list || "<p>No mail yet.</p>"}`,
    );
  })
  .listen(httpPort, "127.0.0.1");
