/** Isobath's mark: three depth contours, the deepest in brass. */
export function Logo({ className = '' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden focusable="false">
      <rect width="32" height="32" rx="4" fill="#10242f" />
      <g fill="none" strokeWidth="1.6">
        <path d="M4 10c5-3 9 3 14 0s9-2 10 0" stroke="#8fc3cb" />
        <path d="M4 16c5-3 9 3 14 0s9-2 10 0" stroke="#cfe3e6" />
        <path d="M4 22c5-3 9 3 14 0s9-2 10 0" stroke="#c9a25e" />
      </g>
    </svg>
  );
}
