/**
 * The `Prefer` request header (RFC 7240): only `wait=N` is honoured here. Returns the seconds
 * to wait (capped), or null when the caller did not ask to wait.
 */
export function preferredWait(header: string | null, max: number): number | null {
  if (!header) return null;
  for (const preference of header.split(",")) {
    const match = /^\s*wait\s*=\s*"?(\d{1,6})"?\s*(;.*)?$/i.exec(preference);
    if (match) return Math.min(Number(match[1]), max);
  }
  return null;
}
