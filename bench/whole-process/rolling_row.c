/* The plain C peer of StratLink's DTW kernel: symmetric1 with |a - b| on two rolling rows, one
   direction byte a cell (the full path traced back), gcc -O2. Prints the distance and ns per cell
   (best of 3, process CPU time). Usage: rolling_row N SEED */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

static double cpu_seconds(void) {
    struct timespec t;
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t);
    return t.tv_sec + t.tv_nsec * 1e-9;
}

int main(int argc, char **argv) {
    int n = argc > 1 ? atoi(argv[1]) : 10000;
    srand(argc > 2 ? atoi(argv[2]) : 1);
    double *x = malloc(n * sizeof *x), *y = malloc(n * sizeof *y), v = 0, w = 0;
    for (int i = 0; i < n; i++) { v += rand() / (double)RAND_MAX - 0.5; w += rand() / (double)RAND_MAX - 0.5; x[i] = v; y[i] = w; }
    double *prev = malloc((n + 1) * sizeof *prev), *cur = malloc((n + 1) * sizeof *cur);
    uint8_t *dir = malloc((size_t)n * n);
    double best = 1e30, distance = 0;
    long steps = 0;
    for (int rep = 0; rep < 3; rep++) {
        double t0 = cpu_seconds();
        for (int j = 0; j <= n; j++) prev[j] = INFINITY;
        for (int i = 0; i < n; i++) {
            cur[0] = INFINITY;
            uint8_t *row = dir + (size_t)i * n;
            for (int j = 0; j < n; j++) {
                double d = fabs(x[i] - y[j]);
                if (i == 0 && j == 0) { cur[1] = d; row[0] = 0; continue; }
                double diag = prev[j], left = cur[j], up = prev[j + 1];
                double m = diag; uint8_t k = 0;
                if (left < m) { m = left; k = 1; }
                if (up < m) { m = up; k = 2; }
                cur[j + 1] = m + d;
                row[j] = k;
            }
            double *t = prev; prev = cur; cur = t;
        }
        distance = prev[n];
        int i = n - 1, j = n - 1;
        steps = 1;
        while (i > 0 || j > 0) {
            uint8_t k = dir[(size_t)i * n + j];
            if (k == 0) { i--; j--; } else if (k == 1) j--; else i--;
            steps++;
        }
        double used = cpu_seconds() - t0;
        if (used < best) best = used;
    }
    printf("%.17g %.3f %ld\n", distance, best * 1e9 / ((double)n * n), steps);
    return 0;
}
