import type { Metadata } from "next";
import { ComingLater } from "@/components/shell/coming-later";

export const metadata: Metadata = { title: "Measurements" };

export default function MeasurementsPage() {
  return (
    <ComingLater
      title="Measurements"
      purpose="It will store your measured rotation spectra and lay them over a parameter set's prediction, so you can see where the electric-dipole and magnetic-dipole parts match the data."
    />
  );
}
