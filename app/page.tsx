import Link from "next/link";
import { Logo } from "@/components/Logo";
import { SafetyNote } from "@/components/SafetyNote";

const steps = [
  {
    title: "Orders in",
    body: "Your ERP posts each order as a cut program: grade, thickness, sheet, and the backgauge settings in order. Idempotent, versioned, documented.",
  },
  {
    title: "Checked against the shear",
    body: "Thickness and force against the machine's rating for that grade, length of cut against the blade, backgauge against travel, every piece traced through the sheet.",
  },
  {
    title: "Set up and released",
    body: "Blade gap, rake, crown and hold-down worked out and explained; yield and cycle time estimated; released programs wait for the gateway beside the machine.",
  },
  {
    title: "Everyone hears back",
    body: "Signed webhooks as programs are released, claimed, run, completed or failed, so the office books production without anyone retyping a count.",
  },
];

export default function Home() {
  return (
    <div className="mx-auto flex min-h-screen max-w-5xl flex-col px-6">
      <header className="flex items-center justify-between py-6">
        <Logo />
        <nav className="flex gap-5 text-sm">
          <Link className="hover:text-edge" href="/docs">
            API reference
          </Link>
          <Link className="rounded-md bg-ink px-3 py-1.5 text-scale-50 hover:bg-ink-soft" href="/console">
            Sign in to the console
          </Link>
        </nav>
      </header>

      <main className="flex-1 py-12">
        <p className="font-mono text-xs uppercase tracking-widest text-edge">
          For shops that shear sheet and plate to blanks
        </p>
        <h1 className="mt-3 max-w-3xl text-4xl font-semibold leading-tight tracking-tight">
          From the office order to the guillotine shear and back, checked at every step.
        </h1>
        <p className="mt-5 max-w-2xl text-lg text-ink-muted">
          Shearwire is the developer API and webhook hub between your ERP and your CNC hydraulic shears. It checks each
          cut program against the machine&apos;s capacity and the grade&apos;s limits, works out the setup, hands
          released work to the machine-side gateway and tells your systems what happened.
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          <Link className="rounded-md bg-edge px-4 py-2 font-medium text-white hover:bg-edge-dark" href="/docs">
            Read the API reference
          </Link>
          <Link className="rounded-md border border-scale-300 px-4 py-2 font-medium hover:border-ink" href="/console">
            Open the console
          </Link>
          <a className="rounded-md px-4 py-2 font-mono text-sm text-ink-muted hover:text-ink" href="/api/v1/health">
            GET /api/v1/health
          </a>
        </div>

        <ol className="mt-14 grid gap-4 sm:grid-cols-2">
          {steps.map((step, index) => (
            <li key={step.title} className="rounded-lg border border-scale-200 bg-white p-5">
              <span className="font-mono text-xs text-edge">0{index + 1}</span>
              <h2 className="mt-1 font-semibold">{step.title}</h2>
              <p className="mt-1 text-sm text-ink-muted">{step.body}</p>
            </li>
          ))}
        </ol>

        <p className="mt-12 text-sm text-ink-muted">
          Built for shop IT who keep the keys and endpoints, ERP integrators who push work, developers who read the
          reference, and production leads who want to know what ran.
        </p>
        <div className="mt-6 max-w-3xl">
          <SafetyNote />
        </div>
      </main>

      <footer className="border-t border-scale-200 py-6 text-xs text-ink-muted">Shearwire · API v1</footer>
    </div>
  );
}
