/**
 * The Pareto front of the pattern search: a candidate stays unless another has no more bolts, a
 * size no larger and a seating margin no smaller, and is better in one of them. Ranked by bolt
 * count, then size, then seating margin (largest first), then material and offset as searched.
 */
interface Ranked {
  boltCount: number;
  nominalDiameterMm: number;
  seating: { margin: number };
}

function dominates(a: Ranked, b: Ranked): boolean {
  const noWorse =
    a.boltCount <= b.boltCount &&
    a.nominalDiameterMm <= b.nominalDiameterMm &&
    a.seating.margin >= b.seating.margin;
  const better =
    a.boltCount < b.boltCount ||
    a.nominalDiameterMm < b.nominalDiameterMm ||
    a.seating.margin > b.seating.margin;
  return noWorse && better;
}

export function paretoFront<T extends Ranked>(items: readonly T[]): T[] {
  const front = items.filter((c) => !items.some((o) => o !== c && dominates(o, c)));
  return front
    .map((c, i) => ({ c, i }))
    .sort(
      (x, y) =>
        x.c.boltCount - y.c.boltCount ||
        x.c.nominalDiameterMm - y.c.nominalDiameterMm ||
        y.c.seating.margin - x.c.seating.margin ||
        x.i - y.i,
    )
    .map((x) => x.c);
}
