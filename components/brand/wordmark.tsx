/** The Gyrolux mark: a circle with a rotated polarisation bar, drawn inline so it needs no asset. */
export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <svg viewBox="0 0 24 24" width="22" height="22" aria-hidden="true" className="text-lux">
        <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="1.8" />
        <line x1="6" y1="15.5" x2="18" y2="8.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        <line x1="12" y1="3" x2="12" y2="21" stroke="currentColor" strokeWidth="1" strokeDasharray="1.5 2" opacity="0.6" />
      </svg>
      Gyrolux
    </span>
  );
}
