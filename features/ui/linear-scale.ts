/**
 * Linear scales for the charts and the heat-map colours: a number-to-number map with "nice"
 * axis ticks, and a piecewise colour ramp between hex stops. Small and dependency-free so that
 * the Layout desk's first load does not carry a charting library (d3-scale with its colour,
 * format and time packages was about 14 kB gzip). The arithmetic follows d3-scale 4 and
 * d3-array 3 step for step, so the charts and heat colours are unchanged to the last digit:
 * tests/features/ui/linear-scale.test.ts compares both on many domains.
 */

/** A map from `domain` onto `range`, straight through (no clamping), with its axis ticks. */
export interface LinearScale {
  (x: number): number;
  /** About `count` round values inside the domain, steps of 1, 2 or 5 times a power of ten. */
  ticks(count?: number): number[];
}

/** t in [0, 1] across [a, b]; 0.5 for an empty interval (NaN when an end is NaN). */
function unitPosition(a: number, b: number): (x: number) => number {
  const width = b - a;
  if (!width) {
    const mid = Number.isNaN(width) ? NaN : 0.5;
    return () => mid;
  }
  return (x) => (x - a) / width;
}

const between = (a: number, b: number, t: number) => a * (1 - t) + b * t;

export function linearScale(domain: [number, number], range: [number, number]): LinearScale {
  let [d0, d1] = domain;
  let [r0, r1] = range;
  if (d1 < d0) [d0, d1, r0, r1] = [d1, d0, r1, r0];
  const t = unitPosition(d0, d1);
  const scale = ((x: number) => between(r0, r1, t(x))) as LinearScale;
  scale.ticks = (count = 10) => niceTicks(domain[0], domain[1], count);
  return scale;
}

// Where the step's leading digit rounds up: √50 → 10, √10 → 5, √2 → 2 (geometric midpoints).
const TO_TEN = Math.sqrt(50);
const TO_FIVE = Math.sqrt(10);
const TO_TWO = Math.sqrt(2);

/**
 * First and last tick as integer multiples of the step, and the step: a positive `step` means
 * ticks are `k × step`, a negative one means `k / −step` (exact decimals for steps below one).
 */
function tickRun(lo: number, hi: number, count: number): [number, number, number] {
  const raw = (hi - lo) / Math.max(0, count);
  const power = Math.floor(Math.log10(raw));
  const mantissa = raw / Math.pow(10, power);
  const factor = mantissa >= TO_TEN ? 10 : mantissa >= TO_FIVE ? 5 : mantissa >= TO_TWO ? 2 : 1;
  let first: number;
  let last: number;
  let step: number;
  if (power < 0) {
    const perUnit = Math.pow(10, -power) / factor;
    first = Math.round(lo * perUnit);
    last = Math.round(hi * perUnit);
    if (first / perUnit < lo) first++;
    if (last / perUnit > hi) last--;
    step = -perUnit;
  } else {
    step = Math.pow(10, power) * factor;
    first = Math.round(lo / step);
    last = Math.round(hi / step);
    if (first * step < lo) first++;
    if (last * step > hi) last--;
  }
  // Too few for one tick at a count of 0.5 to 2: try twice as many.
  if (last < first && 0.5 <= count && count < 2) return tickRun(lo, hi, count * 2);
  return [first, last, step];
}

function niceTicks(start: number, stop: number, count: number): number[] {
  if (!(count > 0)) return [];
  if (start === stop) return [start];
  const descending = stop < start;
  const [first, last, step] = descending ? tickRun(stop, start, count) : tickRun(start, stop, count);
  if (!(last >= first)) return [];
  const n = last - first + 1;
  const at = (k: number) => (step < 0 ? k / -step : k * step);
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = at(descending ? last - i : first + i);
  return out;
}

/** "#rgb" or "#rrggbb" as channels 0–255. */
function hexChannels(hex: string): [number, number, number] {
  const h = hex.replace(/^#/, "");
  const full = h.length === 3 ? [...h].map((c) => c + c).join("") : h;
  if (!/^[0-9a-f]{6}$/i.test(full)) throw new Error(`not a hex colour: ${hex}`);
  const v = parseInt(full, 16);
  return [(v >> 16) & 255, (v >> 8) & 255, v & 255];
}

const channel = (v: number) => Math.max(0, Math.min(255, Math.round(v) || 0));

/**
 * A colour for every value: linear in red, green and blue between consecutive `stops`
 * (ascending values), clamped to the first and last stop outside them. Returns "rgb(r, g, b)".
 */
export function colourRamp(stops: { value: number; colour: string }[]): (value: number) => string {
  if (stops.length < 2) throw new Error("a colour ramp needs two stops");
  const values = stops.map((s) => s.value);
  const rgb = stops.map((s) => hexChannels(s.colour));
  const segments = values.slice(1).map((v, i) => unitPosition(values[i], v));
  const lo = values[0];
  const hi = values[values.length - 1];
  return (value) => {
    if (Number.isNaN(value)) return "rgb(0, 0, 0)";
    const x = Math.max(lo, Math.min(hi, value));
    // The segment whose start is the last stop at or below x (the final segment at the top end).
    let i = 0;
    while (i < segments.length - 1 && values[i + 1] <= x) i++;
    const t = segments[i](x);
    const [a, b] = [rgb[i], rgb[i + 1]];
    return `rgb(${channel(a[0] + t * (b[0] - a[0]))}, ${channel(a[1] + t * (b[1] - a[1]))}, ${channel(a[2] + t * (b[2] - a[2]))})`;
  };
}
