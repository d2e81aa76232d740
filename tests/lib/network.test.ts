import http from "node:http";
import type { AddressInfo } from "node:net";
import { lookup } from "node:dns/promises";
import { hostname } from "node:os";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  BlockedAddressError,
  isPublicAddress,
  LOOPBACK_ONLY,
  parseAllowList,
  pinnedLookup,
  resolveReceiver,
} from "../../lib/network";
import { post } from "../../lib/worker/post";

const hosted = parseAllowList("");
const loopback = parseAllowList(LOOPBACK_ONLY);

// Address ranges as the IANA special-purpose registries define them (RFC 6890 and successors).
describe("outbound address check", () => {
  it.each([
    ["127.0.0.1", "loopback"],
    ["10.1.2.3", "private (RFC 1918)"],
    ["172.16.0.5", "private (RFC 1918)"],
    ["192.168.1.10", "private (RFC 1918)"],
    ["169.254.169.254", "link-local, cloud metadata"],
    ["100.64.0.1", "carrier-grade NAT (RFC 6598)"],
    ["0.0.0.0", "unspecified"],
    ["224.0.0.1", "multicast"],
    ["::1", "IPv6 loopback"],
    ["fc00::1", "IPv6 unique local"],
    ["fe80::1", "IPv6 link-local"],
    ["::ffff:127.0.0.1", "IPv4-mapped loopback"],
  ])("refuses %s (%s) on a hosted install", async (address) => {
    expect(isPublicAddress(address)).toBe(false);
    const host = address.includes(":") ? `[${address}]` : address;
    await expect(resolveReceiver(new URL(`http://${host}/hook`), hosted)).rejects.toBeInstanceOf(BlockedAddressError);
  });

  it("refuses a name that resolves to loopback, after DNS", async () => {
    await expect(resolveReceiver(new URL("http://localhost:8080/hook"), hosted)).rejects.toThrow(
      /resolves to .*non-public/,
    );
  });

  it("accepts public addresses", async () => {
    for (const a of ["93.184.216.34", "8.8.8.8", "2606:4700:4700::1111"]) expect(isPublicAddress(a)).toBe(true);
    await expect(resolveReceiver(new URL("http://8.8.8.8/hook"), hosted)).resolves.toEqual([
      { address: "8.8.8.8", family: 4 },
    ]);
  });

  it("allows private receivers only as the install lists them: ranges, names and wildcards", async () => {
    const lan = parseAllowList("192.168.1.0/24, erp.shop.lan, *.plant.lan");
    await expect(resolveReceiver(new URL("http://192.168.1.10/hook"), lan)).resolves.toEqual([
      { address: "192.168.1.10", family: 4 },
    ]);
    await expect(resolveReceiver(new URL("http://192.168.2.10/hook"), lan)).rejects.toThrow(
      /not on this install's list/,
    );
    await expect(resolveReceiver(new URL("http://10.0.0.1/hook"), lan)).rejects.toThrow(
      /SHEARWIRE_PRIVATE_RECEIVERS = 192\.168\.1\.0\/24/,
    );
    // The demo's list is loopback only: the LAN stays closed.
    await expect(resolveReceiver(new URL("http://127.0.0.1:9/hook"), loopback)).resolves.toHaveLength(1);
    await expect(resolveReceiver(new URL("http://192.168.1.10/hook"), loopback)).rejects.toBeInstanceOf(
      BlockedAddressError,
    );
    // Unspecified and multicast addresses are never receivers, whatever the list says.
    await expect(resolveReceiver(new URL("http://0.0.0.0/hook"), parseAllowList("0.0.0.0/0"))).rejects.toThrow(
      /never receive/,
    );
    expect(() => parseAllowList("not a host!")).toThrow(/neither a host name nor an address range/);
  });

  it("answers Node's lookup in both of its shapes, with checked addresses only", () => {
    const lookupFn = pinnedLookup([
      { address: "127.0.0.1", family: 4 },
      { address: "::1", family: 6 },
    ]);
    const one: unknown[] = [];
    lookupFn("x", {}, (...args) => one.push(...args));
    expect(one).toEqual([null, "127.0.0.1", 4]);
    const all: unknown[] = [];
    lookupFn("x", { all: true }, (...args) => all.push(...args));
    expect(all).toEqual([
      null,
      [
        { address: "127.0.0.1", family: 4 },
        { address: "::1", family: 6 },
      ],
    ]);
    const six: unknown[] = [];
    lookupFn("x", { all: true, family: 6 }, (...args) => six.push(...args));
    expect(six).toEqual([null, [{ address: "::1", family: 6 }]]);
  });
});

describe("a receiver named by host name", () => {
  let server: http.Server;
  let port = 0;
  const received: string[] = [];
  const saved = process.env.SHEARWIRE_PRIVATE_RECEIVERS;

  beforeAll(async () => {
    process.env.SHEARWIRE_PRIVATE_RECEIVERS = LOOPBACK_ONLY;
    server = http.createServer((req, res) => {
      let body = "";
      req.on("data", (chunk) => (body += chunk));
      req.on("end", () => {
        received.push(`${req.headers.host} ${body}`);
        res.writeHead(204).end();
      });
    });
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    port = (server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    process.env.SHEARWIRE_PRIVATE_RECEIVERS = saved;
    server.closeAllConnections();
    await new Promise((resolve) => server.close(resolve));
  });

  it("is reached at localhost (the request once failed with 'Invalid IP address: undefined')", async () => {
    const result = await post(`http://localhost:${port}/hook`, '{"n":1}', {});
    expect(result.error).toBeNull();
    expect(result.status).toBe(204);
    expect(received).toContain(`localhost:${port} {"n":1}`);
  });

  it("is reached at this machine's own name, resolved through the system resolver", async (ctx) => {
    const name = hostname();
    const resolved = (await lookup(name, { all: true }).catch(() => [])).filter((a) => a.family === 4);
    if (!resolved.length) ctx.skip(); // the machine's name does not resolve at all here
    // Listen where the name points, and allow just that address: the name goes through DNS, the check and the pinned lookup.
    const address = resolved[0].address;
    const own = http.createServer((_req, res) => res.writeHead(202).end());
    await new Promise<void>((resolve) => own.listen(0, address, resolve));
    process.env.SHEARWIRE_PRIVATE_RECEIVERS = `${LOOPBACK_ONLY},${address}`;
    try {
      const result = await post(`http://${name}:${(own.address() as AddressInfo).port}/hook`, '{"n":2}', {});
      expect(result.error).toBeNull();
      expect(result.status).toBe(202);
    } finally {
      process.env.SHEARWIRE_PRIVATE_RECEIVERS = LOOPBACK_ONLY;
      own.closeAllConnections();
      await new Promise((resolve) => own.close(resolve));
    }
  });

  it("is refused, before any request, when the install does not list loopback", async () => {
    process.env.SHEARWIRE_PRIVATE_RECEIVERS = "";
    try {
      const before = received.length;
      const result = await post(`http://localhost:${port}/hook`, "{}", {});
      expect(result.status).toBeNull();
      expect(result.error).toMatch(/not on this install's list of private receivers/);
      expect(received.length).toBe(before);
    } finally {
      process.env.SHEARWIRE_PRIVATE_RECEIVERS = LOOPBACK_ONLY;
    }
  });
});
