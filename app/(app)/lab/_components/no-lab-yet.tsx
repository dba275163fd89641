"use client";

import { Button } from "@/components/ui/button";
import { describeError } from "@/lib/query/fetcher";
import { useCreatePersonalLab } from "@/lib/query/labs";

/**
 * What someone with no lab sees (joined by invitation and later removed, say): a way forward
 * either way, waiting for an invitation or making a personal lab of their own now.
 */
export function NoLabYet() {
  const create = useCreatePersonalLab();
  return (
    <section
      aria-labelledby="no-lab-heading"
      className="max-w-2xl space-y-3 rounded-lg border border-dashed border-ink/20 bg-paper-raised px-5 py-6"
    >
      <h2 id="no-lab-heading" className="text-lg font-semibold">
        You are not a member of any lab
      </h2>
      <p>
        A lab owner can invite you; the invitation arrives by e-mail. Or create a personal lab now: you own it, keep your parameter sets and
        measurements there, and can invite others to it.
      </p>
      <Button onClick={() => create.mutate()} disabled={create.isPending}>
        {create.isPending ? "Creating your lab…" : "Create a personal lab"}
      </Button>
      {create.isError ? (
        <p role="alert" className="text-sm text-ember">
          {describeError(create.error)}
        </p>
      ) : null}
    </section>
  );
}
