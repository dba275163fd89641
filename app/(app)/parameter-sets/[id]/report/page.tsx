import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { db } from "@/db/client";
import { getParameterSet } from "@/db/queries/parameter-sets";
import { listLightSources } from "@/db/queries/light-sources";
import { listPlans } from "@/db/queries/plans";
import { latestProvenance } from "@/db/queries/report";
import type { ResourceAccess } from "@/lib/contracts/access";
import { DomainError } from "@/lib/contracts/errors";
import { authorize, authorizeLab, getCaller } from "@/lib/auth/access";
import { ReportView } from "./_components/report-view";

export const metadata: Metadata = { title: "Report" };

/** A printable one-set report (viewer). Read on the server; the plot is computed in the browser. */
export default async function ReportPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const caller = await getCaller();
  if (!caller) redirect("/sign-in");
  let access: ResourceAccess<"parameter_set">;
  try {
    access = await authorize(caller, { kind: "parameter_set", id }, "viewer");
  } catch (error) {
    if (error instanceof DomainError) notFound();
    throw error;
  }
  const [set, fit, plans] = await Promise.all([
    getParameterSet(db, { access }),
    latestProvenance(db, { access }),
    listPlans(db, { access }),
  ]);
  if (!set) notFound();
  // The lab's light sources give the saved plan's lines their powers (the plan keeps names and wavelengths).
  const lightSources = await listLightSources(db, { access: await authorizeLab(caller, access.labId, "viewer") });
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
      lightSources={lightSources.map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm, powerW: l.powerW }))}
    />
  );
}
