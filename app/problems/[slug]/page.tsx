import Link from "next/link";
import { notFound } from "next/navigation";
import { Logo } from "@/components/Logo";
import { PROBLEM_TYPES } from "@/lib/api/problem-types";

export function generateStaticParams() {
  return Object.keys(PROBLEM_TYPES).map((slug) => ({ slug }));
}

export default async function ProblemPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const problem = PROBLEM_TYPES[slug];
  if (!problem) notFound();
  return (
    <main className="mx-auto max-w-2xl px-6 py-12">
      <Link href="/">
        <Logo />
      </Link>
      <p className="mt-10 font-mono text-sm text-edge">
        HTTP {problem.status} · /problems/{slug}
      </p>
      <h1 className="mt-2 text-2xl font-semibold">{problem.title}</h1>
      <p className="mt-4 text-ink-muted">{problem.explanation}</p>
      <p className="mt-8 text-sm">
        Errors from the Shearwire API are <code>application/problem+json</code> (RFC 9457) with <code>type</code>,{" "}
        <code>title</code>, <code>status</code>, <code>detail</code> and the <code>requestId</code> to quote.{" "}
        <Link className="text-edge hover:underline" href="/problems">
          All problem types
        </Link>{" "}
        ·{" "}
        <a className="text-edge hover:underline" href="/docs">
          API reference
        </a>
      </p>
    </main>
  );
}
