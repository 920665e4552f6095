import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ErrorNotice } from "@/components/ui/notice";
import { loadKitEditor } from "@/server/data/kit-editor";
import { pageWorkspace } from "@/server/data/page-access";
import { HttpError } from "@/server/http/errors";
import { KitEditor } from "./_components/kit-editor";

export const metadata: Metadata = { title: "Kit editor" };

export default async function KitPage({ params }: { params: Promise<{ workspaceId: string; kitId: string }> }) {
  const { workspaceId, kitId } = await params;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits/${kitId}`);
  const data = await loadKitEditor(access, kitId).catch((error: unknown) => {
    if (error instanceof HttpError && error.status === 404) notFound();
    throw error;
  });
  if (!data.ok) {
    return (
      <div className="flex flex-col gap-3">
        <Link href={`/workspaces/${access.workspace.id}/kits`} className="text-sm text-steel hover:underline">← All kits</Link>
        <h1 className="text-2xl font-semibold">{data.kit.name}</h1>
        <ErrorNotice title="This kit cannot be opened in the editor" message={data.message} />
      </div>
    );
  }
  return (
    <KitEditor
      init={{
        kit: {
          workspaceId: access.workspace.id,
          kitId: data.kit.id,
          name: data.kit.name,
          scale: data.kit.scale,
          notes: data.kit.notes,
          version: data.kit.version,
          updatedByName: data.kit.updatedByName,
          updatedAt: data.kit.updatedAt,
        },
        layout: data.layout,
        readOnly: data.readOnly,
        lengthUnit: data.lengthUnit,
        analysis: data.analysis,
      }}
    />
  );
}
