"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { Button, Spinner } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { ROLE_DESCRIPTIONS, WORKSPACE_ROLES } from "@/contracts/roles";
import { invitationCreateBody, type InvitationCreateBody, type InvitationSent, type MemberRow, type WorkspaceInvitationRow } from "@/contracts/workspaces";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

type Props = { workspaceId: string; workspaceName: string; myUserId: string; myRole: string; canManage: boolean };

export function MembersPanel({ workspaceId, workspaceName, myUserId, myRole, canManage }: Props) {
  const queryClient = useQueryClient();
  const key = queryKeys.members(workspaceId);
  const members = useQuery({
    queryKey: key,
    queryFn: ({ signal }) => api<{ members: MemberRow[] }>(`/api/workspaces/${workspaceId}/members`, { signal }).then((r) => r.members),
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: key });
  const changeRole = useMutation({
    mutationFn: (v: { id: string; role: string }) => api(`/api/workspaces/${workspaceId}/members/${v.id}`, { method: "PATCH", body: { role: v.role } }),
    onSettled: refresh,
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/workspaces/${workspaceId}/members/${id}`, { method: "DELETE" }),
    onSettled: refresh,
  });
  const grantable = WORKSPACE_ROLES.filter((r) => r !== "owner" || myRole === "owner");

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
      <section aria-labelledby="members-heading">
        <h1 id="members-heading" className="mb-3 text-xl font-semibold">Members <span className="font-normal text-ink-muted">of {workspaceName}</span></h1>
        {changeRole.isError ? <ErrorNotice title="Could not change the role" message={changeRole.error.message} /> : null}
        {remove.isError ? <ErrorNotice title="Could not remove the member" message={remove.error.message} /> : null}
        {members.isPending ? (
          <div className="rounded-lg border border-ink/10 bg-white p-6 text-sm"><Spinner label="Loading members…" /></div>
        ) : members.isError ? (
          <ErrorNotice title="Could not load the members" message={members.error.message} onRetry={() => members.refetch()} />
        ) : (
          <table className="w-full overflow-hidden rounded-lg border border-ink/10 bg-white text-sm">
            <thead className="bg-ink/5 text-left text-xs uppercase tracking-wide text-ink-muted">
              <tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">E-mail</th><th className="px-3 py-2">Role</th><th className="px-3 py-2"><span className="sr-only">Actions</span></th></tr>
            </thead>
            <tbody className="divide-y divide-ink/10">
              {members.data.map((m) => (
                <tr key={m.id}>
                  <td className="px-3 py-2 font-medium">{m.name}{m.userId === myUserId ? <span className="ml-1 text-ink-muted">(you)</span> : null}</td>
                  <td className="px-3 py-2 text-ink-muted">{m.email}</td>
                  <td className="px-3 py-2">
                    {canManage && m.userId !== myUserId && (m.role !== "owner" || myRole === "owner") ? (
                      <select
                        aria-label={`Role of ${m.name}`}
                        value={m.role}
                        disabled={changeRole.isPending}
                        onChange={(e) => changeRole.mutate({ id: m.id, role: e.target.value })}
                        className="rounded border border-ink/20 px-1.5 py-0.5"
                      >
                        {grantable.map((r) => <option key={r} value={r}>{r}</option>)}
                      </select>
                    ) : (
                      m.role
                    )}
                  </td>
                  <td className="px-3 py-2 text-right">
                    {canManage && m.userId !== myUserId && (m.role !== "owner" || myRole === "owner") ? (
                      <Button variant="ghost" onClick={() => remove.mutate(m.id)} aria-label={`Remove ${m.name}`}>Remove</Button>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        <dl className="mt-4 grid gap-1 text-xs text-ink-muted">
          {WORKSPACE_ROLES.map((r) => <div key={r}><dt className="inline font-medium">{r}: </dt><dd className="inline">{ROLE_DESCRIPTIONS[r]}</dd></div>)}
        </dl>
      </section>
      {canManage ? (
        <div className="flex flex-col gap-6">
          <InviteForm workspaceId={workspaceId} roles={grantable} />
          <PendingInvitations workspaceId={workspaceId} myRole={myRole} />
        </div>
      ) : null}
    </div>
  );
}

function InviteForm({ workspaceId, roles }: { workspaceId: string; roles: readonly string[] }) {
  const queryClient = useQueryClient();
  const { register, handleSubmit, formState, reset, setError } = useForm<InvitationCreateBody>({
    resolver: zodResolver(invitationCreateBody),
    defaultValues: { email: "", role: "editor" },
  });
  const send = useMutation({
    mutationFn: (v: InvitationCreateBody) => api<{ invitation: InvitationSent }>(`/api/workspaces/${workspaceId}/members`, { method: "POST", body: v }),
    onSuccess: () => {
      reset();
      return queryClient.invalidateQueries({ queryKey: queryKeys.invitations(workspaceId) });
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const f of error.fields) if (f.path === "email" || f.path === "role") setError(f.path, { message: f.message });
    },
  });
  return (
    <aside className="h-fit rounded-lg border border-ink/10 bg-white p-4">
      <form onSubmit={handleSubmit((v) => send.mutate(v))} noValidate className="flex flex-col gap-3" aria-label="Invite someone">
        <h2 className="font-semibold">Invite someone</h2>
        <p className="text-xs text-ink-muted">We e-mail the address a link; they join once they follow it and sign in (or sign up) with this address. The link works once, for 7 days; inviting again sends a new one.</p>
        {send.isError && !(send.error instanceof ApiError && send.error.fields.length) ? <ErrorNotice title="Could not invite" message={send.error.message} /> : null}
        {send.isSuccess ? (
          <p role="status" className="rounded-md border border-ink/10 bg-paper px-3 py-2 text-sm">
            Invitation to <span className="font-medium">{send.data.invitation.email}</span> as {send.data.invitation.role} is waiting for their answer.
          </p>
        ) : null}
        <TextField id="invite-email" label="E-mail" type="email" autoComplete="off" error={formState.errors.email?.message} {...register("email")} />
        <SelectField id="invite-role" label="Role" error={formState.errors.role?.message} {...register("role")}>
          {roles.map((r) => <option key={r} value={r}>{r}</option>)}
        </SelectField>
        <Button type="submit" busy={send.isPending}>Invite</Button>
      </form>
    </aside>
  );
}

const MAIL_WORDS: Record<WorkspaceInvitationRow["mail"], string> = {
  sent: "Message sent",
  pending: "Message not sent yet: retrying",
  failed: "The message could not be sent: invite the address again to retry",
};

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });

function PendingInvitations({ workspaceId, myRole }: { workspaceId: string; myRole: string }) {
  const queryClient = useQueryClient();
  const key = queryKeys.invitations(workspaceId);
  const pending = useQuery({
    queryKey: key,
    queryFn: ({ signal }) => api<{ invitations: WorkspaceInvitationRow[] }>(`/api/workspaces/${workspaceId}/invitations`, { signal }).then((r) => r.invitations),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => api(`/api/workspaces/${workspaceId}/invitations/${id}`, { method: "DELETE" }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
  });
  return (
    <section aria-labelledby="pending-heading" className="rounded-lg border border-ink/10 bg-white p-4">
      <h2 id="pending-heading" className="mb-2 font-semibold">Pending invitations</h2>
      {revoke.isError ? <ErrorNotice title="Could not withdraw the invitation" message={revoke.error.message} /> : null}
      {pending.isPending ? (
        <p className="text-sm text-ink-muted"><Spinner label="Loading invitations…" /></p>
      ) : pending.isError ? (
        <ErrorNotice title="Could not load the invitations" message={pending.error.message} onRetry={() => pending.refetch()} />
      ) : pending.data.length === 0 ? (
        <p className="text-sm text-ink-muted">No one is waiting to answer.</p>
      ) : (
        <ul aria-label="Pending invitations" className="divide-y divide-ink/10 text-sm">
          {pending.data.map((inv) => (
            <li key={inv.id} className="flex items-center justify-between gap-2 py-2">
              <div className="min-w-0">
                <p className="truncate font-medium" title={inv.email}>{inv.email}</p>
                <p className="text-xs text-ink-muted">{inv.role} · invited by {inv.invitedBy} · open until {dateFormat.format(new Date(inv.expiresAt))}</p>
                <p className={`text-xs ${inv.mail === "failed" ? "font-medium text-red-700" : "text-ink-muted"}`}>{MAIL_WORDS[inv.mail]}</p>
              </div>
              {inv.role !== "owner" || myRole === "owner" ? (
                <Button variant="ghost" onClick={() => revoke.mutate(inv.id)} disabled={revoke.isPending} aria-label={`Withdraw the invitation to ${inv.email}`}>Withdraw</Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
