/**
 * A static drawing for the landing page: a 12-bolt flange face with the gasket band shaded by
 * an illustrative stress ripple (high at each bolt, low at mid-span). Decorative only.
 */
export function FlangeIllustration() {
  const bolts = 12;
  const segments = 144;
  const cx = 160;
  const cy = 160;
  const arcs = Array.from({ length: segments }, (_, i) => {
    const a0 = (i / segments) * 2 * Math.PI;
    const a1 = ((i + 1) / segments) * 2 * Math.PI;
    const phase = Math.cos(((i + 0.5) / segments) * bolts * 2 * Math.PI + Math.PI);
    const shade = 0.35 + 0.65 * (0.5 + 0.5 * phase);
    const r = 96;
    const p = (a: number) => `${(cx + r * Math.sin(a)).toFixed(2)} ${(cy - r * Math.cos(a)).toFixed(2)}`;
    return (
      <path
        key={i}
        d={`M ${p(a0)} A ${r} ${r} 0 0 1 ${p(a1)}`}
        stroke={`rgba(201, 141, 43, ${shade.toFixed(3)})`}
        strokeWidth="18"
        fill="none"
      />
    );
  });
  return (
    <svg
      viewBox="0 0 320 320"
      className="h-auto w-full max-w-sm"
      role="img"
      aria-label="A twelve-bolt flange with the gasket stress shaded between bolts"
    >
      <circle cx={cx} cy={cy} r="150" fill="#1d2739" />
      <circle cx={cx} cy={cy} r="124" fill="none" stroke="#4c5d7d" strokeDasharray="3 5" />
      {arcs}
      {Array.from({ length: bolts }, (_, i) => {
        const a = ((i + 0.5) / bolts) * 2 * Math.PI;
        return (
          <circle
            key={i}
            cx={cx + 124 * Math.sin(a)}
            cy={cy - 124 * Math.cos(a)}
            r="9"
            fill="#f3f5f8"
            stroke="#98a6bf"
          />
        );
      })}
      <circle cx={cx} cy={cy} r="74" fill="#f3f5f8" />
    </svg>
  );
}
