/** Trailbin's mark: a walked trail through three numbered stops. */
export function Logo({ className = "h-9 w-9" }: { className?: string }) {
  return (
    <svg viewBox="0 0 40 40" className={className} aria-hidden="true">
      <rect width="40" height="40" rx="9" fill="#0e6b58" />
      <path
        d="M8 31 L8 20 L20 20 L20 9 L32 9"
        fill="none"
        stroke="#f7f5f0"
        strokeWidth="3"
        strokeLinecap="round"
        strokeLinejoin="round"
        strokeDasharray="1 5"
      />
      <circle cx="8" cy="31" r="4" fill="#f7f5f0" />
      <circle cx="20" cy="20" r="4" fill="#f7f5f0" />
      <circle cx="32" cy="9" r="4" fill="#f7f5f0" />
    </svg>
  );
}
