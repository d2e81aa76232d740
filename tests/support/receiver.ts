/** A webhook receiver on loopback for tests: records every request; answers as told. */
import http from "node:http";
import type { AddressInfo } from "node:net";

export interface Received {
  at: number;
  headers: http.IncomingHttpHeaders;
  body: string;
}

export type Responder = (
  req: Received,
  count: number,
) => { status: number; headers?: Record<string, string>; body?: string; holdMs?: number };

export interface Receiver {
  url: string;
  received: Received[];
  respond: Responder;
  close(): Promise<void>;
  /** wait until `n` requests have arrived */
  waitFor(n: number, timeoutMs?: number): Promise<Received[]>;
}

export async function startReceiver(respond: Responder = () => ({ status: 204 })): Promise<Receiver> {
  const received: Received[] = [];
  const r: Receiver = {
    url: "",
    received,
    respond,
    close: () =>
      new Promise((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
    async waitFor(n, timeoutMs = 20_000) {
      const deadline = Date.now() + timeoutMs;
      while (received.length < n) {
        if (Date.now() > deadline) throw new Error(`expected ${n} webhook requests, got ${received.length}`);
        await new Promise((res) => setTimeout(res, 25));
      }
      return received;
    },
  };
  const server = http.createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      const rec = { at: Date.now(), headers: req.headers, body };
      received.push(rec);
      const answer = r.respond(rec, received.length);
      const send = () => res.writeHead(answer.status, answer.headers ?? {}).end(answer.body ?? "");
      if (answer.holdMs) setTimeout(send, answer.holdMs);
      else send();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  // Receivers are named by host name, as an ERP's always are (the address is checked after DNS).
  r.url = `http://localhost:${(server.address() as AddressInfo).port}/hook`;
  return r;
}
