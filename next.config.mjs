/** @type {import('next').NextConfig} */
const nextConfig = {
  // Test builds go to their own folder so `npm test` never overwrites the running product's build.
  distDir: process.env.SHEARWIRE_DIST_DIR || ".next",
  // Server-only packages that must be loaded by Node at run time rather than bundled.
  serverExternalPackages: [
    "@mikro-orm/core",
    "@mikro-orm/knex",
    "@mikro-orm/postgresql",
    "@mikro-orm/migrations",
    "knex",
    "pg",
    "ioredis",
    "bullmq",
    "nodemailer",
    "highs", // the planner's LP solver: its WebAssembly file is found beside its loader at run time
  ],
  poweredByHeader: false,
  reactStrictMode: true,
  // No telemetry, no remote images, nothing fetched at build time.
  images: { unoptimized: true },
};

export default nextConfig;
