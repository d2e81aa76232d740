import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { LOOPBACK_ONLY } from "../../lib/network";
import { databaseUrl, redisUrl, type Profile } from "./services";

/** A secret generated once per data folder and kept there (never committed). */
export function persistentSecret(dataRoot: string, name: string): string {
  const file = path.join(dataRoot, `${name}.secret`);
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  mkdirSync(dataRoot, { recursive: true });
  const value = randomBytes(32).toString("base64url");
  writeFileSync(file, `${value}\n`, { mode: 0o600 });
  return value;
}

/** Environment for the app processes of a profile; values already set in the shell win. */
export function appEnv(profile: Profile, port: number): NodeJS.ProcessEnv {
  const baseUrl = `http://127.0.0.1:${port}`;
  return {
    ...process.env,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    DATABASE_URL: process.env.DATABASE_URL ?? databaseUrl(profile.pg),
    REDIS_URL: process.env.REDIS_URL ?? redisUrl(profile.redis),
    NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? baseUrl,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? persistentSecret(profile.dataRoot, "nextauth"),
    SHEARWIRE_BASE_URL: process.env.SHEARWIRE_BASE_URL ?? baseUrl,
    SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${profile.mail.smtpPort}`,
    // A local install may send webhooks to receivers on this machine only; a shop adds its ERP's LAN address here.
    SHEARWIRE_PRIVATE_RECEIVERS: process.env.SHEARWIRE_PRIVATE_RECEIVERS ?? LOOPBACK_ONLY,
  };
}
