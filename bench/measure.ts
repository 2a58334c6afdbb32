/** Median wall time of a function over n runs after a warm-up, ms. */
export function medianMs(fn: () => unknown, n: number, warmup = 10): number {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(n / 2)];
}

export function printMedian(suite: string, label: string, ms: number, n: number): void {
  console.log(`${suite}: ${label.padEnd(52)} median ${ms.toFixed(2)} ms  (n=${n})`);
}
