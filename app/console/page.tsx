import Link from "next/link";
import { Logo } from "@/components/Logo";

export const metadata = { title: "Console" };

export default function ConsolePlaceholder() {
  return (
    <main className="mx-auto max-w-xl px-6 py-16">
      <Logo />
      <h1 className="mt-8 text-2xl font-semibold">The console is being built</h1>
      <p className="mt-3 text-ink-muted">Sign-in, keys, webhooks, logs, programs, the catalog and the team will live here.</p>
      <Link className="mt-6 inline-block text-edge hover:underline" href="/">Back to the start page</Link>
    </main>
  );
}
