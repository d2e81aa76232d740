import Link from "next/link";
import { ActionForm } from "@/components/console/ActionForm";
import { KeyForm } from "@/components/console/KeyForm";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { Shear, User } from "@/entities";
import { SCOPES } from "@/lib/schemas/enums";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { KEY_PRESETS, READ_ONLY_SCOPES, SCOPE_WORDS } from "@/lib/schemas/key";
import { listKeys } from "@/lib/services/keys";
import { revokeKeyAction } from "./actions";

export const metadata = { title: "API keys" };

export default async function Keys({ searchParams }: { searchParams: Promise<{ show?: string }> }) {
  const member = await currentMember();
  const em = await requestEm();
  const showRevoked = (await searchParams).show === "revoked";
  const all = await listKeys(em, member.shopId);
  const keys = showRevoked ? all : all.filter((k) => !k.revokedAt);
  const revoked = all.length - all.filter((k) => !k.revokedAt).length;
  const shears = await em.find(Shear, { shop: member.shopId, archivedAt: null }, { orderBy: { name: "asc" } });
  const shearNames = new Map(
    (await em.find(Shear, { shop: member.shopId }, { fields: ["name"] })).map((s) => [s.id, s.name]),
  );
  const creatorIds = [...new Set(all.map((k) => k.createdBy).filter((id): id is string => Boolean(id)))];
  const creators = new Map(
    (creatorIds.length ? await em.find(User, { id: { $in: creatorIds } }, { fields: ["name"] }) : []).map((u) => [
      u.id,
      u.name,
    ]),
  );
  const manage = can(member.role, "keys:manage");
  const readOnly = !manage && can(member.role, "keys:create-read-only");
  const state = (apiKeyView: (typeof keys)[number]) =>
    apiKeyView.revokedAt
      ? "revoked"
      : apiKeyView.expiresAt && new Date(apiKeyView.expiresAt) <= new Date()
        ? "expired"
        : "active";
  return (
    <>
      <PageHeader
        title="API keys"
        lead="Keys your systems and gateways use. Secrets are shown once, at creation; Shearwire keeps only a digest."
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_26rem]">
        <div className="space-y-3">
          <Table
            head={["Name", "Key", "Scopes", "Shears", "Created", "Last used", "Expires", "State", ""]}
            empty={
              showRevoked
                ? "No keys yet."
                : "No keys in use. Create one with the form: pick “ERP integration” for the system that sends orders."
            }
          >
            {keys.map((key) => (
              <tr key={key.id}>
                <Td>{key.name}</Td>
                <Td mono>{key.prefix}…</Td>
                <Td mono>{key.scopes.join(" ")}</Td>
                <Td>{key.shearIds.length ? key.shearIds.map((id) => shearNames.get(id) ?? id).join(", ") : "all"}</Td>
                <Td>
                  <span className="font-mono text-xs">{when(key.createdAt)}</span>
                  {key.createdBy ? (
                    <>
                      <br />
                      <span className="text-xs text-ink-muted">
                        by {creators.get(key.createdBy) ?? "a former member"}
                      </span>
                    </>
                  ) : null}
                </Td>
                <Td mono>{when(key.lastUsedAt)}</Td>
                <Td mono>{when(key.expiresAt)}</Td>
                <Td>
                  <Badge value={state(key)} />
                </Td>
                <Td>
                  {manage && !key.revokedAt && (
                    <ActionForm
                      action={revokeKeyAction}
                      fields={{ id: key.id }}
                      label={`Revoke key ${key.name}`}
                      buttonClassName="text-xs text-fault hover:underline"
                      confirm={`Revoke ${key.name} (${key.prefix}…)? Requests with it fail from the next one on.`}
                    >
                      Revoke
                    </ActionForm>
                  )}
                </Td>
              </tr>
            ))}
          </Table>
          {revoked > 0 && (
            <p className="text-xs">
              <Link className="text-edge" href={showRevoked ? "/console/keys" : "/console/keys?show=revoked"}>
                {showRevoked ? "Hide revoked keys" : `Show ${revoked} revoked key${revoked === 1 ? "" : "s"}`}
              </Link>
            </p>
          )}
          <details className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <summary className="cursor-pointer font-semibold">What each scope allows</summary>
            <dl className="mt-2 grid gap-x-4 gap-y-1 sm:grid-cols-[10rem_1fr]">
              {SCOPES.map((scope) => (
                <div key={scope} className="contents">
                  <dt className="font-mono text-xs">{scope}</dt>
                  <dd className="text-ink-muted">{SCOPE_WORDS[scope]}</dd>
                </div>
              ))}
            </dl>
          </details>
        </div>
        {manage || readOnly ? (
          <KeyForm
            scopes={readOnly ? READ_ONLY_SCOPES : SCOPES}
            words={SCOPE_WORDS}
            presets={readOnly ? KEY_PRESETS.filter((p) => p.name === "read-only") : KEY_PRESETS}
            shears={shears.map((s) => ({ id: s.id, name: s.name }))}
            readOnly={readOnly}
          />
        ) : (
          <p className="text-sm text-ink-muted">
            Your role ({member.role}) can see keys; admins and owners create and revoke them.
          </p>
        )}
      </div>
    </>
  );
}
