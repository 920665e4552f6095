"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { workspaceCreateBody, type WorkspaceSummary } from "@/contracts/workspaces";
import { api } from "@/lib/api-client";

type Fields = z.infer<typeof workspaceCreateBody>;

export function NewWorkspaceForm() {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Fields>({ resolver: zodResolver(workspaceCreateBody) });
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit(async (v) => {
        setFailure(null);
        try {
          const { workspace } = await api<{ workspace: WorkspaceSummary }>("/api/workspaces", { method: "POST", body: v });
          await api(`/api/workspaces/${workspace.id}/activate`, { method: "POST" });
          router.push(`/workspaces/${workspace.id}/kits`);
          router.refresh();
        } catch (e) {
          setFailure((e as Error).message);
        }
      })}
    >
      <h1 className="text-lg font-semibold">New workspace</h1>
      <p className="text-sm text-ink-muted">A workspace holds kits and the people who work on them. You will be its owner.</p>
      {failure ? <ErrorNotice title="Could not create the workspace" message={failure} /> : null}
      <TextField id="workspace-name" label="Name" error={formState.errors.name?.message} {...register("name")} />
      <Button type="submit" busy={formState.isSubmitting}>Create workspace</Button>
    </form>
  );
}
