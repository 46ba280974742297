/*
 * klu-bench: times SuiteSparse KLU (Davis & Palamadai Natarajan, "Algorithm 907: KLU", ACM TOMS
 * 37, 2010) on a coordinate Matrix Market file, real or complex, and prints the JSON line of
 * `npm run bench:lu`: {"n","nnz","nnzLU","factorMs","refactorMs","solveMs","residual"}, medians
 * of klu_factor, klu_refactor and klu_solve after one klu_analyze, residual ‖Ax − b‖∞/‖b‖∞ with
 * b = A·1. Default KLU options (AMD ordering, block triangular form, tol 0.001). The number of
 * blocks of the block triangular form goes to stderr.
 *
 * Usage: klu-bench FILE.mtx [REPEAT]
 */
#include <ctype.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <suitesparse/klu.h>

static double now_ms(void) {
  struct timespec t;
  clock_gettime(CLOCK_MONOTONIC, &t);
  return t.tv_sec * 1e3 + t.tv_nsec * 1e-6;
}

static int cmp_double(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

static double median(double *s, int count) {
  qsort(s, count, sizeof(double), cmp_double);
  return count % 2 ? s[count / 2] : 0.5 * (s[count / 2 - 1] + s[count / 2]);
}

static void die(const char *what) {
  fprintf(stderr, "klu-bench: %s\n", what);
  exit(1);
}

int main(int argc, char **argv) {
  if (argc < 2) die("usage: klu-bench FILE.mtx [REPEAT]");
  int repeat = argc > 2 ? atoi(argv[2]) : 11;
  if (repeat < 1) repeat = 1;
  FILE *f = fopen(argv[1], "r");
  if (!f) die("cannot open the matrix file");
  char line[1024];
  if (!fgets(line, sizeof line, f)) die("empty file");
  for (char *c = line; *c; c++) *c = (char)tolower((unsigned char)*c);
  if (!strstr(line, "coordinate")) die("only coordinate files are read");
  int complex = strstr(line, "complex") != NULL;
  int symmetric = strstr(line, "symmetric") != NULL || strstr(line, "hermitian") != NULL;
  if (symmetric) die("only general files are read");
  do {
    if (!fgets(line, sizeof line, f)) die("no size line");
  } while (line[0] == '%');
  int n, ncol, nz;
  if (sscanf(line, "%d %d %d", &n, &ncol, &nz) != 3 || n != ncol) die("bad size line");
  int *Ti = malloc(sizeof(int) * nz), *Tj = malloc(sizeof(int) * nz);
  double *Tx = malloc(sizeof(double) * nz), *Tz = malloc(sizeof(double) * nz);
  for (int t = 0; t < nz; t++) {
    Tz[t] = 0;
    int got = complex ? fscanf(f, "%d %d %lf %lf", &Ti[t], &Tj[t], &Tx[t], &Tz[t])
                      : fscanf(f, "%d %d %lf", &Ti[t], &Tj[t], &Tx[t]);
    if (got != (complex ? 4 : 3)) die("bad entry");
    Ti[t]--;
    Tj[t]--;
  }
  fclose(f);
  /* Compressed columns; duplicates are assumed absent (the generators write none). */
  int *Ap = calloc(n + 1, sizeof(int)), *Ai = malloc(sizeof(int) * nz), *next = malloc(sizeof(int) * (n + 1));
  double *Ax = malloc(sizeof(double) * nz * (complex ? 2 : 1));
  for (int t = 0; t < nz; t++) Ap[Tj[t] + 1]++;
  for (int j = 0; j < n; j++) Ap[j + 1] += Ap[j];
  memcpy(next, Ap, sizeof(int) * (n + 1));
  for (int t = 0; t < nz; t++) {
    int p = next[Tj[t]]++;
    Ai[p] = Ti[t];
    if (complex) {
      Ax[2 * p] = Tx[t];
      Ax[2 * p + 1] = Tz[t];
    } else {
      Ax[p] = Tx[t];
    }
  }
  int w = complex ? 2 : 1;
  double *b = calloc((size_t)n * w, sizeof(double)), *x = malloc(sizeof(double) * n * w);
  for (int j = 0; j < n; j++)
    for (int p = Ap[j]; p < Ap[j + 1]; p++)
      for (int c = 0; c < w; c++) b[w * Ai[p] + c] += Ax[w * p + c];

  klu_common common;
  klu_defaults(&common);
  klu_symbolic *S = klu_analyze(n, Ap, Ai, &common);
  if (!S) die("klu_analyze failed");
  double *samples = malloc(sizeof(double) * repeat);
  klu_numeric *N = complex ? klu_z_factor(Ap, Ai, Ax, S, &common) : klu_factor(Ap, Ai, Ax, S, &common);
  if (!N) die("klu_factor failed");
  for (int r = 0; r < repeat; r++) {
    if (complex) klu_z_free_numeric(&N, &common);
    else klu_free_numeric(&N, &common);
    double t0 = now_ms();
    N = complex ? klu_z_factor(Ap, Ai, Ax, S, &common) : klu_factor(Ap, Ai, Ax, S, &common);
    samples[r] = now_ms() - t0;
    if (!N) die("klu_factor failed");
  }
  double factorMs = median(samples, repeat);
  for (int r = 0; r < repeat; r++) {
    double t0 = now_ms();
    int ok = complex ? klu_z_refactor(Ap, Ai, Ax, S, N, &common) : klu_refactor(Ap, Ai, Ax, S, N, &common);
    samples[r] = now_ms() - t0;
    if (!ok) die("klu_refactor failed");
  }
  double refactorMs = median(samples, repeat);
  for (int r = 0; r < repeat; r++) {
    memcpy(x, b, sizeof(double) * n * w);
    double t0 = now_ms();
    int ok = complex ? klu_z_solve(S, N, n, 1, x, &common) : klu_solve(S, N, n, 1, x, &common);
    samples[r] = now_ms() - t0;
    if (!ok) die("klu_solve failed");
  }
  double solveMs = median(samples, repeat);
  /* residual ‖A·x − b‖∞ / ‖b‖∞ */
  double *res = malloc(sizeof(double) * n * w);
  for (int i = 0; i < n * w; i++) res[i] = -b[i];
  for (int j = 0; j < n; j++)
    for (int p = Ap[j]; p < Ap[j + 1]; p++) {
      int i = Ai[p];
      if (complex) {
        double ar = Ax[2 * p], ai = Ax[2 * p + 1], xr = x[2 * j], xi = x[2 * j + 1];
        res[2 * i] += ar * xr - ai * xi;
        res[2 * i + 1] += ar * xi + ai * xr;
      } else {
        res[i] += Ax[p] * x[j];
      }
    }
  double num = 0, den = 0;
  for (int i = 0; i < n; i++) {
    double r = complex ? hypot(res[2 * i], res[2 * i + 1]) : fabs(res[i]);
    double v = complex ? hypot(b[2 * i], b[2 * i + 1]) : fabs(b[i]);
    if (r > num) num = r;
    if (v > den) den = v;
  }
  long nnzLU = (long)N->lnz + N->unz + N->nzoff;
  fprintf(stderr, "klu-bench: %d blocks of block triangular form, largest %d\n", S->nblocks, S->maxblock);
  printf("{\"n\":%d,\"nnz\":%d,\"nnzLU\":%ld,\"factorMs\":%.4g,\"refactorMs\":%.4g,\"solveMs\":%.4g,\"residual\":%.3g}\n",
         n, nz, nnzLU, factorMs, refactorMs, solveMs, num / den);
  return 0;
}
