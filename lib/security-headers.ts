/**
 * The browser security headers every response carries, in one place: `proxy.ts` sets them on
 * pages (with the Content-Security-Policy and its nonce), the API's route wrapper on every
 * API response (API requests do not pass through the proxy, so that their bodies are never
 * buffered whole before the wrapper's size limit).
 */
export const SECURITY_HEADERS: Readonly<Record<string, string>> = {
  "X-Content-Type-Options": "nosniff",
  "X-Frame-Options": "DENY",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "Cross-Origin-Opener-Policy": "same-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
};

/** The page policy: scripts only with this request's nonce (and what they load), nothing framed, nothing from elsewhere. */
export function contentSecurityPolicy(nonce: string, development = false): string {
  return [
    "default-src 'self'",
    // The nonce admits the framework's own inline scripts; 'strict-dynamic' the chunks they load.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "frame-ancestors 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "object-src 'none'",
  ].join("; ");
}
