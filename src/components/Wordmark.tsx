/** Kerf's mark: a saw-cut slot between two boards. */
export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-bold tracking-tight ${className}`}>
      <svg viewBox="0 0 32 32" className="size-7" aria-hidden>
        <rect width="32" height="32" rx="6" fill="#1f2a2c" />
        <path d="M8 6v20M8 16l10-10M8 16l10 10" stroke="#f2b33d" strokeWidth="3.5" strokeLinecap="round" fill="none" />
        <path d="M21 6v20" stroke="#e9e3d6" strokeWidth="1.5" strokeDasharray="2 2" />
      </svg>
      Kerf
    </span>
  );
}
