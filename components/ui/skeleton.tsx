/** Grey bars where content will appear; hidden from screen readers, which get the label instead. */
export function SkeletonRows({ rows = 5, label }: { rows?: number; label: string }) {
  return (
    <div role="status" aria-live="polite" className="space-y-2">
      <span className="sr-only">{label}</span>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} aria-hidden="true" className="h-10 animate-pulse rounded bg-paper-sunk" />
      ))}
    </div>
  );
}
