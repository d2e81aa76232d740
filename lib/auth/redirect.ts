/**
 * Where to go after signing in: only a path on this site. Anything else (another host,
 * `//host`, `/\host`, a scheme, control characters) goes to the console's overview instead.
 */
export const AFTER_SIGN_IN = "/console";

export function safeCallbackPath(value: string | null | undefined, fallback = AFTER_SIGN_IN): string {
  if (!value || value.length > 2000) return fallback;
  // A single leading slash followed by something other than a slash or backslash; no control characters.
  if (!/^\/(?![/\\])/.test(value) || /[\u0000-\u001f\u007f\\]/.test(value)) return fallback;
  try {
    const base = "http://shearwire.invalid";
    const url = new URL(value, base);
    if (url.origin !== base) return fallback;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return fallback;
  }
}
