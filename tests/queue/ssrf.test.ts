import { describe, expect, it } from "vitest";
import { BlockedAddressError, isPublicAddress, resolveReceiver } from "../../lib/queue/ssrf";

// Address ranges as the IANA special-purpose registries define them (RFC 6890 and successors).
describe("outbound address check", () => {
  it.each([
    ["127.0.0.1", "loopback"], ["10.1.2.3", "private (RFC 1918)"], ["172.16.0.5", "private (RFC 1918)"], ["192.168.1.10", "private (RFC 1918)"],
    ["169.254.169.254", "link-local, cloud metadata"], ["100.64.0.1", "carrier-grade NAT (RFC 6598)"], ["0.0.0.0", "unspecified"],
    ["224.0.0.1", "multicast"], ["::1", "IPv6 loopback"], ["fc00::1", "IPv6 unique local"], ["fe80::1", "IPv6 link-local"],
    ["::ffff:127.0.0.1", "IPv4-mapped loopback"],
  ])("refuses %s (%s) on a hosted install", async (address) => {
    expect(isPublicAddress(address)).toBe(false);
    const host = address.includes(":") ? `[${address}]` : address;
    await expect(resolveReceiver(new URL(`http://${host}/hook`), false)).rejects.toBeInstanceOf(BlockedAddressError);
  });

  it("refuses a name that resolves to loopback, after DNS", async () => {
    await expect(resolveReceiver(new URL("http://localhost:8080/hook"), false)).rejects.toThrow(/resolves to .*non-public/);
  });

  it("accepts public addresses", async () => {
    for (const a of ["93.184.216.34", "8.8.8.8", "2606:4700:4700::1111"]) expect(isPublicAddress(a)).toBe(true);
    await expect(resolveReceiver(new URL("http://8.8.8.8/hook"), false)).resolves.toEqual({ address: "8.8.8.8", family: 4 });
  });

  it("allows the shop's own LAN receivers when the install is on-premises", async () => {
    await expect(resolveReceiver(new URL("http://192.168.1.10/hook"), true)).resolves.toEqual({ address: "192.168.1.10", family: 4 });
  });
});
