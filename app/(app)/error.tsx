"use client";

import { ErrorPanel } from "@/components/ui/error-panel";

export default function AppError({ error, retry }: { error: unknown; retry: () => void }) {
  return (
    <div className="max-w-2xl">
      <ErrorPanel error={error} retry={retry} />
    </div>
  );
}
