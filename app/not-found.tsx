import type { Metadata } from "next";
import Link from "next/link";
import { Logo } from "@/components/Logo";

export const metadata: Metadata = { title: "Not found" };

/** Any address outside the console and the API that no page has (404). */
export default function NotFound() {
  return (
    <div className="mx-auto flex min-h-screen max-w-5xl flex-col px-6">
      <header className="py-6">
        <Logo />
      </header>
      <main className="flex-1 py-12">
        <h1 className="text-2xl font-semibold">No page at this address</h1>
        <p className="mt-2 max-w-xl text-sm text-ink-muted">
          Check the address for a typing slip. The API is under <code className="font-mono">/api/v1</code>; its paths
          are listed in the API reference.
        </p>
        <nav className="mt-6 flex gap-5 text-sm">
          <Link className="text-edge hover:underline" href="/">
            Home
          </Link>
          <Link className="text-edge hover:underline" href="/console">
            Console
          </Link>
          <Link className="text-edge hover:underline" href="/docs">
            API reference
          </Link>
        </nav>
      </main>
    </div>
  );
}
