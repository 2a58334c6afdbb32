/**
 * Min-max decimation of a sampled curve for drawing: within each of `columns` equal slices of
 * the x range the lowest and the highest sample are kept, in their original order. The drawn
 * line keeps every peak and every trough (the global minimum and maximum exactly) with at most
 * 2 points per pixel column, however many samples the core returned.
 *
 * Example: 6 144 samples over 460 columns → at most 920 points.
 */
export function decimateMinMax(
  xs: readonly number[],
  ys: readonly number[],
  x0: number,
  x1: number,
  columns: number,
): { xs: number[]; ys: number[] } {
  const n = Math.min(xs.length, ys.length);
  if (n <= 2 * columns || !(x1 > x0)) return { xs: xs.slice(0, n), ys: ys.slice(0, n) };
  const outX: number[] = [];
  const outY: number[] = [];
  const width = (x1 - x0) / columns;
  let col = -1;
  let lo = -1,
    hi = -1;
  const flush = () => {
    if (lo < 0) return;
    const a = Math.min(lo, hi),
      b = Math.max(lo, hi);
    outX.push(xs[a]);
    outY.push(ys[a]);
    if (b !== a) {
      outX.push(xs[b]);
      outY.push(ys[b]);
    }
  };
  for (let i = 0; i < n; i++) {
    const c = Math.min(columns - 1, Math.max(0, Math.floor((xs[i] - x0) / width)));
    if (c !== col) {
      flush();
      col = c;
      lo = hi = i;
      continue;
    }
    if (ys[i] < ys[lo]) lo = i;
    if (ys[i] > ys[hi]) hi = i;
  }
  flush();
  return { xs: outX, ys: outY };
}
