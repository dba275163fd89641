import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { getParameterSet } from "@/db/queries/parameter-sets";
import { listPlans } from "@/db/queries/plans";
import { latestProvenance } from "@/db/queries/report";
import { DomainError } from "@/lib/contracts/errors";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { getCaller } from "@/lib/auth/access";
import { ReportView } from "./_components/report-view";

export const metadata: Metadata = { title: "Report" };

/** A printable one-set report (viewer). Read on the server; the plot is computed in the browser. */
export default async function ReportPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const caller = await getCaller();
  if (!caller) redirect("/sign-in");
  let labId: string;
  let role: "owner" | "editor" | "viewer";
  try {
    const access = await requireParameterSetRole(caller, id, "viewer");
    labId = access.labId;
    role = access.role;
  } catch (error) {
    if (error instanceof DomainError) notFound();
    throw error;
  }
  const [set, fit, plans] = await Promise.all([
    getParameterSet({ id, labId, role }),
    latestProvenance({ setId: id, labId }),
    listPlans({ setId: id, labId }),
  ]);
  if (!set) notFound();
  return (
    <ReportView
      set={{
        id: set.id,
        name: set.name,
        version: set.version,
        labName: set.labName,
        description: set.description,
        updatedAt: set.updatedAt,
        params: set.params,
        viewState: set.viewState,
      }}
      fit={fit}
      plan={plans[0] ?? null}
    />
  );
}
