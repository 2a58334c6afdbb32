/** Sealpitch's mark: a flange face with four bolts and the gasket ring in brass. */
export function BrandMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <circle cx="16" cy="16" r="14" fill="#1d2739" />
      <circle cx="16" cy="16" r="8.5" fill="none" stroke="#c98d2b" strokeWidth="2.5" />
      <g fill="#f8e8c9">
        <circle cx="16" cy="4.6" r="1.8" />
        <circle cx="27.4" cy="16" r="1.8" />
        <circle cx="16" cy="27.4" r="1.8" />
        <circle cx="4.6" cy="16" r="1.8" />
      </g>
      <circle cx="16" cy="16" r="4" fill="#f3f5f8" />
    </svg>
  );
}
