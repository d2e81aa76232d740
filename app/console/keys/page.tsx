import { KeyForm } from "@/components/console/KeyForm";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { ActionForm } from "@/components/console/ActionForm";
import { Shear } from "@/entities";
import { SCOPES } from "@/entities/ApiKey";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listKeys } from "@/lib/services/keys";
import { revokeKeyAction } from "./actions";

export const metadata = { title: "API keys" };

export default async function Keys() {
  const member = await currentMember();
  const em = await requestEm();
  const keys = await listKeys(em, member.shopId);
  const shears = await em.find(Shear, { shop: member.shopId, archivedAt: null }, { orderBy: { name: "asc" } });
  const manage = can(member.role, "keys:manage");
  const state = (k: (typeof keys)[number]) => (k.revokedAt ? "revoked" : k.expiresAt && new Date(k.expiresAt) <= new Date() ? "expired" : "active");
  return (
    <>
      <PageHeader title="API keys" lead="Keys your systems and gateways use. Secrets are shown once, at creation." />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <Table head={["Name", "Key", "Scopes", "Shears", "Last used", "Expires", "State", ""]} empty="No keys yet.">
          {keys.map((k) => (
            <tr key={k.id}>
              <Td>{k.name}</Td>
              <Td mono>{k.prefix}…</Td>
              <Td mono>{k.scopes.join(" ")}</Td>
              <Td mono>{k.shearIds.length ? k.shearIds.length : "all"}</Td>
              <Td mono>{when(k.lastUsedAt)}</Td>
              <Td mono>{when(k.expiresAt)}</Td>
              <Td><Badge value={state(k)} /></Td>
              <Td>
                {manage && !k.revokedAt && (
                  <ActionForm action={revokeKeyAction} fields={{ id: k.id }} label={`Revoke key ${k.name}`} buttonClassName="text-xs text-fault hover:underline"
                    confirm={`Revoke ${k.name} (${k.prefix}…)? Requests with it fail from the next one on.`}>Revoke</ActionForm>
                )}
              </Td>
            </tr>
          ))}
        </Table>
        {manage ? <KeyForm scopes={SCOPES} shears={shears.map((s) => ({ id: s.id, name: s.name }))} /> : (
          <p className="text-sm text-ink-muted">Your role ({member.role}) can see keys; admins and owners create and revoke them.</p>
        )}
      </div>
    </>
  );
}
