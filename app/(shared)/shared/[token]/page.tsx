import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Wordmark } from "@/components/brand/wordmark";
import { db } from "@/db/client";
import { findSharedSet } from "@/db/queries/share-links";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";
import { SharedWorkbench } from "./_components/shared-workbench";

// The link is a secret: search engines must not index or follow it, and no cache may keep it.
export const metadata: Metadata = { title: "Shared parameter set", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

export default async function SharedSetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const set = isLinkSecret(token) ? await findSharedSet(db, { tokenHash: hashToken(token) }) : null;
  if (!set) notFound();
  return (
    <div className="min-h-screen">
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-ink/10 px-4 py-3 sm:px-8">
        <Wordmark className="text-lg" />
        <p className="text-sm text-ink-soft">A read-only view shared with you. Nothing you change here is saved.</p>
      </header>
      <main id="main" className="px-4 py-6 sm:px-8">
        <SharedWorkbench set={set} />
      </main>
    </div>
  );
}
