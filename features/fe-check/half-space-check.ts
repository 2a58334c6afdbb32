/**
 * Check of the FE engine against a published closed form: an elastic half-space under a uniform
 * pressure p on a circle of radius a (Boussinesq; Timoshenko & Goodier, Theory of Elasticity,
 * 3rd ed., §138; Johnson, Contact Mechanics, §3.4). Surface deflection
 *   r ≤ a: w = 4(1 − ν²)·p·a/(π·E) · E(r/a)
 *   r > a: w = 4(1 − ν²)·p·r/(π·E) · [E(a/r) − (1 − a²/r²)·K(a/r)]
 * with K, E the complete elliptic integrals of the first and second kind (modulus k). The FE
 * model is a cylinder of radius and height 20·a, fixed at the bottom; far-field effects of the
 * finite body cancel in deflection differences w(0) − w(r). Pure deck writer and closed form.
 */

/** Complete elliptic integrals K(k), E(k) by the arithmetic–geometric mean. */
export function ellipticKE(k: number): { K: number; E: number } {
  let a = 1;
  let b = Math.sqrt(1 - k * k);
  let c = k;
  let sum = (c * c) / 2;
  let pow = 0.5;
  for (let i = 0; i < 40 && Math.abs(c) > 1e-16; i++) {
    const an = (a + b) / 2;
    c = (a - b) / 2;
    b = Math.sqrt(a * b);
    a = an;
    pow *= 2;
    sum += pow * c * c;
  }
  const K = Math.PI / (2 * a);
  return { K, E: K * (1 - sum) };
}

/** Surface deflection of a half-space under uniform pressure on a circle, mm. */
export function boussinesqSurfaceDeflectionMm(
  rMm: number,
  aMm: number,
  pMpa: number,
  eMpa: number,
  nu: number,
): number {
  const f = (4 * (1 - nu * nu) * pMpa) / (Math.PI * eMpa);
  if (rMm <= aMm) return f * aMm * (rMm >= aMm ? 1 : ellipticKE(rMm / aMm).E);
  const k = aMm / rMm;
  const { K, E } = ellipticKE(k);
  return f * rMm * (E - (1 - k * k) * K);
}

export interface HalfSpaceSpec {
  loadRadiusMm: number;
  pressureMpa: number;
  modulusMpa: number;
  poisson: number;
  /** Element size under the load, mm. */
  elementSizeMm: number;
}

export interface HalfSpaceMesh {
  rs: number[];
  zs: number[];
  node: (i: number, j: number) => number;
}

function gradedFrom(h: number, end: number, fineEnd: number): number[] {
  const out = [0];
  let x = 0;
  let s = h;
  while (x < end - 1e-9) {
    x = Math.min(x + s, end);
    if (end - x < 0.3 * s) x = end;
    out.push(x);
    if (x > fineEnd) s *= 1.2;
  }
  return out;
}

export function buildHalfSpaceMesh(spec: HalfSpaceSpec): HalfSpaceMesh {
  const a = spec.loadRadiusMm;
  const h = spec.elementSizeMm;
  const inner = Array.from({ length: Math.round(a / h) + 1 }, (_, i) => (a * i) / Math.round(a / h));
  const outer = gradedFrom(h, 19 * a, 1.5 * a).map((x) => a + x);
  const rs = [...inner, ...outer.slice(1)];
  const depth = gradedFrom(h, 20 * a, 1.5 * a);
  const zs = depth.map((z) => -z).reverse();
  const nr = rs.length;
  return { rs, zs, node: (i, j) => 1 + j * nr + i };
}

export function writeHalfSpaceDeck(spec: HalfSpaceSpec, mesh: HalfSpaceMesh): string {
  const { rs, zs, node } = mesh;
  const nr = rs.length;
  const L = ["** Sealpitch half-space check (features/fe-check)", "*NODE, NSET=NALL"];
  zs.forEach((z, j) =>
    rs.forEach((r, i) => L.push(`${node(i, j)}, ${r.toPrecision(12)}, ${z.toPrecision(12)}`)),
  );
  L.push("*ELEMENT, TYPE=CAX4, ELSET=EALL");
  let el = 1;
  for (let j = 0; j < zs.length - 1; j++)
    for (let i = 0; i < nr - 1; i++)
      L.push(`${el++}, ${node(i, j)}, ${node(i + 1, j)}, ${node(i + 1, j + 1)}, ${node(i, j + 1)}`);
  L.push(
    "*MATERIAL, NAME=M",
    "*ELASTIC",
    `${spec.modulusMpa}, ${spec.poisson}`,
    "*SOLID SECTION, ELSET=EALL, MATERIAL=M",
  );
  const bottom = rs.map((_, i) => node(i, 0));
  const top = rs.map((_, i) => node(i, zs.length - 1));
  const lines = (ids: number[]) => {
    const out: string[] = [];
    for (let i = 0; i < ids.length; i += 12) out.push(ids.slice(i, i + 12).join(", ") + ",");
    return out;
  };
  L.push("*NSET, NSET=NBOT", ...lines(bottom), "*NSET, NSET=NTOP", ...lines(top));
  L.push("*STEP", "*STATIC", "*BOUNDARY", "NBOT, 1, 2, 0.0", "*DLOAD");
  const rowTop = zs.length - 2;
  const nLoaded = rs.findIndex((r) => r >= spec.loadRadiusMm - 1e-9);
  for (let i = 0; i < nLoaded; i++) L.push(`${rowTop * (nr - 1) + i + 1}, P3, ${spec.pressureMpa}`);
  L.push("*NODE PRINT, NSET=NTOP", "U", "*NODE PRINT, NSET=NBOT, TOTALS=YES", "RF", "*END STEP");
  return L.join("\n") + "\n";
}
