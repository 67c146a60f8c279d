/*
 * The plain-C floor for the thermal engine's step loop, compiled and run by thermal.bench.ts
 * (gcc -std=c99 -O2). It integrates the same 6-mode Foster network over the same pulse train as
 * the bench's engine run with every duration different (40 W pulses of 4 ms + 1e-9·i s alternating
 * with cooling gaps of 20 ms + 1e-9·i s), one mode at a time in closed form:
 *   y <- y·e^(-h/tau) + P·(1 - e^(-h/tau)),   rise = sum of gain·y,
 * with e^(-h/tau) from exp and 1 - e^(-h/tau) from expm1, as the engine computes them, and the
 * highest rise at the step ends (on this train every step is monotone, so the step ends hold every
 * maximum). No allocation, no objects: the least any implementation of the same arithmetic costs.
 * Usage: modalLoop SEGMENTS; prints "cpu_s peak_rise_K".
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#define MODES 6

int main(int argc, char **argv) {
  long segments = argc > 1 ? atol(argv[1]) : 1000000L;
  /* Foster stages (R [K/W], tau [s]) of the bench's invented network */
  const double r[MODES] = {0.02, 0.08, 0.25, 0.6, 0.9, 1.5};
  const double tau[MODES] = {5e-5, 3e-4, 4e-3, 0.05, 0.8, 30.0};
  double y[MODES] = {0};
  double peak = 0.0;
  clock_t start = clock();
  for (long i = 0; i < segments; i++) {
    int pulse = (i % 2) == 0;
    double h = pulse ? 0.004 + 1e-9 * (double)i : 0.02 + 1e-9 * (double)i;
    double p = pulse ? 40.0 : 0.0;
    double rise = 0.0;
    for (int m = 0; m < MODES; m++) {
      double a = h / tau[m];
      double decay = exp(-a);
      y[m] = y[m] * decay + (p != 0.0 ? p * -expm1(-a) : 0.0);
      rise += r[m] * y[m];
    }
    if (rise > peak) peak = rise;
  }
  double cpu = (double)(clock() - start) / CLOCKS_PER_SEC;
  printf("%.6f %.12f\n", cpu, peak);
  return 0;
}
