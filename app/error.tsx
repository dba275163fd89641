"use client";

import { ErrorPanel } from "@/components/ui/error-panel";

export default function RootError({ error, retry }: { error: unknown; retry: () => void }) {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <ErrorPanel error={error} retry={retry} />
    </main>
  );
}
