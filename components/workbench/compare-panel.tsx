"use client";

export function ComparePanel(_props: Record<string, unknown>) {
  return <p className="text-sm text-ink-soft">Not available yet.</p>;
}
