import Link from "next/link";
import { Suspense } from "react";
import { Logo } from "@/components/Logo";
import { SignInForm } from "./SignInForm";

export const metadata = { title: "Sign in" };

export default function SignIn() {
  return (
    <main className="mx-auto max-w-sm px-6 py-16">
      <Link href="/">
        <Logo />
      </Link>
      <h1 className="mt-10 text-2xl font-semibold">Sign in to the console</h1>
      <p className="mt-1 text-sm text-ink-muted">Keys, webhooks, logs, programs and the catalog of your shop.</p>
      <Suspense>
        <SignInForm />
      </Suspense>
    </main>
  );
}
