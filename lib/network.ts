/**
 * Which receivers Shearwire may send webhooks to. Public unicast addresses always; loopback,
 * private, link-local, unique-local and carrier-grade NAT addresses only when the install
 * lists them in `SHEARWIRE_PRIVATE_RECEIVERS` (host names, `*.suffix` wildcards, or CIDR
 * ranges, comma-separated): an on-premises install names its ERP's LAN, a hosted one names
 * nothing. Unspecified, multicast and broadcast addresses are never receivers. Names are
 * checked after DNS, and the request then goes only to the addresses that passed.
 */
import { lookup } from "node:dns/promises";
import ipaddr from "ipaddr.js";

export class BlockedAddressError extends Error {}

export const PRIVATE_RECEIVERS_VARIABLE = "SHEARWIRE_PRIVATE_RECEIVERS";
/** What a local install allows: its own machine (the demo's receivers run there). */
export const LOOPBACK_ONLY = "127.0.0.0/8,::1/128";

export interface ReceiverAllowList {
  /** host names allowed to resolve to private addresses; `*.example.lan` allows every name under it */
  hosts: string[];
  cidrs: [ipaddr.IPv4 | ipaddr.IPv6, number][];
  /** as configured, for messages */
  text: string;
}

/** Parse a list such as `127.0.0.0/8, ::1/128, erp.shop.lan, *.plant.lan`; throws on an entry that is neither. */
export function parseAllowList(text: string | undefined): ReceiverAllowList {
  const list: ReceiverAllowList = { hosts: [], cidrs: [], text: (text ?? "").trim() };
  for (const raw of list.text
    .split(",")
    .map((entry) => entry.trim())
    .filter(Boolean)) {
    if (raw.includes("/")) {
      list.cidrs.push(ipaddr.parseCIDR(raw));
    } else if (ipaddr.isValid(raw)) {
      const address = ipaddr.parse(raw);
      list.cidrs.push([address, address.kind() === "ipv4" ? 32 : 128]);
    } else if (/^(\*\.)?[a-z0-9]([a-z0-9-]*[a-z0-9])?(\.[a-z0-9]([a-z0-9-]*[a-z0-9])?)*$/i.test(raw)) {
      list.hosts.push(raw.toLowerCase());
    } else {
      throw new Error(`${PRIVATE_RECEIVERS_VARIABLE}: "${raw}" is neither a host name nor an address range`);
    }
  }
  return list;
}

/** The install's list, from the environment (read each time: tests and operators may change it). */
export function allowList(): ReceiverAllowList {
  return parseAllowList(process.env[PRIVATE_RECEIVERS_VARIABLE]);
}

const NEVER = new Set(["unspecified", "multicast", "broadcast"]);

function normalise(address: string): ipaddr.IPv4 | ipaddr.IPv6 {
  const parsed = ipaddr.parse(address);
  return parsed.kind() === "ipv6" && (parsed as ipaddr.IPv6).isIPv4MappedAddress()
    ? (parsed as ipaddr.IPv6).toIPv4Address()
    : parsed;
}

/** True when the address is a public unicast address. */
export function isPublicAddress(address: string): boolean {
  return normalise(address).range() === "unicast";
}

function hostAllowed(host: string, list: ReceiverAllowList): boolean {
  const name = host.toLowerCase().replace(/\.$/, "");
  return list.hosts.some((entry) => (entry.startsWith("*.") ? name.endsWith(entry.slice(1)) : name === entry));
}

function inRanges(address: ipaddr.IPv4 | ipaddr.IPv6, list: ReceiverAllowList): boolean {
  return list.cidrs.some(([range, bits]) => range.kind() === address.kind() && address.match(range, bits));
}

/** Why this address may not receive, or null when it may. */
export function refusal(host: string, address: string, list: ReceiverAllowList): string | null {
  const parsed = normalise(address);
  const range = parsed.range();
  if (NEVER.has(range)) return `${host} resolves to ${address}, a ${range} address, which can never receive webhooks`;
  if (range === "unicast") return null;
  if (hostAllowed(host, list) || inRanges(parsed, list)) return null;
  return `${host} resolves to ${address}, a non-public (${range}) address that is not on this install's list of private receivers (${PRIVATE_RECEIVERS_VARIABLE}${list.text ? ` = ${list.text}` : " is empty"})`;
}

export interface CheckedAddress {
  address: string;
  family: 4 | 6;
}

const hostOf = (url: URL) => url.hostname.replace(/^\[|\]$/g, "");

/**
 * Refuse at once a receiver written as an address (or `localhost`) that this install will never
 * send to; other names are checked when sending, after DNS. Returns the reason, or null.
 */
export function literalRefusal(url: URL, list = allowList()): string | null {
  const host = hostOf(url);
  if (ipaddr.isValid(host)) return refusal(host, host, list);
  if (host.toLowerCase() === "localhost") return refusal(host, "127.0.0.1", list);
  return null;
}

/** Resolve the URL's host and check every address; returns the addresses to connect to (all of them passed). */
export async function resolveReceiver(url: URL, list = allowList()): Promise<CheckedAddress[]> {
  const host = hostOf(url);
  const addresses: CheckedAddress[] = ipaddr.isValid(host)
    ? [{ address: host, family: ipaddr.parse(host).kind() === "ipv6" ? 6 : 4 }]
    : (await lookup(host, { all: true, verbatim: true })).map((a) => ({
        address: a.address,
        family: a.family as 4 | 6,
      }));
  if (!addresses.length) throw new BlockedAddressError(`${host} has no address`);
  for (const address of addresses) {
    const why = refusal(host, address.address, list);
    if (why) throw new BlockedAddressError(why);
  }
  return addresses;
}

type LookupCallback = (err: NodeJS.ErrnoException | null, address: string | CheckedAddress[], family?: number) => void;

/**
 * A `lookup` for http.request that answers only with addresses already checked. Node asks for
 * one address, or (when it tries several, as `autoSelectFamily` does) for all of them.
 */
export function pinnedLookup(addresses: CheckedAddress[]) {
  return (_host: string, options: { all?: boolean; family?: number }, callback: LookupCallback) => {
    const wanted =
      options.family === 4 || options.family === 6 ? addresses.filter((a) => a.family === options.family) : addresses;
    if (!wanted.length) {
      const err: NodeJS.ErrnoException = new Error(`no checked IPv${options.family} address`);
      err.code = "ENOTFOUND";
      callback(err, options.all ? [] : "");
      return;
    }
    if (options.all)
      callback(
        null,
        wanted.map((a) => ({ ...a })),
      );
    else callback(null, wanted[0].address, wanted[0].family);
  };
}
