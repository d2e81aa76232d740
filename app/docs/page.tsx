import Link from "next/link";
import { Logo } from "@/components/Logo";

export const metadata = { title: "API reference" };

export default function DocsPlaceholder() {
  return (
    <main className="mx-auto max-w-xl px-6 py-16">
      <Logo />
      <h1 className="mt-8 text-2xl font-semibold">API reference</h1>
      <p className="mt-3 text-ink-muted">
        The interactive reference arrives with the public API. Today the service answers{" "}
        <a className="font-mono text-edge hover:underline" href="/api/v1/health">GET /api/v1/health</a>.
      </p>
      <Link className="mt-6 inline-block text-edge hover:underline" href="/">Back to the start page</Link>
    </main>
  );
}
