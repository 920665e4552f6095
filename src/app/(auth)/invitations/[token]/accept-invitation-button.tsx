"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorNotice } from "@/components/ui/notice";
import { api } from "@/lib/api-client";

export function AcceptInvitationButton({ token }: { token: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const onAccept = async () => {
    setBusy(true);
    setFailure(null);
    try {
      const joined = await api<{ workspace: { id: string } }>("/api/invitations/accept", { method: "POST", body: { token } });
      router.replace(`/workspaces/${joined.workspace.id}/members`);
      router.refresh();
    } catch (error) {
      setFailure(error instanceof Error ? error.message : "Could not accept the invitation.");
      setBusy(false);
    }
  };
  return (
    <div className="flex flex-col gap-3">
      {failure ? <ErrorNotice title="Could not accept the invitation" message={failure} /> : null}
      <Button type="button" onClick={onAccept} busy={busy}>Accept and join</Button>
    </div>
  );
}
