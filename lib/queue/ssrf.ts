/**
 * Outbound webhook addresses are checked when sending, after DNS: loopback, private,
 * link-local, unique-local, carrier-grade NAT, multicast and cloud metadata addresses are
 * refused unless the install allows on-premises receivers (SHEARWIRE_ALLOW_PRIVATE_WEBHOOKS=1).
 * The request then goes to the address that was checked, so DNS cannot change under us.
 */
import { lookup } from "node:dns/promises";
import ipaddr from "ipaddr.js";

export class BlockedAddressError extends Error {}

export function privateReceiversAllowed(): boolean {
  return process.env.SHEARWIRE_ALLOW_PRIVATE_WEBHOOKS === "1";
}

const PUBLIC_RANGES = new Set(["unicast"]);

/** True when the address is a public unicast address. */
export function isPublicAddress(address: string): boolean {
  let ip = ipaddr.parse(address);
  if (ip.kind() === "ipv6" && (ip as ipaddr.IPv6).isIPv4MappedAddress()) ip = (ip as ipaddr.IPv6).toIPv4Address();
  return PUBLIC_RANGES.has(ip.range());
}

/** Resolve the URL's host and check every address; returns the address to connect to. */
export async function resolveReceiver(url: URL, allowPrivate = privateReceiversAllowed()): Promise<{ address: string; family: 4 | 6 }> {
  const host = url.hostname.replace(/^\[|\]$/g, "");
  const addresses = ipaddr.isValid(host)
    ? [{ address: host, family: ipaddr.parse(host).kind() === "ipv6" ? 6 : 4 }]
    : await lookup(host, { all: true, verbatim: true });
  if (!addresses.length) throw new BlockedAddressError(`${host} has no address`);
  if (!allowPrivate) {
    const blocked = addresses.find((a) => !isPublicAddress(a.address));
    if (blocked) throw new BlockedAddressError(`${host} resolves to ${blocked.address}, a non-public address; this install only sends to public receivers`);
  }
  return { address: addresses[0].address, family: addresses[0].family as 4 | 6 };
}
