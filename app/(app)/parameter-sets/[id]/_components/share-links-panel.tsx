"use client";

import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DateTime } from "@/components/ui/date-time";
import { LoadMore } from "@/components/ui/load-more";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { describeError } from "@/lib/query/fetcher";
import { formatDateTime } from "@/lib/text/date-time";
import { useCreateShareLink, useRevokeShareLink, useShareLinks, type ShareLinkSummary } from "@/lib/query/sharing";
import { noun } from "@/lib/text/plural";

/** Editors make read-only links to this set for people outside the lab, and revoke them. */
export function ShareLinksPanel({ setId }: { setId: string }) {
  const links = useShareLinks(setId);
  const create = useCreateShareLink(setId);
  const revoke = useRevokeShareLink(setId);
  const [revoking, setRevoking] = useState<ShareLinkSummary | null>(null);

  return (
    <section aria-labelledby="share-title" className="mt-10 max-w-3xl">
      <h2 id="share-title" className="text-lg font-semibold">
        Read-only share links
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        Anyone with such a link sees this set&apos;s workbench (plots, markers, exports), read-only and without signing in — nothing else of
        the lab.
      </p>
      <Button className="mt-3" variant="secondary" disabled={create.isPending} onClick={() => create.mutate()}>
        {create.isPending ? "Making a link…" : "Make a share link"}
      </Button>
      {create.isError ? (
        <p role="alert" className="mt-2 text-sm text-ember">
          {describeError(create.error)}
        </p>
      ) : null}
      {create.data ? (
        <div className="mt-3">
          <Alert tone="warning" title="Copy the link now">
            <p>It is shown only this once: Gyrolux keeps only a fingerprint of it.</p>
            <label htmlFor="new-share-link" className="sr-only">
              New share link
            </label>
            <input
              id="new-share-link"
              readOnly
              value={create.data.url}
              onFocus={(e) => e.target.select()}
              className={`mt-2 font-mono text-xs ${INPUT_CLASS}`}
            />
          </Alert>
        </div>
      ) : null}
      {links.isSuccess && links.items.length > 0 ? (
        <>
          <ul className="mt-3 divide-y divide-ink/10 rounded-lg border border-ink/10 bg-paper-raised">
            {links.items.map((link) => (
              <li key={link.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                <span>
                  Made <DateTime iso={link.createdAt} />
                  {link.createdBy ? ` by ${link.createdBy.name}` : ""}
                </span>
                <Button
                  variant="danger"
                  className="py-1"
                  onClick={() => {
                    revoke.reset();
                    setRevoking(link);
                  }}
                >
                  Revoke<span className="sr-only"> the link made {formatDateTime(link.createdAt)}</span>
                </Button>
              </li>
            ))}
          </ul>
          <LoadMore
            shown={links.items.length}
            hasMore={links.hasNextPage}
            loading={links.isFetchingNextPage}
            onMore={() => void links.fetchNextPage()}
            noun={noun("link")}
          />
        </>
      ) : links.isSuccess ? (
        <p className="mt-3 text-sm text-ink-soft">No live share links.</p>
      ) : null}
      <ConfirmDialog
        open={revoking !== null}
        title="Revoke this share link?"
        confirmLabel="Revoke link"
        destructive
        pending={revoke.isPending}
        error={revoke.isError ? describeError(revoke.error) : null}
        onCancel={() => setRevoking(null)}
        onConfirm={() => {
          if (!revoking) return;
          revoke.mutate(revoking.id, {
            onSuccess: () => {
              // The "copy the link now" box must not keep offering a link that no longer works.
              if (create.data?.item.id === revoking.id) create.reset();
              setRevoking(null);
            },
          });
        }}
      >
        Whoever has the link loses access at once. You can make a new link later.
      </ConfirmDialog>
    </section>
  );
}
