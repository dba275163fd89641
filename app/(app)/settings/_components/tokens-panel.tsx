"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DateTime } from "@/components/ui/date-time";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { describeError } from "@/lib/query/fetcher";
import { LoadMore } from "@/components/ui/load-more";
import { useRevokeToken, useTokenPages } from "@/lib/query/tokens";
import type { TokenSummary } from "@/lib/contracts/tokens";
import { CreateTokenForm } from "./create-token-form";
import { noun } from "@/lib/text/plural";

export function TokensPanel() {
  const tokens = useTokenPages();
  const revoke = useRevokeToken();
  const [revoking, setRevoking] = useState<TokenSummary | null>(null);

  return (
    <section aria-labelledby="tokens-title" className="max-w-3xl">
      <h2 id="tokens-title" className="text-lg font-semibold">
        API tokens
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        Scripts and notebooks use a token to call the Gyrolux API as you, with your roles in your labs. Send it as{" "}
        <code className="rounded bg-paper-sunk px-1 font-mono text-xs">Authorization: Bearer glx_…</code>.
      </p>

      <CreateTokenForm />

      <div className="mt-6">
        {tokens.isPending ? (
          <SkeletonRows label="Loading your tokens" rows={3} />
        ) : tokens.isError ? (
          <ErrorPanel error={tokens.error} retry={() => void tokens.refetch()} />
        ) : tokens.items.length === 0 ? (
          <p className="text-sm text-ink-soft">You have no API tokens.</p>
        ) : (
          <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
            <table className="w-full text-sm">
              <caption className="sr-only">Your API tokens</caption>
              <thead className="border-b border-ink/10 bg-paper-sunk/70">
                <tr>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    Name
                  </th>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    Created
                  </th>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    Last used
                  </th>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-ink/10">
                {tokens.items.map((token) => (
                  <tr key={token.id}>
                    <td className="px-3 py-2 font-medium">{token.name}</td>
                    <td className="px-3 py-2">
                      <DateTime iso={token.createdAt} />
                    </td>
                    <td className="px-3 py-2">{token.lastUsedAt ? <DateTime iso={token.lastUsedAt} /> : "Never"}</td>
                    <td className="px-3 py-2 text-right">
                      <Button
                        variant="danger"
                        className="py-1"
                        onClick={() => {
                          revoke.reset();
                          setRevoking(token);
                        }}
                      >
                        Revoke<span className="sr-only"> {token.name}</span>
                      </Button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="px-3 pb-3">
              <LoadMore
                shown={tokens.items.length}
                hasMore={tokens.hasNextPage}
                loading={tokens.isFetchingNextPage}
                onMore={() => void tokens.fetchNextPage()}
                noun={noun("token")}
              />
            </div>
          </div>
        )}
      </div>

      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke the token “${revoking?.name ?? ""}”?`}
        confirmLabel="Revoke token"
        destructive
        pending={revoke.isPending}
        error={revoke.isError ? describeError(revoke.error) : null}
        onCancel={() => setRevoking(null)}
        onConfirm={() => {
          if (revoking) revoke.mutate(revoking.id, { onSuccess: () => setRevoking(null) });
        }}
      >
        Scripts using it stop working at once. This cannot be undone; you can create a new token.
      </ConfirmDialog>
    </section>
  );
}
