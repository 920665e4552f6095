"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { ErrorNotice } from "@/components/ui/notice";
import type { MyInvitationRow } from "@/contracts/workspaces";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

type Accepted = { workspace: { id: string; name: string }; role: string };

/** The signed-in person's open invitations, each with Accept and Decline. Nothing shows when there are none. */
export function MyInvitations({ initial }: { initial: MyInvitationRow[] }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const key = queryKeys.myInvitations;
  const mine = useQuery({
    queryKey: key,
    queryFn: ({ signal }) => api<{ invitations: MyInvitationRow[] }>("/api/me/invitations", { signal }).then((r) => r.invitations),
    initialData: initial,
  });
  const answer = useMutation({
    mutationFn: async (v: { id: string; accept: boolean }) =>
      v.accept ? api<Accepted>(`/api/me/invitations/${v.id}/accept`, { method: "POST" }) : api<undefined>(`/api/me/invitations/${v.id}/decline`, { method: "POST" }),
    onSuccess: (accepted) => {
      if (accepted) {
        // The new workspace joins the switcher (server-rendered) and opens.
        router.push(`/workspaces/${accepted.workspace.id}/kits`);
        router.refresh();
      }
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
  });
  if (mine.data.length === 0 && !answer.isError) return null;
  return (
    <section aria-labelledby="my-invitations-heading" className="mb-6 rounded-lg border border-steel/30 bg-white p-4">
      <h2 id="my-invitations-heading" className="mb-2 font-semibold">Invitations for you</h2>
      {answer.isError ? <ErrorNotice title="Could not answer the invitation" message={answer.error.message} /> : null}
      <ul aria-label="Invitations for you" className="divide-y divide-ink/10 text-sm">
        {mine.data.map((inv) => (
          <li key={inv.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <p>
              <span className="font-medium">{inv.workspace.name}</span>
              <span className="text-ink-muted"> · as {inv.role} · from {inv.invitedBy}</span>
            </p>
            <div className="flex gap-2">
              <Button onClick={() => answer.mutate({ id: inv.id, accept: true })} busy={answer.isPending && answer.variables.id === inv.id && answer.variables.accept} disabled={answer.isPending} aria-label={`Accept the invitation to ${inv.workspace.name}`}>Accept</Button>
              <Button variant="secondary" onClick={() => answer.mutate({ id: inv.id, accept: false })} busy={answer.isPending && answer.variables.id === inv.id && !answer.variables.accept} disabled={answer.isPending} aria-label={`Decline the invitation to ${inv.workspace.name}`}>Decline</Button>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}
