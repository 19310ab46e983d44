/*
 * C reference for lib/routing/held-karp.ts: the same packed Held–Karp DP (same table layout with
 * two-level row offsets, same mask order, branch-free minimum) on the same instance as
 * scripts/bench/held-karp.ts builds in TypeScript. One difference, each side's faster choice:
 * C gathers the arcs into j through the subset's member list from an m×m matrix that stays in L1,
 * while the TypeScript reads per-half-mask runs (intoLo / intoHi), which saves a load and a bounds
 * check per step there but is slower here (measured 250-440 ms against 510-600 ms at 20 stops).
 *   held-karp M SEED  ->  prints "<length> <wall ms> <cpu ms>" (the DP alone, instance generation excluded)
 * Instance: n = M + 2 points, start 0, end 1, stops 2..M+1, cost i->j = 1 + floor(r * 99999) from
 * mulberry32(SEED), row by row, 0 on the diagonal (randomMatrix in scripts/bench.ts).
 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#define UNREACHABLE 0x3fffffff

static uint32_t rng_state;
static double mulberry32(void) {
  rng_state += 0x6d2b79f5u;
  uint32_t t = rng_state;
  t = (t ^ (t >> 15)) * (t | 1u);
  t ^= t + (t ^ (t >> 7)) * (t | 61u);
  return (double)(t ^ (t >> 14)) / 4294967296.0;
}

static int popcount(uint32_t x) { return __builtin_popcount(x); }

static int low_bits;
static int32_t *hi_base, *hi_count, *lo_base;

static inline int64_t row_offset(uint32_t mask) {
  uint32_t hi = mask >> low_bits, lo = mask & ((1u << low_bits) - 1);
  return (int64_t)hi_base[hi] + (int64_t)hi_count[hi] * lo + lo_base[lo];
}

static inline int64_t entry_index(uint32_t mask, int j) { return row_offset(mask) + popcount(mask & ((1u << j) - 1)); }

static int32_t *prefix(int n) {
  int32_t *f = calloc(n, sizeof *f);
  for (int x = 1; x < n; x++) f[x] = f[x - 1] + popcount(x - 1);
  return f;
}

int main(int argc, char **argv) {
  if (argc != 3) {
    fprintf(stderr, "usage: %s M SEED\n", argv[0]);
    return 2;
  }
  int m = atoi(argv[1]);
  rng_state = (uint32_t)strtoul(argv[2], NULL, 10);
  if (m < 1 || m > 24) return 2;
  int n = m + 2;
  int32_t *cost = malloc(sizeof *cost * n * n);
  for (int i = 0; i < n; i++)
    for (int j = 0; j < n; j++) cost[i * n + j] = i == j ? 0 : 1 + (int32_t)floor(mulberry32() * 99999.0);

  struct timespec t0, t1, c0, c1;
  clock_gettime(CLOCK_MONOTONIC, &t0);
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &c0);
  int32_t *into = malloc(sizeof *into * m * m), *to_end = malloc(sizeof *to_end * m);
  for (int j = 0; j < m; j++) {
    to_end[j] = cost[(j + 2) * n + 1];
    for (int i = 0; i < m; i++) into[j * m + i] = i == j ? UNREACHABLE : cost[(i + 2) * n + j + 2];
  }
  low_bits = (m + 1) / 2;
  if (low_bits < 1) low_bits = 1;
  int size = 1 << low_bits, hi_size = 1 << (m - low_bits);
  lo_base = prefix(size);
  int32_t *hi_f = prefix(hi_size);
  hi_base = malloc(sizeof *hi_base * hi_size);
  hi_count = malloc(sizeof *hi_count * hi_size);
  for (int h = 0; h < hi_size; h++) {
    hi_base[h] = size * hi_f[h] + h * low_bits * (size >> 1);
    hi_count[h] = popcount(h);
  }
  int32_t *dp = calloc((size_t)m << (m - 1), sizeof *dp);
  for (int j = 0; j < m; j++) dp[entry_index(1u << j, j)] = cost[0 * n + j + 2];
  uint32_t full = (1u << m) - 1;
  int members[32];
  for (uint32_t mask = 3; mask <= full; mask++) {
    if ((mask & (mask - 1)) == 0) continue;
    int p = 0;
    for (uint32_t b = mask; b; b &= b - 1) members[p++] = __builtin_ctz(b);
    int64_t row = row_offset(mask);
    for (int a = 0; a < p; a++) {
      int j = members[a];
      const int32_t *col = into + j * m;
      const int32_t *base = dp + row_offset(mask ^ (1u << j));
      int32_t best = UNREACHABLE;
      for (int c = 0; c < a; c++) {
        int32_t d = base[c] + col[members[c]] - best;
        best += d & (d >> 31);
      }
      for (int c = a + 1; c < p; c++) {
        int32_t d = base[c - 1] + col[members[c]] - best;
        best += d & (d >> 31);
      }
      dp[row + a] = best;
    }
  }
  int32_t length = UNREACHABLE;
  for (int j = 0; j < m; j++) {
    int32_t s = dp[entry_index(full, j)] + to_end[j];
    if (s < length) length = s;
  }
  clock_gettime(CLOCK_MONOTONIC, &t1);
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &c1);
  printf("%d %.1f %.1f\n", length, (t1.tv_sec - t0.tv_sec) * 1e3 + (t1.tv_nsec - t0.tv_nsec) / 1e6,
         (c1.tv_sec - c0.tv_sec) * 1e3 + (c1.tv_nsec - c0.tv_nsec) / 1e6);
  return 0;
}
