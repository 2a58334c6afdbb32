/**
 * Elementary functions the core computes itself, so that every JavaScript engine gives the same
 * bits. `Math.sin`, `Math.exp`, `Math.pow`… are not required to be correctly rounded, and the
 * engines differ: Node 20's V8 and a current Chromium disagree in the last bit for about one input
 * in ten (measured over 20 000 arguments, 2026-12-02), which made the browser's live analysis
 * differ from the stored server result. These use only +, −, ×, ÷ and `Math.sqrt`/`Math.floor`/
 * `Math.abs` (IEEE 754 requires those to be exact), in a fixed order, so the result is the same
 * everywhere. Accuracy is a few units in the last place over the ranges the core uses; the tests
 * compare them with the built-ins.
 *
 * Method: Cody–Waite argument reduction (π/2 and ln 2 split into a high part with trailing zero
 * bits and a low part) and truncated Taylor / arctanh series on the reduced interval, evaluated by
 * Horner's rule.
 */

const PIO2_HI = 1.5707963267341256; // π/2, upper 33 bits (fdlibm's pio2_1)
const PIO2_LO = 6.077100506506192e-11; // π/2 − PIO2_HI, upper bits (pio2_1t)
const PIO2_LO2 = 2.0222662487959506e-21; // the next bits (pio2_2t)
const INV_PIO2 = 0.6366197723675814;
const LN2_HI = 0.6931471803691238; // ln 2, upper bits (fdlibm's ln2_hi)
const LN2_LO = 1.9082149292705877e-10; // ln 2 − LN2_HI
const INV_LN2 = 1.4426950408889634;
const LN10 = 2.302585092994046;

/** Taylor coefficients (−1)^k/(2k+1)! and (−1)^k/(2k)!, k = 1…9 and 1…10, as decimal literals. */
const SIN_C = [
  -1 / 6,
  1 / 120,
  -1 / 5040,
  1 / 362880,
  -1 / 39916800,
  1 / 6227020800,
  -1 / 1307674368000,
  1 / 355687428096000,
  -1 / 121645100408832000,
];
const COS_C = [
  -1 / 2,
  1 / 24,
  -1 / 720,
  1 / 40320,
  -1 / 3628800,
  1 / 479001600,
  -1 / 87178291200,
  1 / 20922789888000,
  -1 / 6402373705728000,
  1 / 2432902008176640000,
];

// The series below are written out (Horner's rule, innermost coefficient first) with the same
// operations in the same order as a loop over the coefficient lists, so the bits are the same; the
// unrolled form only saves the loop and the array reads in the inner loops of the path estimate.
// The innermost `+ z * 0` is the loop's first step (acc = 0), kept so an infinite z still gives NaN.
const [S1, S2, S3, S4, S5, S6, S7, S8, S9] = SIN_C as [
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
];
const [C1, C2, C3, C4, C5, C6, C7, C8, C9, C10] = COS_C as [
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
];

/** sin r for |r| ≤ π/4: Taylor series to r^19 (truncation below 1e-19 relative). */
function sinKernel(r: number): number {
  const z = r * r;
  return (
    r +
    r *
      z *
      (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * (S6 + z * (S7 + z * (S8 + z * (S9 + z * 0)))))))))
  );
}

/** cos r for |r| ≤ π/4: Taylor series to r^20. */
function cosKernel(r: number): number {
  const z = r * r;
  return (
    1 +
    z *
      (C1 +
        z *
          (C2 +
            z * (C3 + z * (C4 + z * (C5 + z * (C6 + z * (C7 + z * (C8 + z * (C9 + z * (C10 + z * 0))))))))))
  );
}

/** x = n·π/2 + r with |r| ≲ π/4 (exact enough for |x| below about 1e6, far beyond any angle here). */
function quadrant(x: number): number {
  const n = Math.floor(x * INV_PIO2 + 0.5);
  // ((n % 4) + 4) % 4; for an n that fits 32 bits the same by integer arithmetic (no fmod call).
  return n >= -2147483648 && n <= 2147483647 ? (n | 0) & 3 : ((n % 4) + 4) % 4;
}
function reduced(x: number): number {
  const n = Math.floor(x * INV_PIO2 + 0.5);
  return x - n * PIO2_HI - n * PIO2_LO - n * PIO2_LO2;
}

export function sin(x: number): number {
  if (!Number.isFinite(x)) return NaN;
  if (Math.abs(x) < 1e-8) return x;
  const n = quadrant(x);
  const r = reduced(x);
  return n === 0 ? sinKernel(r) : n === 1 ? cosKernel(r) : n === 2 ? -sinKernel(r) : -cosKernel(r);
}

export function cos(x: number): number {
  if (!Number.isFinite(x)) return NaN;
  const n = quadrant(x);
  const r = reduced(x);
  return n === 0 ? cosKernel(r) : n === 1 ? -sinKernel(r) : n === 2 ? -cosKernel(r) : sinKernel(r);
}

/**
 * `out[0] = sin(x)`, `out[1] = cos(x)` with one argument reduction: the same bits as the two
 * calls, for the loops that need both (points on an arc).
 */
export function sinCosInto(x: number, out: Float64Array): void {
  if (!Number.isFinite(x)) {
    out[0] = NaN;
    out[1] = NaN;
    return;
  }
  const n = quadrant(x);
  const r = reduced(x);
  const sk = sinKernel(r);
  const ck = cosKernel(r);
  out[0] = Math.abs(x) < 1e-8 ? x : n === 0 ? sk : n === 1 ? ck : n === 2 ? -sk : -ck;
  out[1] = n === 0 ? ck : n === 1 ? -sk : n === 2 ? -ck : sk;
}

export function tan(x: number): number {
  if (!Number.isFinite(x)) return NaN;
  const n = quadrant(x);
  const r = reduced(x);
  const s = sinKernel(r);
  const c = cosKernel(r);
  return n % 2 === 0 ? s / c : -c / s;
}

/** (−1)^k/(2k+1), k = 0…20 (index k), the atan series' coefficients. */
const ATAN_C = Float64Array.from({ length: 21 }, (_, k) => (k % 2 === 0 ? 1 : -1) / (2 * k + 1));

/** atan t for |t| ≤ tan(π/12) ≈ 0.268: series to t^41. */
function atanKernel(t: number): number {
  const z = t * t;
  let acc = 0;
  for (let k = 20; k >= 1; k--) acc = ATAN_C[k] + z * acc;
  return t + t * z * acc;
}

const PI_6 = 0.5235987755982989;
const SQRT3 = 1.7320508075688772;
const TAN_PI_12 = 0.2679491924311227;

export function atan(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return -atan(-x);
  if (x === Infinity) return PIO2_HI + PIO2_LO;
  // atan x = π/2 − atan(1/x) above 1; atan x = π/6 + atan((x√3 − 1)/(x + √3)) above tan(π/12).
  if (x > 1) return PIO2_HI - atan(1 / x) + PIO2_LO;
  if (x > TAN_PI_12) return PI_6 + atanKernel((x * SQRT3 - 1) / (x + SQRT3));
  return atanKernel(x);
}

const PI = 3.141592653589793;

export function atan2(y: number, x: number): number {
  if (Number.isNaN(x) || Number.isNaN(y)) return NaN;
  if (x === 0 && y === 0) return Object.is(x, -0) ? (Object.is(y, -0) ? -PI : PI) : y;
  if (x === 0) return y > 0 ? PIO2_HI + PIO2_LO : -(PIO2_HI + PIO2_LO);
  const a = atan(Math.abs(y / x));
  if (x > 0) return y < 0 || Object.is(y, -0) ? -a : a;
  return y < 0 || Object.is(y, -0) ? -(PI - a) : PI - a;
}

/** 2^k for integer k in the normal range, exactly. */
function pow2Loop(k: number): number {
  let out = 1;
  let b = k < 0 ? 0.5 : 2;
  let e = Math.abs(k);
  while (e > 0) {
    if (e & 1) out *= b;
    b *= b;
    e >>= 1;
  }
  return out;
}

/** 2^k, k = −1022…1023, made by pow2Loop once (the same exact powers, read from a table). */
const POW2_MIN = -1022;
const POW2 = Float64Array.from({ length: 1023 - POW2_MIN + 1 }, (_, i) => pow2Loop(i + POW2_MIN));
function pow2(k: number): number {
  return k >= POW2_MIN && k <= 1023 ? POW2[k - POW2_MIN] : pow2Loop(k);
}

/** e^r for |r| ≤ ln2/2: Taylor series to r^16 (acc = 1 + r·acc/k for k = 16…1, written out). */
function expKernel(r: number): number {
  let acc = 1 + r / 16;
  acc = 1 + (r * acc) / 15;
  acc = 1 + (r * acc) / 14;
  acc = 1 + (r * acc) / 13;
  acc = 1 + (r * acc) / 12;
  acc = 1 + (r * acc) / 11;
  acc = 1 + (r * acc) / 10;
  acc = 1 + (r * acc) / 9;
  acc = 1 + (r * acc) / 8;
  acc = 1 + (r * acc) / 7;
  acc = 1 + (r * acc) / 6;
  acc = 1 + (r * acc) / 5;
  acc = 1 + (r * acc) / 4;
  acc = 1 + (r * acc) / 3;
  acc = 1 + (r * acc) / 2;
  return 1 + r * acc;
}

export function exp(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x > 709.78) return Infinity;
  if (x < -745.2) return 0;
  const k = Math.floor(x * INV_LN2 + 0.5);
  const r = x - k * LN2_HI - k * LN2_LO;
  // Split the scaling so that 2^k never overflows before the product underflows back.
  if (k > 1000) return expKernel(r) * pow2(k - 1000) * pow2(1000);
  if (k < -1000) return expKernel(r) * pow2(k + 1000) * pow2(-1000);
  return expKernel(r) * pow2(k);
}

const SQRT1_2 = 0.7071067811865476;
/** 1/(2k+1), k = 0…22 (index k), the artanh series' coefficients. */
const LOG_C = Float64Array.from({ length: 23 }, (_, k) => 1 / (2 * k + 1));

export function log(x: number): number {
  if (Number.isNaN(x) || x < 0) return NaN;
  if (x === 0) return -Infinity;
  if (x === Infinity) return Infinity;
  // x = m·2^e with m in [√½, √2).
  let e = 0;
  let m = x;
  while (m >= 4503599627370496) {
    m /= 4503599627370496;
    e += 52;
  }
  while (m < 2.220446049250313e-16) {
    m *= 4503599627370496;
    e -= 52;
  }
  while (m >= 2) {
    m /= 2;
    e++;
  }
  while (m < 1) {
    m *= 2;
    e--;
  }
  if (m > 2 * SQRT1_2) {
    m /= 2;
    e++;
  }
  // log m = 2·artanh s, s = (m − 1)/(m + 1), |s| ≤ 0.1716: series to s^45.
  const s = (m - 1) / (m + 1);
  const z = s * s;
  let acc = 0;
  for (let k = 22; k >= 1; k--) acc = LOG_C[k] + z * acc;
  const lm = 2 * s + 2 * s * z * acc;
  return e * LN2_HI + (e * LN2_LO + lm);
}

export function log10(x: number): number {
  return log(x) / LN10;
}

export function log2(x: number): number {
  return log(x) * INV_LN2;
}

/** x^y; whole exponents up to 64 by repeated multiplication, others as e^(y·ln x). */
export function pow(x: number, y: number): number {
  if (y === 0) return 1;
  if (Number.isNaN(x) || Number.isNaN(y)) return NaN;
  if (Number.isInteger(y) && Math.abs(y) <= 64) {
    const p = pow2Like(x, Math.abs(y));
    return y < 0 ? 1 / p : p;
  }
  if (x < 0) return NaN;
  if (x === 0) return y > 0 ? 0 : Infinity;
  if (y === 0.5) return Math.sqrt(x);
  if (y === 0.25) return Math.sqrt(Math.sqrt(x));
  return exp(y * log(x));
}

function pow2Like(x: number, n: number): number {
  let out = 1;
  let b = x;
  let e = n;
  while (e > 0) {
    if (e & 1) out *= b;
    b *= b;
    e >>= 1;
  }
  return out;
}
