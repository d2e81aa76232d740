import Link from "next/link";
import { Logo } from "@/components/Logo";
import { PROBLEM_TYPES } from "@/lib/api/problem-types";

export const metadata = { title: "Problem types" };

export default function Problems() {
  return (
    <main className="mx-auto max-w-3xl px-6 py-12">
      <Link href="/">
        <Logo />
      </Link>
      <h1 className="mt-10 text-2xl font-semibold">Problem types</h1>
      <p className="mt-2 text-ink-muted">
        Every error the API answers with. The <code>type</code> of a problem links here.
      </p>
      <table className="mt-6 w-full text-sm">
        <tbody>
          {Object.entries(PROBLEM_TYPES).map(([slug, problem]) => (
            <tr key={slug} className="border-t border-scale-200">
              <td className="py-2 pr-4 font-mono text-ink-muted">{problem.status}</td>
              <td className="py-2">
                <Link className="text-edge hover:underline" href={`/problems/${slug}`}>
                  {problem.title}
                </Link>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </main>
  );
}
