/** Shearwire's mark: a sheet with a raked cut line, the strip below it taken off. */
export function LogoMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="#161b22" />
      <path d="M7 9h18v5.5L7 17.5z" fill="#eceef1" />
      <path d="M7 20.5l18-3V23H7z" fill="#0f8a8f" />
      <path d="M4.5 19.2L27.5 15.4" stroke="#f6f7f8" strokeWidth="1.4" strokeLinecap="round" />
    </svg>
  );
}

export function Logo() {
  return (
    <span className="inline-flex items-center gap-2 font-semibold tracking-tight">
      <LogoMark />
      <span>Shearwire</span>
    </span>
  );
}
