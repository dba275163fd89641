"use client";

import Link from "next/link";
import { NewSetForm } from "@/components/parameter-sets/new-set-form";
import { Alert } from "@/components/ui/alert";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { useLabs } from "@/lib/query/labs";
import { roleAtLeast } from "@/lib/contracts/roles";

export function NewSet({ initialLabId }: { initialLabId?: string }) {
  const labs = useLabs();
  const editable = labs.data?.filter((lab) => roleAtLeast(lab.role, "editor")) ?? [];

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/parameter-sets" className="text-lux-dark underline underline-offset-4">
          Parameter sets
        </Link>
      </nav>
      <PageHeader
        title="New parameter set"
        lead="Prefilled with terbium gallium garnet at room temperature, 1 T and 10 mm. Change what differs for your sample."
      />
      {labs.isPending ? (
        <SkeletonRows label="Loading your labs" rows={6} />
      ) : labs.isError ? (
        <ErrorPanel error={labs.error} retry={() => void labs.refetch()} />
      ) : labs.data.length === 0 ? (
        <Alert tone="info" title="You are not a member of any lab">
          A parameter set belongs to a lab.{" "}
          <Link href="/lab" className="text-lux-dark underline underline-offset-4">
            Create a personal lab on the Lab page
          </Link>
          , or ask a lab owner to invite you.
        </Alert>
      ) : editable.length === 0 ? (
        <Alert tone="info" title="You cannot create parameter sets">
          Creating a set needs the editor or owner role in a lab. Ask your lab&apos;s owner to change your role.
        </Alert>
      ) : (
        <NewSetForm labs={editable} initialLabId={initialLabId} />
      )}
    </>
  );
}
