/*
 * Compiled reference of the core's path estimate (computeGasketStressProfiles in
 * features/analysis/core/gasket-stress.ts) for a ring gasket: the same arithmetic in the same
 * order, so that `npm run bench` can print how far the JavaScript core is from compiled code and
 * check that both give the same numbers.
 *
 * Per run it does what the core does per call: samples the gasket path (the core's fixed-math
 * sin/cos, ported below), projects the bolts onto the path, solves the beam on an elastic
 * foundation (periodic finite differences, banded Cholesky, tensionless iterations; the
 * all-contact factor is kept between runs as the core keeps it), interpolates the line load onto
 * the samples, builds the cone field (point hash, peak pressures) and superposes the footprints at
 * every sample, and summarises both profiles. Inputs the core takes from memos are inputs here
 * too: the clipped footprint fractions of the bolts. The footprint shape table and integral are
 * made once, as the core makes them once per shape.
 *
 * Build: cc -O2 -ffp-contract=off -o path-estimate path-estimate.c -lm (no -ffast-math: the
 * order of the floating-point operations is the point).
 * Use:   path-estimate INPUT OUTPUT  (both plain text written and read by bench/core.bench.ts)
 * Prints "median_ms <value>" on stdout.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

/* ---- fixed-math.ts, ported operation for operation ---- */
static const double PIO2_HI = 1.5707963267341256, PIO2_LO = 6.077100506506192e-11,
                    PIO2_LO2 = 2.0222662487959506e-21, INV_PIO2 = 0.6366197723675814,
                    LN2_HI = 0.6931471803691238, LN2_LO = 1.9082149292705877e-10,
                    INV_LN2 = 1.4426950408889634, SQRT1_2 = 0.7071067811865476,
                    PI_6 = 0.5235987755982989, SQRT3 = 1.7320508075688772,
                    TAN_PI_12 = 0.2679491924311227, JS_PI = 3.141592653589793;

static double S[9], C[10], ATAN_C[21], LOG_C[23];

static void fm_init(void) {
  static const double sd[9] = {6.0, 120.0, 5040.0, 362880.0, 39916800.0, 6227020800.0, 1307674368000.0,
                               355687428096000.0, 121645100408832000.0};
  static const double cd[10] = {2.0, 24.0, 720.0, 40320.0, 3628800.0, 479001600.0, 87178291200.0,
                                20922789888000.0, 6402373705728000.0, 2432902008176640000.0};
  for (int i = 0; i < 9; i++) S[i] = (i % 2 == 0 ? -1.0 : 1.0) / sd[i];
  for (int i = 0; i < 10; i++) C[i] = (i % 2 == 0 ? -1.0 : 1.0) / cd[i];
  for (int k = 0; k <= 20; k++) ATAN_C[k] = (k % 2 == 0 ? 1.0 : -1.0) / (2 * k + 1);
  for (int k = 0; k <= 22; k++) LOG_C[k] = 1.0 / (2 * k + 1);
}

static double sin_kernel(double r) {
  double z = r * r, acc = 0;
  for (int i = 8; i >= 0; i--) acc = S[i] + z * acc;
  return r + r * z * acc;
}
static double cos_kernel(double r) {
  double z = r * r, acc = 0;
  for (int i = 9; i >= 0; i--) acc = C[i] + z * acc;
  return 1 + z * acc;
}
static void fm_sincos(double x, double *s, double *c) {
  if (!isfinite(x)) {
    *s = *c = NAN;
    return;
  }
  double n = floor(x * INV_PIO2 + 0.5);
  double r = x - n * PIO2_HI - n * PIO2_LO - n * PIO2_LO2;
  int q = (int)fmod(fmod(n, 4.0) + 4.0, 4.0);
  double sk = sin_kernel(r), ck = cos_kernel(r);
  *s = fabs(x) < 1e-8 ? x : q == 0 ? sk : q == 1 ? ck : q == 2 ? -sk : -ck;
  *c = q == 0 ? ck : q == 1 ? -sk : q == 2 ? -ck : sk;
}
static double atan_kernel(double t) {
  double z = t * t, acc = 0;
  for (int k = 20; k >= 1; k--) acc = ATAN_C[k] + z * acc;
  return t + t * z * acc;
}
static double fm_atan(double x) {
  if (isnan(x)) return NAN;
  if (x < 0) return -fm_atan(-x);
  if (isinf(x)) return PIO2_HI + PIO2_LO;
  if (x > 1) return PIO2_HI - fm_atan(1 / x) + PIO2_LO;
  if (x > TAN_PI_12) return PI_6 + atan_kernel((x * SQRT3 - 1) / (x + SQRT3));
  return atan_kernel(x);
}
static double fm_atan2(double y, double x) {
  if (isnan(x) || isnan(y)) return NAN;
  if (x == 0 && y == 0) return signbit(x) ? (signbit(y) ? -JS_PI : JS_PI) : y;
  if (x == 0) return y > 0 ? PIO2_HI + PIO2_LO : -(PIO2_HI + PIO2_LO);
  double a = fm_atan(fabs(y / x));
  if (x > 0) return (y < 0 || signbit(y)) ? -a : a;
  return (y < 0 || signbit(y)) ? -(JS_PI - a) : JS_PI - a;
}
static double exp_kernel(double r) {
  double acc = 1;
  for (int k = 16; k >= 1; k--) acc = 1 + (r * acc) / k;
  return acc;
}
static double fm_exp(double x) {
  if (isnan(x)) return NAN;
  if (x > 709.78) return INFINITY;
  if (x < -745.2) return 0;
  double k = floor(x * INV_LN2 + 0.5);
  double r = x - k * LN2_HI - k * LN2_LO;
  if (k > 1000) return exp_kernel(r) * ldexp(1.0, (int)k - 1000) * ldexp(1.0, 1000);
  if (k < -1000) return exp_kernel(r) * ldexp(1.0, (int)k + 1000) * ldexp(1.0, -1000);
  return exp_kernel(r) * ldexp(1.0, (int)k);
}
static double fm_log(double x) {
  if (isnan(x) || x < 0) return NAN;
  if (x == 0) return -INFINITY;
  if (isinf(x)) return INFINITY;
  double e = 0, m = x;
  while (m >= 4503599627370496.0) { m /= 4503599627370496.0; e += 52; }
  while (m < 2.220446049250313e-16) { m *= 4503599627370496.0; e -= 52; }
  while (m >= 2) { m /= 2; e++; }
  while (m < 1) { m *= 2; e--; }
  if (m > 2 * SQRT1_2) { m /= 2; e++; }
  double s = (m - 1) / (m + 1), z = s * s, acc = 0;
  for (int k = 22; k >= 1; k--) acc = LOG_C[k] + z * acc;
  double lm = 2 * s + 2 * s * z * acc;
  return e * LN2_HI + (e * LN2_LO + lm);
}

/* ---- the gasket path (path.ts) ---- */
typedef struct {
  int arc;
  double x0, y0, x1, y1; /* line */
  double cx, cy, r, start, sweep; /* arc */
  double len, startS;
} Segment;

static int nseg;
static Segment *seg;
static double pathL, shiftMm;

static double wrap(double u, double L) {
  double w = fmod(u, L);
  return w < 0 ? w + L : w;
}
static double sgn(double v) { return v > 0 ? 1 : v < 0 ? -1 : 0; }
static int segment_index_at(double u) {
  int lo = 0, hi = nseg - 1;
  while (lo < hi) {
    int mid = (lo + hi + 1) >> 1;
    if (seg[mid].startS <= u) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
static void sample_path(int count, double *xs, double *ys) {
  double L = pathL, step = L / count;
  int si = segment_index_at(wrap(shiftMm, L));
  for (int j = 0; j < count; j++) {
    double v = j * step + shiftMm;
    double u = v >= 0 && v < L ? v : wrap(v, L);
    int guard = 0;
    while (guard++ <= nseg && !(u >= seg[si].startS && u < seg[si].startS + seg[si].len + 1e-12)) si = (si + 1) % nseg;
    Segment *s = &seg[si];
    double local = u - s->startS;
    if (!s->arc) {
      double t = s->len > 0 ? local / s->len : 0;
      xs[j] = s->x0 + (s->x1 - s->x0) * t;
      ys[j] = s->y0 + (s->y1 - s->y0) * t;
    } else {
      double a = s->start + sgn(s->sweep) * (local / s->r), sn, cs;
      fm_sincos(a, &sn, &cs);
      xs[j] = s->cx + s->r * cs;
      ys[j] = s->cy + s->r * sn;
    }
  }
}
/* projectOntoPath(path, p).sMm */
static double project_s(double px, double py) {
  double bestU = 0, best = INFINITY;
  for (int i = 0; i < nseg; i++) {
    Segment *s = &seg[i];
    double local, qx, qy;
    if (!s->arc) {
      double dx = s->x1 - s->x0, dy = s->y1 - s->y0;
      double len2 = dx * dx + dy * dy;
      if (len2 == 0) len2 = 1;
      double t = ((px - s->x0) * dx + (py - s->y0) * dy) / len2;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
      qx = s->x0 + t * dx;
      qy = s->y0 + t * dy;
      local = t * s->len;
    } else {
      double phi = fm_atan2(py - s->cy, px - s->cx);
      double sweep = fabs(s->sweep), dir = sgn(s->sweep);
      double delta = wrap(dir < 0 ? s->start - phi : phi - s->start, 2 * JS_PI);
      if (delta > sweep) delta = delta - sweep < 2 * JS_PI - delta ? sweep : 0;
      double a = s->start + dir * delta, sn, cs;
      fm_sincos(a, &sn, &cs);
      qx = s->cx + s->r * cs;
      qy = s->cy + s->r * sn;
      local = delta * s->r;
    }
    double d2 = (px - qx) * (px - qx) + (py - qy) * (py - qy);
    if (d2 < best) {
      best = d2;
      bestU = s->startS + local;
    }
  }
  return wrap(bestU - shiftMm, pathL);
}

/* ---- beam on elastic foundation (beam-foundation.ts) ---- */
#define BP 4
#define BW (BP + 1)
static void cholesky_factor(double *band, int n) {
  for (int i = 0; i < n; i++) {
    int j0 = i - BP > 0 ? i - BP : 0;
    for (int j = j0; j <= i; j++) {
      double sum = band[i * BW + (i - j)];
      int k0 = j0 > j - BP ? j0 : j - BP;
      for (int k = k0; k < j; k++) sum -= band[i * BW + (i - k)] * band[j * BW + (j - k)];
      if (i == j) band[i * BW] = sqrt(sum > 1e-300 ? sum : 1e-300);
      else band[i * BW + (i - j)] = sum / band[j * BW];
    }
  }
}
static void cholesky_substitute(const double *band, double *b, int n) {
  for (int i = 0; i < n; i++) {
    double sum = b[i];
    for (int k = i - BP > 0 ? i - BP : 0; k < i; k++) sum -= band[i * BW + (i - k)] * b[k];
    b[i] = sum / band[i * BW];
  }
  for (int i = n - 1; i >= 0; i--) {
    double sum = b[i];
    int kEnd = n - 1 < i + BP ? n - 1 : i + BP;
    for (int k = i + 1; k <= kEnd; k++) sum -= band[k * BW + (k - i)] * b[k];
    b[i] = sum / band[i * BW];
  }
}
static void assemble(double *band, int N, double a, double k, const int *pos, const unsigned char *contact) {
  static const double stencil[5] = {1, -4, 6, -4, 1};
  memset(band, 0, sizeof(double) * N * BW);
  for (int i = 0; i < N; i++) {
    int pi = pos[i];
    for (int o = -2; o <= 2; o++) {
      int j = (i + o + N) % N, pj = pos[j];
      if (pj > pi) continue;
      band[pi * BW + (pi - pj)] += a * stencil[o + 2];
    }
    if (contact[i]) band[pi * BW] += k;
  }
}

/* ---- the problem ---- */
static int N, nb, solverNodes;
static double *bx, *by, *force, *frac, EI, kF, wg, holeR, coneR, shapeA, shapeB;
#define SHAPE_STEPS 256
static double shapeTable[SHAPE_STEPS + 2], fullIntegral;
static double *fullFactor; /* the all-contact factor, kept between runs (the core's memo) */

static double shape_value(double xi, double a, double b) {
  if (xi < 0 || xi >= 1) return 0;
  if (xi == 0) return 1;
  double inner = 1 - fm_exp(a * fm_log(xi));
  return inner <= 0 ? 0 : fm_exp(b * fm_log(inner));
}
static void make_shape(double ri, double rc) {
  for (int k = 0; k <= SHAPE_STEPS; k++) shapeTable[k] = shape_value((double)k / SHAPE_STEPS, shapeA, shapeB);
  shapeTable[SHAPE_STEPS] = 0;
  shapeTable[SHAPE_STEPS + 1] = 0;
  if (shapeA == 1 && shapeB == 1) fullIntegral = (JS_PI * (rc - ri) * (rc + 2 * ri)) / 3;
  else {
    int n = 400;
    double dr = (rc - ri) / n, s = 0;
    for (int k = 0; k < n; k++) {
      double xi = (k + 0.5) / n;
      s += shape_value(xi, shapeA, shapeB) * (ri + xi * (rc - ri));
    }
    fullIntegral = 2 * JS_PI * s * dr;
  }
}

typedef struct {
  double minMpa, maxMpa, meanMpa, minS, maxS, unloaded;
} Summary;

static void summarise(const double *v, const double *s, const unsigned char *on, double step, Summary *out) {
  double mn = INFINITY, mx = -INFINITY, sum = 0, unl = 0;
  int count = 0, iMin = 0, iMax = 0;
  for (int i = 0; i < N; i++) {
    if (!on[i]) continue;
    sum += v[i];
    count++;
    if (v[i] < mn) { mn = v[i]; iMin = i; }
    if (v[i] > mx) { mx = v[i]; iMax = i; }
  }
  double tol = (mx > 0 ? mx : 0) * 1e-9;
  for (int i = 0; i < N; i++) if (on[i] && v[i] <= tol) unl += step;
  if (count == 0) mn = mx = 0;
  out->minMpa = mn;
  out->maxMpa = mx;
  out->meanMpa = count ? sum / count : 0;
  out->minS = s[iMin];
  out->maxS = s[iMax];
  out->unloaded = unl;
}

typedef struct {
  double *s, *x, *y, *cone, *beam, *q, *rhs, *w, *line, *band, *boltS, *peak, *hxs, *hys;
  int *pos, *cellStart, *items, *cellOf, *cand;
  unsigned char *on, *contact;
  Summary coneSum, beamSum;
  double beamForce, liftedMm;
  int iterations;
} Work;

/* One path estimate: everything computeGasketStressProfiles computes for a ring gasket. */
static void path_estimate(Work *wk) {
  double L = pathL, step = L / N;
  sample_path(N, wk->x, wk->y);
  for (int j = 0; j < N; j++) {
    wk->s[j] = j * step;
    wk->on[j] = 1;
  }
  for (int i = 0; i < nb; i++) wk->boltS[i] = project_s(bx[i], by[i]);

  /* beam */
  int M = solverNodes;
  double h = L / M, a = EI / (h * h * h * h);
  memset(wk->q, 0, sizeof(double) * M);
  for (int i = 0; i < nb; i++) {
    double u = fmod(fmod(wk->boltS[i], L) + L, L) / h;
    int i0 = (int)fmod(floor(u), M);
    double fr = u - floor(u);
    wk->q[i0] += (force[i] * (1 - fr)) / h;
    wk->q[(i0 + 1) % M] += (force[i] * fr) / h;
  }
  for (int i = 0; i < M; i++) wk->contact[i] = 1;
  int it = 0;
  while (it < 60) {
    it++;
    const double *factor;
    if (it == 1) {
      if (!fullFactor) {
        fullFactor = malloc(sizeof(double) * M * BW);
        assemble(fullFactor, M, a, kF, wk->pos, wk->contact);
        cholesky_factor(fullFactor, M);
      }
      factor = fullFactor;
    } else {
      assemble(wk->band, M, a, kF, wk->pos, wk->contact);
      cholesky_factor(wk->band, M);
      factor = wk->band;
    }
    for (int i = 0; i < M; i++) wk->rhs[wk->pos[i]] = wk->q[i];
    cholesky_substitute(factor, wk->rhs, M);
    int changed = 0;
    for (int i = 0; i < M; i++) {
      wk->w[i] = wk->rhs[wk->pos[i]];
      unsigned char c = wk->w[i] > 0 ? 1 : 0;
      if (c != wk->contact[i]) { wk->contact[i] = c; changed = 1; }
    }
    if (!changed) break;
  }
  wk->iterations = it;
  double lifted = 0;
  for (int i = 0; i < M; i++) {
    if (wk->contact[i] && wk->w[i] > 0) wk->line[i] = kF * wk->w[i];
    else { wk->line[i] = 0; lifted += h; }
  }
  wk->liftedMm = lifted;
  double beamForce = 0;
  for (int j = 0; j < N; j++) {
    double u = wk->s[j] / h, fl = floor(u);
    int i0 = fl < M ? (int)fl : (int)fmod(fl, M);
    int i1 = i0 + 1 < M ? i0 + 1 : 0;
    double fr = u - fl;
    double line = wk->line[i0] * (1 - fr) + wk->line[i1] * fr;
    wk->beam[j] = line / wg;
    beamForce += line * step;
  }
  wk->beamForce = beamForce;

  /* cone field: point hash (point-hash.ts) and peaks (cone-superposition.ts) */
  double ri = holeR, rc = coneR > ri * 1.0001 + 1e-6 ? coneR : ri * 1.0001 + 1e-6;
  double xMin = INFINITY, xMax = -INFINITY, yMin = INFINITY, yMax = -INFINITY;
  for (int i = 0; i < nb; i++) {
    xMin = fmin(xMin, bx[i]); xMax = fmax(xMax, bx[i]);
    yMin = fmin(yMin, by[i]); yMax = fmax(yMax, by[i]);
    wk->hxs[i] = bx[i];
    wk->hys[i] = by[i];
  }
  double cell = fmax(rc + holeR, 1e-6);
  cell = fmax(cell, fmax((xMax - xMin) / 1024, (yMax - yMin) / 1024));
  double hx0 = xMin - cell, hy0 = yMin - cell;
  int nx = (int)floor((xMax - hx0) / cell) + 2, ny = (int)floor((yMax - hy0) / cell) + 2;
  int *cs = wk->cellStart = realloc(wk->cellStart, sizeof(int) * (nx * ny + 1));
  memset(cs, 0, sizeof(int) * (nx * ny + 1));
  for (int i = 0; i < nb; i++) {
    int c = (int)floor((by[i] - hy0) / cell) * nx + (int)floor((bx[i] - hx0) / cell);
    wk->cellOf[i] = c;
    cs[c + 1]++;
  }
  for (int c = 0; c < nx * ny; c++) cs[c + 1] += cs[c];
  int *fill = malloc(sizeof(int) * nx * ny);
  memcpy(fill, cs, sizeof(int) * nx * ny);
  for (int i = 0; i < nb; i++) wk->items[fill[wk->cellOf[i]]++] = i;
  free(fill);
  for (int i = 0; i < nb; i++) wk->peak[i] = frac[i] > 1e-9 ? force[i] / (fullIntegral * frac[i]) : 0;

  /* cone superposition at every sample */
  double steps = SHAPE_STEPS / (rc - ri), rc2 = rc * rc, ri2 = ri * ri;
  /* the bolts of the 3 x 3 cells, listed once per cell in visiting order (as the core does) */
  int count = 0, lastCx = -1, lastCy = -1;
  for (int j = 0; j < N; j++) {
    double x = wk->x[j], y = wk->y[j];
    int cx = (int)floor((x - hx0) / cell), cy = (int)floor((y - hy0) / cell);
    if (cx != lastCx || cy != lastCy) {
      lastCx = cx;
      lastCy = cy;
      count = 0;
      int x0 = cx > 0 ? cx - 1 : 0, x1 = cx + 1 < nx ? cx + 1 : nx - 1;
      int y0 = cy > 0 ? cy - 1 : 0, y1 = cy + 1 < ny ? cy + 1 : ny - 1;
      for (int iy = y0; iy <= y1; iy++)
        for (int ix = x0; ix <= x1; ix++) {
          int c = iy * nx + ix;
          for (int k = cs[c]; k < cs[c + 1]; k++) wk->cand[count++] = wk->items[k];
        }
    }
    double p = 0;
    for (int k = 0; k < count; k++) {
      int i = wk->cand[k];
      double ex = wk->hxs[i] - x, ey = wk->hys[i] - y, d2 = ex * ex + ey * ey;
      if (d2 < rc2 && d2 >= ri2) {
        double u = (sqrt(d2) - ri) * steps;
        int t = (int)u;
        double f = u - t;
        p += wk->peak[i] * (shapeTable[t] * (1 - f) + shapeTable[t + 1] * f);
      }
    }
    wk->cone[j] = p;
  }
  summarise(wk->cone, wk->s, wk->on, step, &wk->coneSum);
  summarise(wk->beam, wk->s, wk->on, step, &wk->beamSum);
}

static double now_ms(void) {
  struct timespec t;
  clock_gettime(CLOCK_MONOTONIC, &t);
  return t.tv_sec * 1e3 + t.tv_nsec / 1e6;
}
static int cmp(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return x < y ? -1 : x > y;
}
static double rd(FILE *f) {
  double v;
  if (fscanf(f, "%lf", &v) != 1) {
    fprintf(stderr, "path-estimate: bad input\n");
    exit(2);
  }
  return v;
}

int main(int argc, char **argv) {
  if (argc != 3) {
    fprintf(stderr, "usage: path-estimate INPUT OUTPUT\n");
    return 2;
  }
  fm_init();
  FILE *in = fopen(argv[1], "r");
  if (!in) { perror(argv[1]); return 2; }
  int runs = (int)rd(in);
  nseg = (int)rd(in);
  seg = calloc(nseg, sizeof(Segment));
  for (int i = 0; i < nseg; i++) {
    Segment *s = &seg[i];
    s->arc = (int)rd(in);
    if (s->arc) { s->cx = rd(in); s->cy = rd(in); s->r = rd(in); s->start = rd(in); s->sweep = rd(in); }
    else { s->x0 = rd(in); s->y0 = rd(in); s->x1 = rd(in); s->y1 = rd(in); }
    s->len = rd(in);
    s->startS = rd(in);
  }
  pathL = rd(in);
  shiftMm = rd(in);
  N = (int)rd(in);
  solverNodes = (int)rd(in);
  EI = rd(in); kF = rd(in); wg = rd(in); holeR = rd(in); coneR = rd(in); shapeA = rd(in); shapeB = rd(in);
  nb = (int)rd(in);
  bx = malloc(sizeof(double) * nb); by = malloc(sizeof(double) * nb);
  force = malloc(sizeof(double) * nb); frac = malloc(sizeof(double) * nb);
  for (int i = 0; i < nb; i++) { bx[i] = rd(in); by[i] = rd(in); force[i] = rd(in); frac[i] = rd(in); }
  fclose(in);

  double rc = coneR > holeR * 1.0001 + 1e-6 ? coneR : holeR * 1.0001 + 1e-6;
  make_shape(holeR, rc);
  Work wk = {0};
  int M = solverNodes;
  double *blocks[14];
  int sizes[14] = {N, N, N, N, N, M, M, M, M, M * BW, nb, nb, nb, nb};
  for (int i = 0; i < 14; i++) blocks[i] = calloc(sizes[i], sizeof(double));
  wk.s = blocks[0]; wk.x = blocks[1]; wk.y = blocks[2]; wk.cone = blocks[3]; wk.beam = blocks[4];
  wk.q = blocks[5]; wk.rhs = blocks[6]; wk.w = blocks[7]; wk.line = blocks[8]; wk.band = blocks[9];
  wk.boltS = blocks[10]; wk.peak = blocks[11]; wk.hxs = blocks[12]; wk.hys = blocks[13];
  wk.on = calloc(N, 1);
  wk.contact = calloc(M, 1);
  wk.items = calloc(nb, sizeof(int));
  wk.cand = calloc(nb, sizeof(int));
  wk.cellOf = calloc(nb, sizeof(int));
  wk.pos = calloc(M, sizeof(int));
  int *order = calloc(M, sizeof(int));
  for (int j = 0, lo = 0, hi = M - 1; j < M; j++) order[j] = j % 2 == 0 ? lo++ : hi--;
  for (int j = 0; j < M; j++) wk.pos[order[j]] = j;

  for (int i = 0; i < 10; i++) path_estimate(&wk);
  double *t = malloc(sizeof(double) * runs);
  for (int i = 0; i < runs; i++) {
    double t0 = now_ms();
    path_estimate(&wk);
    t[i] = now_ms() - t0;
  }
  qsort(t, runs, sizeof(double), cmp);
  printf("median_ms %.6f\n", t[runs / 2]);

  FILE *out = fopen(argv[2], "w");
  if (!out) { perror(argv[2]); return 2; }
  Summary *sums[2] = {&wk.coneSum, &wk.beamSum};
  for (int k = 0; k < 2; k++)
    fprintf(out, "%.17g %.17g %.17g %.17g %.17g %.17g\n", sums[k]->minMpa, sums[k]->maxMpa, sums[k]->meanMpa,
            sums[k]->minS, sums[k]->maxS, sums[k]->unloaded);
  fprintf(out, "%.17g %.17g %d\n", wk.beamForce, wk.liftedMm, wk.iterations);
  for (int j = 0; j < N; j++)
    fprintf(out, "%.17g %.17g %.17g %.17g\n", wk.x[j], wk.y[j], wk.cone[j], wk.beam[j]);
  fclose(out);
  return 0;
}
