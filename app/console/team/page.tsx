import { Fragment } from "react";
import { InviteForm, MemberControls, RevokeInvite } from "@/components/console/TeamForms";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listTeam } from "@/lib/services/team";

export const metadata = { title: "Team" };

const ROLE_TEXT = {
  owner: "everything, including the team",
  admin: "keys, webhooks, catalog, releasing programs",
  developer: "reads programs, logs and events; sends test events",
  viewer: "reads only",
};

export default async function Team() {
  const member = await currentMember();
  const { members, invitations } = await listTeam(await requestEm(), member.shopId);
  const manage = can(member.role, "team:manage");
  return (
    <>
      <PageHeader title="Team" lead="Who can sign in to this shop's console, and what they may do." />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-6">
          <Table head={["Name", "E-mail", "Role", ...(manage ? [""] : [])]}>
            {members.map((person) => (
              <tr key={person.id} data-testid="member">
                <Td>
                  {person.name}
                  {person.userId === member.userId ? " (you)" : ""}
                </Td>
                <Td mono>{person.email}</Td>
                <Td>
                  <Badge value="draft" label={person.role} />
                </Td>
                {manage && (
                  <Td>
                    <MemberControls
                      id={person.id}
                      name={person.name}
                      role={person.role}
                      self={person.userId === member.userId}
                    />
                  </Td>
                )}
              </tr>
            ))}
          </Table>
          {invitations.length > 0 && (
            <Table head={["Invited", "Role", "Link expires", ""]}>
              {invitations.map((invitation) => (
                <tr key={invitation.id}>
                  <Td mono>{invitation.email}</Td>
                  <Td>{invitation.role}</Td>
                  <Td mono>{when(invitation.expiresAt)}</Td>
                  <Td>{manage && <RevokeInvite id={invitation.id} email={invitation.email} />}</Td>
                </tr>
              ))}
            </Table>
          )}
          <dl className="grid grid-cols-[6rem_1fr] gap-y-1 text-xs text-ink-muted">
            {Object.entries(ROLE_TEXT).map(([role, text]) => (
              <Fragment key={role}>
                <dt className="font-mono">{role}</dt>
                <dd>{text}</dd>
              </Fragment>
            ))}
          </dl>
        </div>
        {manage ? <InviteForm /> : <p className="text-sm text-ink-muted">Owners invite people and change roles.</p>}
      </div>
    </>
  );
}
