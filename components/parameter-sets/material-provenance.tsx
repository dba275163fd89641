import Link from "next/link";
import { asMaterialProvenance, describeMaterialProvenance } from "@/lib/contracts/materials";

/** "from material X, library version Y": shown in the version history for a set copied from the library. */
export function MaterialProvenanceSummary({ provenance }: { provenance: unknown }) {
  const material = asMaterialProvenance(provenance);
  if (!material) return null;
  return (
    <p className="mt-2 rounded-md border border-lux/30 bg-lux-light/40 px-3 py-2 text-sm" data-testid="material-provenance">
      <span className="rounded bg-lux-dark px-1.5 py-0.5 text-xs font-semibold text-white">library</span>{" "}
      {describeMaterialProvenance(material)} (<Link href="/materials">sources</Link>)
    </p>
  );
}
