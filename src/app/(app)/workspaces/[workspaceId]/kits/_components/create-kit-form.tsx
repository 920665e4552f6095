"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { KIT_SCALES, kitCreateFields, type KitCreateFields, type KitDetail } from "@/contracts/kits";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function CreateKitForm({ workspaceId, onCreated }: { workspaceId: string; onCreated?: (kit: KitDetail) => void }) {
  const queryClient = useQueryClient();
  const { register, handleSubmit, formState, reset, setError } = useForm<KitCreateFields>({
    resolver: zodResolver(kitCreateFields),
    defaultValues: { name: "", scale: "1:10", notes: "" },
  });
  const create = useMutation({
    mutationFn: (values: KitCreateFields) => api<{ kit: KitDetail }>(`/api/workspaces/${workspaceId}/kits`, { method: "POST", body: values }),
    onSuccess: ({ kit }) => {
      reset();
      onCreated?.(kit);
      return queryClient.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) });
    },
    onError: (error) => {
      // Field errors from the server land on the same inputs as the client's own.
      if (error instanceof ApiError) for (const f of error.fields) if (f.path === "name" || f.path === "scale" || f.path === "notes") setError(f.path, { message: f.message });
    },
  });

  return (
    <form onSubmit={handleSubmit((v) => create.mutate(v))} noValidate className="flex flex-col gap-3" aria-label="New kit">
      {create.isError && !(create.error instanceof ApiError && create.error.fields.length) ? (
        <ErrorNotice title="Could not create the kit" message={create.error.message} />
      ) : null}
      <TextField id="kit-name" label="Name" placeholder="e.g. Front corner, 4 mm neck" error={formState.errors.name?.message} {...register("name")} />
      <SelectField id="kit-scale" label="Scale" error={formState.errors.scale?.message} {...register("scale")}>
        {KIT_SCALES.map((s) => <option key={s} value={s}>{s}</option>)}
      </SelectField>
      <TextAreaField id="kit-notes" label="Notes" error={formState.errors.notes?.message} {...register("notes")} />
      <Button type="submit" busy={create.isPending}>Create kit</Button>
    </form>
  );
}
