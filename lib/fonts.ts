import localFont from "next/font/local";

// Shipped in fonts/ (SIL Open Font License, licence files beside them): nothing is fetched.
export const sans = localFont({
  src: [
    { path: "../fonts/inter/inter-latin-wght-normal.woff2", weight: "100 900", style: "normal" },
    { path: "../fonts/inter/inter-latin-ext-wght-normal.woff2", weight: "100 900", style: "normal" },
  ],
  variable: "--font-sans",
  display: "swap",
});

export const mono = localFont({
  src: [
    { path: "../fonts/jetbrains-mono/jetbrains-mono-latin-wght-normal.woff2", weight: "100 800", style: "normal" },
    { path: "../fonts/jetbrains-mono/jetbrains-mono-latin-ext-wght-normal.woff2", weight: "100 800", style: "normal" },
  ],
  variable: "--font-mono",
  display: "swap",
});
