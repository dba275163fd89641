"use client";

import { useQuery } from "@tanstack/react-query";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { Button } from "./button";
import { NotFoundContent } from "./not-found-content";

interface Health {
  status: string;
  database: string;
}

// Server errors reach the browser without their message in production, so ask /api/health
// whether the database is the cause instead of guessing.
async function fetchHealth(): Promise<Health> {
  const response = await fetch("/api/health", { headers: { Accept: "application/json" } });
  return (await response.json()) as Health;
}

/**
 * A failed load. A 404 (an unknown id, or a set of a lab the caller is not in: the API answers both
 * alike) is not "something went wrong" and no retry will fix it, so it gets the not-found page.
 */
export function ErrorPanel({ error, retry }: { error: unknown; retry?: () => void }) {
  if (error instanceof RequestError && error.status === 404) return <NotFoundContent />;
  return <LoadErrorPanel error={error} retry={retry} />;
}

function LoadErrorPanel({ error, retry }: { error: unknown; retry?: () => void }) {
  const health = useQuery({ queryKey: ["health"], queryFn: fetchHealth, retry: false, staleTime: 0 });
  const databaseDown = (error instanceof RequestError && error.code === "db_unavailable") || health.data?.database === "down";

  const message = databaseDown
    ? "The database is not reachable right now, so nothing can be loaded or saved. Your stored data is not affected; try again in a minute."
    : error instanceof RequestError
      ? describeError(error)
      : "This page could not be shown because of an unexpected error.";

  return (
    <div role="alert" className="rounded-lg border border-ember bg-ember-light px-5 py-4">
      <h2 className="font-semibold">{databaseDown ? "Database unavailable" : "Something went wrong"}</h2>
      <p className="mt-1 text-sm">{message}</p>
      {retry ? (
        <Button variant="secondary" className="mt-4" onClick={retry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}

/** The body of an error.tsx: the panel, in a <main> of its own where no layout provides one. */
export function RouteError({ error, retry, standalone = false }: { error: unknown; retry: () => void; standalone?: boolean }) {
  const panel = <ErrorPanel error={error} retry={retry} />;
  return standalone ? <main className="mx-auto max-w-xl px-6 py-24">{panel}</main> : <div className="max-w-2xl">{panel}</div>;
}
