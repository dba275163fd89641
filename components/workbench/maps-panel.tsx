"use client";

export function MapsPanel(_props: Record<string, unknown>) {
  return <p className="text-sm text-ink-soft">Not available yet.</p>;
}
