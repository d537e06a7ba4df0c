/** Gaitloom's mark: three offset stance bars, as a gait diagram draws them. */
export function Mark({ className = "h-7 w-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="7" className="fill-accent" />
      <g className="fill-canvas">
        <rect x="6" y="8" width="12" height="4" rx="2" />
        <rect x="14" y="14" width="12" height="4" rx="2" />
        <rect x="8" y="20" width="14" height="4" rx="2" />
      </g>
    </svg>
  );
}
