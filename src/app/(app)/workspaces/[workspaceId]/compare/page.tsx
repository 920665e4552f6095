import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ErrorNotice } from "@/components/ui/notice";
import type { Comparison } from "@/contracts/compare";
import { loadComparison } from "@/server/data/compare";
import { pageWorkspace } from "@/server/data/page-access";
import { getPreferences } from "@/server/data/preferences";
import { HttpError } from "@/server/http/errors";
import { ComparePanel } from "./_components/compare-panel";

export const metadata: Metadata = { title: "Compare kits" };

// /workspaces/{w}/compare?items=A,B@3: the comparison's own address, which any member can open.
export default async function ComparePage({ params, searchParams }: { params: Promise<{ workspaceId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { workspaceId } = await params;
  const raw = (await searchParams).items;
  const items = typeof raw === "string" ? raw : null;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/compare${items ? `?items=${encodeURIComponent(items)}` : ""}`);
  let comparison: Comparison;
  try {
    comparison = await loadComparison(access.workspace.id, items);
  } catch (error) {
    if (error instanceof HttpError && error.status === 404) notFound();
    if (error instanceof HttpError && error.status === 422) {
      return (
        <div className="flex max-w-2xl flex-col gap-3">
          <h1 className="text-xl font-semibold">Compare kits</h1>
          <ErrorNotice title="This comparison cannot be opened" message={error.fields?.[0]?.message ?? error.message} />
          <p className="text-sm">Pick two to four kits in the <Link className="text-steel underline" href={`/workspaces/${access.workspace.id}/kits`}>library</Link> and choose Compare.</p>
        </div>
      );
    }
    throw error;
  }
  const { lengthUnit } = await getPreferences(access.user.id);
  return <ComparePanel workspaceId={access.workspace.id} comparison={comparison} lengthUnit={lengthUnit} />;
}
