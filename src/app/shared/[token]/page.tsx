import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Providers } from "@/components/providers";
import { parseLayout } from "@/contracts/layout";
import { serverFigures } from "@/server/data/kit-editor";
import { openShareLink, type OpenShareLink } from "@/server/data/share-links";
import { readSharedKit } from "@/server/data/shared-kit";
import { HttpError } from "@/server/http/errors";
import { SharedKitView } from "./_components/shared-kit-view";

// Outside the signed-in app: anyone holding the link reads the kit; search engines are asked to stay out
// (this meta tag, and the X-Robots-Tag header next.config.ts sets on /shared/*).
export const metadata: Metadata = { title: "Shared kit", robots: { index: false, follow: false, nocache: true }, referrer: "no-referrer" };
export const dynamic = "force-dynamic";

async function linkOrNotFound(token: string): Promise<OpenShareLink> {
  try {
    return await openShareLink(token);
  } catch (error) {
    if (error instanceof HttpError && error.status === 404) notFound();
    throw error;
  }
}

export default async function SharedKitPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = await linkOrNotFound(token);
  const shared = await readSharedKit(link);
  const parsed = parseLayout(shared.layout);
  if (!parsed.ok) notFound();
  const analysis = await serverFigures(parsed.layout);
  return (
    <Providers>
      <div className="flex h-dvh min-h-[44rem] flex-col">
        <main className="flex min-h-0 flex-1 flex-col">
          <SharedKitView
            token={token}
            shared={{ kitName: shared.kitName, workspaceName: shared.workspaceName, scale: shared.scale, revision: shared.revision, pinned: shared.pinned, allowComments: shared.allowComments, expiresAt: shared.expiresAt }}
            layout={parsed.layout}
            analysis={analysis}
          />
        </main>
        <footer className="border-t border-ink/10 px-4 py-2 text-center text-xs text-ink-muted">
          Shared read-only from Knucklebench. Strength figures are estimates. A design aid for models — not a sign-off for full-size or road vehicles.
        </footer>
      </div>
    </Providers>
  );
}
