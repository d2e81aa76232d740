/**
 * The caution shown wherever Shearwire shows a setup or runs programs. Shearing can maim:
 * computed settings are recommendations for a qualified operator, never a guarantee.
 */
export function SafetyNote({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      role="note"
      aria-label="Safety"
      className="rounded-md border border-caution/40 bg-caution-light px-4 py-3 text-sm text-caution-dark"
    >
      <p className="font-semibold">Safety first: a shear cuts fingers as easily as steel.</p>
      {!compact && (
        <ul className="mt-1 list-disc space-y-0.5 pl-5">
          <li>Run only with the guards, light curtains and two-hand or foot controls in place and working.</li>
          <li>Lock out and tag out the machine before changing or adjusting blades, gap or backgauge by hand.</li>
          <li>
            Settings shown here are recommendations for a qualified operator, not a guarantee. The machine maker&apos;s
            manual, your local codes and your qualified people come first.
          </li>
        </ul>
      )}
    </aside>
  );
}
