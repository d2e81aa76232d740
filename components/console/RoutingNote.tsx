import { Table, Td } from "@/components/ui";
import type { RoutingT } from "@/lib/schemas/settings";

const RULE_WORDS: Record<RoutingT["rule"], string> = {
  least_capacity: "the shear that cuts it with the least of its capacity used",
  shortest_queue: "the shear with the fewest released programs waiting",
};

/** How the shear was chosen for work that named none: every active shear, with why the others were not. */
export function RoutingNote({ routing }: { routing: RoutingT }) {
  return (
    <section data-testid="routing">
      <h2 className="mb-1 text-sm font-semibold">Why this shear</h2>
      <p className="mb-2 text-xs text-ink-muted">
        No shear was named, so every active shear was checked and the shop&apos;s rule chose {RULE_WORDS[routing.rule]}.
      </p>
      <Table head={["Shear", "Can cut", "Capacity used", "Released waiting", "Not chosen because"]}>
        {routing.shears.map((shear) => (
          <tr key={shear.shear}>
            <Td>
              {shear.name}
              {shear.shear === routing.chosen ? " (chosen)" : ""}
            </Td>
            <Td>{shear.canCut ? "yes" : "no"}</Td>
            <Td mono>{shear.capacityUsedPct === null ? "—" : `${shear.capacityUsedPct} %`}</Td>
            <Td mono>{shear.releasedPrograms}</Td>
            <Td className="text-xs">{shear.reason ?? "—"}</Td>
          </tr>
        ))}
      </Table>
    </section>
  );
}
