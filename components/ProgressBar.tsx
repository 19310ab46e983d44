/**
 * A bar filled to value/max. The fill is an SVG width, not a style attribute: the pages' CSP allows
 * no inline styles, and a server-rendered style="width:…" would be dropped by the browser.
 */
export function ProgressBar({
  value,
  max,
  label,
  className = "",
}: {
  value: number;
  max: number;
  label: string;
  className?: string;
}) {
  const percent = max > 0 ? Math.min(100, Math.max(0, (100 * value) / max)) : 100;
  return (
    <div
      className={`h-3 overflow-hidden rounded-full bg-paper-sunk ${className}`}
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={max}
      aria-valuenow={value}
    >
      <svg className="block h-full w-full" viewBox="0 0 100 1" preserveAspectRatio="none" aria-hidden="true">
        <rect width={percent} height={1} className="fill-trail" />
      </svg>
    </div>
  );
}
