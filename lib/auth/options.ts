/**
 * Console sign-in: e-mail and password (bcrypt), throttled per account and per address, with
 * the session cookie (a signed JWT from next-auth) naming a session row kept on the server,
 * so that signing out or a change of role ends it for real. After sign-in only a path on
 * this site is followed.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { requestEm } from "../db/orm";
import { endSession, startSession } from "../services/sessions";
import { SignInThrottled, verifySignIn } from "../services/sign-in";
import { safeCallbackPath } from "./redirect";

export const SESSION_MAX_AGE_SECONDS = 12 * 60 * 60;

/** The client's address: the first X-Forwarded-For entry (set by the server in front), else unknown. */
function clientAddress(headers: Record<string, string | string[] | undefined> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = (Array.isArray(forwarded) ? forwarded[0] : forwarded)?.split(",")[0]?.trim();
  return first || "unknown";
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/signin" },
  providers: [
    CredentialsProvider({
      name: "Shearwire",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, request) {
        const email = typeof credentials?.email === "string" ? credentials.email : "";
        const password = typeof credentials?.password === "string" ? credentials.password : "";
        if (!email || !password) return null;
        try {
          return await verifySignIn(
            await requestEm(),
            email,
            password,
            clientAddress(request?.headers as Record<string, string>),
          );
        } catch (err) {
          // The message reaches the sign-in form, which shows it as is.
          if (err instanceof SignInThrottled) throw new Error(err.message);
          // Anything else is ours: logged here, never shown (the message could hold internals).
          console.error("[sign-in]", err);
          throw new Error("Signing in is not possible right now; try again in a moment.");
        }
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.sid = await startSession(await requestEm(), user.id, SESSION_MAX_AGE_SECONDS);
      }
      return token;
    },
    session({ session, token }) {
      if (session.user) Object.assign(session.user, { id: token.uid as string, sid: token.sid as string });
      return session;
    },
    redirect({ url, baseUrl }) {
      // Absolute URLs only when they are this site; otherwise a path on it, or the console.
      if (url.startsWith(baseUrl)) return `${baseUrl}${safeCallbackPath(url.slice(baseUrl.length) || "/")}`;
      return `${baseUrl}${safeCallbackPath(url)}`;
    },
  },
  events: {
    async signOut({ token }) {
      if (typeof token?.sid === "string") await endSession(await requestEm(), token.sid, "signed-out");
    },
  },
};
