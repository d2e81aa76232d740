"use client";

import { useActionState } from "react";
import { inviteAction, memberAction, type TeamState } from "@/app/console/team/actions";
import { ConfirmButton } from "@/components/ui/ConfirmButton";

const ROLES = ["owner", "admin", "developer", "viewer"] as const;

function Result({ state }: { state: TeamState }) {
  if (!state) return null;
  return state.error ? <p role="alert" className="text-xs text-fault">{state.error}</p> : <p role="status" className="text-xs text-ok">{state.ok}</p>;
}

export function InviteForm() {
  const [state, act, pending] = useActionState<TeamState, FormData>(inviteAction, null);
  return (
    <form action={act} className="grid content-start gap-3 self-start rounded-md border border-scale-200 bg-white p-4 text-sm">
      <h2 className="font-semibold">Invite someone</h2>
      <label className="grid gap-1">E-mail <input name="email" type="email" required className="rounded border border-scale-300 px-2 py-1.5" /></label>
      <label className="grid gap-1">Role
        <select name="role" defaultValue="developer" className="rounded border border-scale-300 px-2 py-1.5">{ROLES.map((r) => <option key={r}>{r}</option>)}</select>
      </label>
      <button disabled={pending} className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60">Send invitation</button>
      <Result state={state} />
    </form>
  );
}

export function MemberControls({ id, role, self }: { id: string; role: string; self: boolean }) {
  const [state, act, pending] = useActionState<TeamState, FormData>(memberAction, null);
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form action={act} className="flex items-center gap-1">
        <input type="hidden" name="id" value={id} />
        <input type="hidden" name="action" value="role" />
        <select name="role" defaultValue={role} aria-label="Role" className="rounded border border-scale-300 px-1 py-0.5 text-xs">{ROLES.map((r) => <option key={r}>{r}</option>)}</select>
        <button disabled={pending} className="rounded border border-scale-300 px-2 py-0.5 text-xs">Change</button>
      </form>
      <form action={act}>
        <input type="hidden" name="id" value={id} />
        <input type="hidden" name="action" value="remove" />
        <ConfirmButton question={self ? "Remove yourself from this shop?" : "Remove this person from the shop?"} className="text-xs text-fault hover:underline">Remove</ConfirmButton>
      </form>
      <Result state={state} />
    </div>
  );
}

export function RevokeInvite({ id }: { id: string }) {
  const [state, act] = useActionState<TeamState, FormData>(memberAction, null);
  return (
    <form action={act}>
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="action" value="revoke-invite" />
      <button className="text-xs text-fault hover:underline">Withdraw</button>
      <Result state={state} />
    </form>
  );
}
