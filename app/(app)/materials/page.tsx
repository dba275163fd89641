import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { MATERIALS, MATERIAL_LIBRARY_VERSION } from "@/lib/materials/library";
import { MaterialCard } from "./_components/material-card";

export const metadata: Metadata = { title: "Materials" };

const LEAD =
  `Cited materials to start a parameter set from (library version ${MATERIAL_LIBRARY_VERSION}). ` +
  "Every value names its source; values fitted or chosen here say so.";

export default function MaterialsPage() {
  return (
    <>
      <PageHeader title="Materials" lead={LEAD} />
      <ul className="space-y-6">
        {MATERIALS.map((m) => (
          <li key={m.id}>
            <MaterialCard material={m} />
          </li>
        ))}
      </ul>
    </>
  );
}
