"use client";

import { RouteError } from "@/components/ui/error-panel";

export default function AppError(props: { error: unknown; retry: () => void }) {
  return <RouteError {...props} />;
}
