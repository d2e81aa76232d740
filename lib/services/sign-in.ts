/**
 * Console sign-in with a throttle on Redis (rate-limiter-flexible): failed attempts are
 * counted per account and per client address; past the limit the answer is a clear "try
 * again in N minutes" without checking the password, and every failure is recorded.
 * A success clears the account's count.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import bcrypt from "bcryptjs";
import { RateLimiterRedis, type RateLimiterRes } from "rate-limiter-flexible";
import { SignInAttempt, User } from "../../entities";
import { getRedis } from "../redis";
import { textProblem } from "../text";

export const SIGN_IN_LIMITS = {
  /** failed attempts on one account, from anywhere, per window */
  perAccount: Number(process.env.SHEARWIRE_SIGNIN_FAILURES_PER_ACCOUNT ?? 5),
  /** failed attempts from one client address, on any accounts, per window */
  perAddress: Number(process.env.SHEARWIRE_SIGNIN_FAILURES_PER_ADDRESS ?? 30),
  windowSeconds: 15 * 60,
} as const;

export class SignInThrottled extends Error {}

const holder = globalThis as unknown as {
  __shearwireSignIn?: { account: RateLimiterRedis; address: RateLimiterRedis };
};

function limiters() {
  holder.__shearwireSignIn ??= {
    account: new RateLimiterRedis({
      storeClient: getRedis(),
      keyPrefix: "shearwire:signin:account",
      points: SIGN_IN_LIMITS.perAccount,
      duration: SIGN_IN_LIMITS.windowSeconds,
    }),
    address: new RateLimiterRedis({
      storeClient: getRedis(),
      keyPrefix: "shearwire:signin:address",
      points: SIGN_IN_LIMITS.perAddress,
      duration: SIGN_IN_LIMITS.windowSeconds,
    }),
  };
  return holder.__shearwireSignIn;
}

// Compared even when there is no such account, so the time taken does not tell who has one.
const NO_ACCOUNT_HASH = "$2b$10$invalidinvalidinvalidinvalidinvalidinvalidinvalidinva";

const minutes = (res: RateLimiterRes) => Math.max(1, Math.ceil(res.msBeforeNext / 60_000));

async function record(em: EntityManager, email: string, address: string, outcome: "wrong-password" | "throttled") {
  em.create(SignInAttempt, { email: email.slice(0, 254), address: address.slice(0, 100), outcome });
  await em.flush().catch((err) => console.error("[sign-in] could not record an attempt:", err));
}

/**
 * The account for this e-mail and password, or null; throws `SignInThrottled` (with a message
 * meant for the person) when the account or the address has failed too often lately.
 */
export async function verifySignIn(
  em: EntityManager,
  emailInput: string,
  password: string,
  address: string,
): Promise<{ id: string; email: string; name: string } | null> {
  const email = emailInput.trim().toLowerCase();
  // Nothing that could not be an account reaches the database (NUL, broken Unicode, absurd lengths).
  if (!email || email.length > 254 || password.length > 1000 || textProblem(email)) return null;
  const { account, address: byAddress } = limiters();
  const [accountState, addressState] = await Promise.all([account.get(email), byAddress.get(address)]);
  for (const [state, limit, what] of [
    [accountState, SIGN_IN_LIMITS.perAccount, "this account"],
    [addressState, SIGN_IN_LIMITS.perAddress, "your address"],
  ] as const) {
    if (state && state.consumedPoints >= limit) {
      await record(em, email, address, "throttled");
      throw new SignInThrottled(
        `Too many failed sign-ins for ${what}. Try again in ${minutes(state)} minute${minutes(state) === 1 ? "" : "s"}, or ask an owner to help.`,
      );
    }
  }
  const user = await em.findOne(User, { email });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? NO_ACCOUNT_HASH);
  if (ok && user) {
    await account.delete(email).catch(() => undefined);
    return { id: user.id, email: user.email, name: user.name };
  }
  await Promise.all([account.penalty(email, 1), byAddress.penalty(address, 1)]).catch((err) =>
    console.error("[sign-in] could not count a failure:", err),
  );
  await record(em, email, address, "wrong-password");
  return null;
}
