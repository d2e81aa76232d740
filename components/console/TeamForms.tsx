"use client";

import { useRouter } from "next/navigation";
import { changeRoleAction, inviteAction, removeMemberAction, withdrawInviteAction } from "@/app/console/team/actions";
import { ActionForm } from "./ActionForm";
import { ActionMessage, FieldError, useConsoleForm } from "./useConsoleForm";

const ROLES = ["owner", "admin", "developer", "viewer"] as const;

export function InviteForm() {
  const router = useRouter();
  const form = useConsoleForm(inviteAction, { onSuccess: () => router.refresh(), resetOnSuccess: true });
  return (
    <form
      onSubmit={form.onSubmit}
      noValidate
      className="grid content-start gap-3 self-start rounded-md border border-scale-200 bg-white p-4 text-sm"
    >
      <h2 className="font-semibold">Invite someone</h2>
      <label className="grid gap-1">
        E-mail
        <input
          name="email"
          type="email"
          required
          aria-describedby="invite-email-error"
          className="rounded border border-scale-300 px-2 py-1.5"
        />
        <FieldError id="invite-email-error" message={form.error("email")} />
      </label>
      <label className="grid gap-1">
        Role
        <select name="role" defaultValue="developer" className="rounded border border-scale-300 px-2 py-1.5">
          {ROLES.map((r) => (
            <option key={r}>{r}</option>
          ))}
        </select>
      </label>
      <button
        disabled={form.disabled}
        className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60"
      >
        Send invitation
      </button>
      <ActionMessage result={form.result} shownFields={["email"]} />
    </form>
  );
}

export function MemberControls({ id, name, role, self }: { id: string; name: string; role: string; self: boolean }) {
  const router = useRouter();
  const form = useConsoleForm(changeRoleAction, { onSuccess: () => router.refresh() });
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form onSubmit={form.onSubmit} className="flex items-center gap-1">
        <input type="hidden" name="id" value={id} />
        <select
          name="role"
          defaultValue={role}
          aria-label={`Role of ${name}`}
          className="rounded border border-scale-300 px-1 py-0.5 text-xs"
        >
          {ROLES.map((r) => (
            <option key={r}>{r}</option>
          ))}
        </select>
        <button
          disabled={form.disabled}
          aria-label={`Change the role of ${name}`}
          className="rounded border border-scale-300 px-2 py-0.5 text-xs"
        >
          Change
        </button>
      </form>
      <ActionForm
        action={removeMemberAction}
        fields={{ id }}
        label={`Remove ${name}`}
        buttonClassName="text-xs text-fault hover:underline"
        confirm={self ? "Remove yourself from this shop?" : `Remove ${name} from the shop?`}
      >
        Remove
      </ActionForm>
      <ActionMessage result={form.result} />
    </div>
  );
}

export function RevokeInvite({ id, email }: { id: string; email: string }) {
  return (
    <ActionForm
      action={withdrawInviteAction}
      fields={{ id }}
      label={`Withdraw the invitation to ${email}`}
      buttonClassName="text-xs text-fault hover:underline"
    >
      Withdraw
    </ActionForm>
  );
}
