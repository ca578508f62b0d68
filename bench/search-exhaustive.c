/*
 * Plain exhaustive enumeration of the match-search set, the yardstick for `npm run bench -- search`.
 * Reads from stdin: z0 n, then n lines "f loadRe loadIm", then m, then m lines
 * "kind(0=L,1=C) isSeries value q" (q 0 = lossless). Walks every ladder of 1..depth parts
 * (depth = argv[1]) in every order, each prefix computed once per level, every frequency of
 * every ladder scored (no pruning), and prints "bestGamma ladders seconds".
 * Part impedance: L: X = wL, C: X = -1/(wC), Z = |X|/Q + jX; series z += Z, shunt y += 1/Z;
 * gamma = (z - z0)/(z + z0).
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

static int n, m, depth;
static double z0;
static double *pr, *pi, *gr, *gi; /* part impedance and admittance, [part*n + f] */
static int *series;
static double best = INFINITY;
static long long ladders = 0;

static void walk(int d, const double *zr, const double *zi) {
  double nr[64], ni[64];
  for (int j = 0; j < m; j++) {
    const double *a = pr + (size_t)j * n, *b = pi + (size_t)j * n;
    const double *ya = gr + (size_t)j * n, *yb = gi + (size_t)j * n;
    double worst = 0;
    for (int i = 0; i < n; i++) {
      double r, x;
      if (series[j]) { r = zr[i] + a[i]; x = zi[i] + b[i]; }
      else {
        double mm = zr[i] * zr[i] + zi[i] * zi[i];
        double yr = zr[i] / mm + ya[i], yi = -zi[i] / mm + yb[i];
        double y2 = yr * yr + yi * yi;
        r = yr / y2; x = -yi / y2;
      }
      nr[i] = r; ni[i] = x;
      double g2 = ((r - z0) * (r - z0) + x * x) / ((r + z0) * (r + z0) + x * x);
      if (g2 > worst) worst = g2;
    }
    ladders++;
    if (worst < best) best = worst;
    if (d + 1 < depth) walk(d + 1, nr, ni);
  }
}

int main(int argc, char **argv) {
  depth = argc > 1 ? atoi(argv[1]) : 3;
  if (scanf("%lf %d", &z0, &n) != 2 || n > 64) return 2;
  double *f = malloc(sizeof(double) * n), *lr = malloc(sizeof(double) * n), *li = malloc(sizeof(double) * n);
  for (int i = 0; i < n; i++) if (scanf("%lf %lf %lf", &f[i], &lr[i], &li[i]) != 3) return 2;
  if (scanf("%d", &m) != 1) return 2;
  pr = malloc(sizeof(double) * m * n); pi = malloc(sizeof(double) * m * n);
  gr = malloc(sizeof(double) * m * n); gi = malloc(sizeof(double) * m * n);
  series = malloc(sizeof(int) * m);
  for (int j = 0; j < m; j++) {
    int kind; double v, q;
    if (scanf("%d %d %lf %lf", &kind, &series[j], &v, &q) != 4) return 2;
    for (int i = 0; i < n; i++) {
      double w = 2 * M_PI * f[i];
      double x = kind == 0 ? w * v : -1 / (w * v);
      double r = q > 0 ? fabs(x) / q : 0;
      double mm = r * r + x * x;
      pr[j * n + i] = r; pi[j * n + i] = x;
      gr[j * n + i] = r / mm; gi[j * n + i] = -x / mm;
    }
  }
  struct timespec t0, t1;
  clock_gettime(CLOCK_MONOTONIC, &t0);
  walk(0, lr, li);
  clock_gettime(CLOCK_MONOTONIC, &t1);
  printf("%.17g %lld %.6f\n", sqrt(best), ladders, (t1.tv_sec - t0.tv_sec) + 1e-9 * (t1.tv_nsec - t0.tv_nsec));
  return 0;
}
