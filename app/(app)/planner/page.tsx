import type { Metadata } from "next";
import { ComingLater } from "@/components/shell/coming-later";

export const metadata: Metadata = { title: "Planner" };

export default function PlannerPage() {
  return (
    <ComingLater
      title="Planner"
      purpose="It will help you choose the wavelengths, fields and temperatures at which a measurement best separates the magnetic-dipole part from the electric-dipole part."
    />
  );
}
