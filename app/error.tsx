"use client";

import { RouteError } from "@/components/ui/error-panel";

export default function RootError(props: { error: unknown; retry: () => void }) {
  return <RouteError {...props} standalone />;
}
