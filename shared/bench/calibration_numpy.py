"""Independent numpy/scipy calculation of a full unweighted linear calibration, for the side-by-side benchmark.

Computes what the engine computes for the calibration: the fit with its ANOVA and intervals, residuals,
standardised residuals, back-calculated standards, the summary of each standard level, the lack-of-fit
F test (Draper & Smith ch. 2) and the ICH Q2 detection and quantitation limits from the residual SD and
from the SD of the intercept (3.3 s / b, 10 s / b). Standard textbook formulas, written independently of
the TypeScript engine.

Usage: python3 calibration_numpy.py N RUNS  ->  one JSON line: wall and CPU times (ms), peak RSS (KB), key figures.
"""

import json
import resource
import sys
import time

import numpy as np
from scipy import stats


# The same warm-up rule as the engine's side: at least 3 runs, then up to 20 within 2 s.
WARM_UP_MIN_RUNS, WARM_UP_MAX_RUNS, WARM_UP_SECONDS = 3, 20, 2.0


def standards(n):
    i = np.arange(n, dtype=np.float64)
    x = 1 + (np.arange(n) % 1000) / 10
    return x, 0.5 + 2 * x + 0.01 * np.sin(i)


def calibrate(x, y, confidence=0.95):
    n = x.size
    x_mean, y_mean = x.mean(), y.mean()
    dx, dy = x - x_mean, y - y_mean
    sxx, sxy, syy = dx @ dx, dx @ dy, dy @ dy
    b = sxy / sxx
    a = y_mean - b * x_mean
    residuals = dy - b * dx
    ss_residual = residuals @ residuals
    df = n - 2
    s = np.sqrt(ss_residual / df)
    t = stats.t.ppf((1 + confidence) / 2, df)
    se_b = s / np.sqrt(sxx)
    se_a = s * np.sqrt(1 / n + x_mean**2 / sxx)
    r2 = 1 - ss_residual / syy
    ms_regression = b * sxy
    F = ms_regression / (ss_residual / df)
    grid = np.linspace(x.min(), x.max(), 101)
    leverage = 1 / n + (grid - x_mean) ** 2 / sxx
    bands = {
        'fit': a + b * grid,
        'confidence': t * s * np.sqrt(leverage),
        'prediction': t * s * np.sqrt(1 + leverage),
    }

    standardised = residuals / s
    x_back = x_mean + dy / b
    re_pct = 100 * (x_back - x) / x

    levels, level_of, counts = np.unique(x, return_inverse=True, return_counts=True)
    y_level_mean = np.bincount(level_of, weights=y) / counts
    y_dev = y - y_level_mean[level_of]
    ss_pure_error = y_dev @ y_dev
    with np.errstate(invalid='ignore', divide='ignore'):
        y_level_sd = np.sqrt(np.bincount(level_of, weights=y_dev**2) / (counts - 1))
        back_mean = np.bincount(level_of, weights=x_back) / counts
        back_dev = x_back - back_mean[level_of]
        back_sd = np.sqrt(np.bincount(level_of, weights=back_dev**2) / (counts - 1))
        level_summary = {
            'x': levels,
            'n': counts,
            'yMean': y_level_mean,
            'ySd': y_level_sd,
            'xBackMean': back_mean,
            'rePct': 100 * (back_mean - levels) / levels,
            'rsdPct': 100 * back_sd / np.abs(back_mean),
        }

    k = levels.size
    lack_of_fit = None
    if n - k >= 1 and k - 2 >= 1 and ss_pure_error > 0:
        df_pe, df_lof = n - k, k - 2
        ss_lof = max(0.0, ss_residual - ss_pure_error)
        F_lof = ss_lof / df_lof / (ss_pure_error / df_pe)
        lack_of_fit = {
            'ssPureError': ss_pure_error,
            'F': F_lof,
            'p': stats.f.sf(F_lof, df_lof, df_pe),
            'critical': stats.f.ppf(confidence, df_lof, df_pe),
        }

    return {
        'slope': b,
        'intercept': a,
        'sYX': s,
        'seSlope': se_b,
        'seIntercept': se_a,
        'ciSlope': (b - t * se_b, b + t * se_b),
        'r2': r2,
        'F': F,
        'p': stats.f.sf(F, 1, df),
        'bands': bands,
        'residuals': residuals,
        'standardizedResiduals': standardised,
        'backCalculated': {'xBack': x_back, 'rePct': re_pct},
        'levels': level_summary,
        'lackOfFit': lack_of_fit,
        'detection': {
            'sdResidual': {'lod': 3.3 * s / abs(b), 'loq': 10 * s / abs(b)},
            'sdIntercept': {'lod': 3.3 * se_a / abs(b), 'loq': 10 * se_a / abs(b)},
        },
    }


def main():
    n, runs = int(sys.argv[1]), int(sys.argv[2])
    x, y = standards(n)
    warm_up_start = time.perf_counter()
    for done in range(WARM_UP_MAX_RUNS):
        if done >= WARM_UP_MIN_RUNS and time.perf_counter() - warm_up_start > WARM_UP_SECONDS:
            break
        calibrate(x, y)
    times, cpu = [], []
    for _ in range(runs):
        start, start_cpu = time.perf_counter(), time.process_time()
        result = calibrate(x, y)
        times.append(1000 * (time.perf_counter() - start))
        cpu.append(1000 * (time.process_time() - start_cpu))
    lof = result['lackOfFit']
    print(
        json.dumps(
            {
                'times': times,
                'cpu': cpu,
                'maxRssKb': resource.getrusage(resource.RUSAGE_SELF).ru_maxrss,
                'figures': {
                    'slope': result['slope'],
                    'intercept': result['intercept'],
                    'sYX': result['sYX'],
                    'ssPureError': lof['ssPureError'] if lof else None,
                    'lod': result['detection']['sdResidual']['lod'],
                    'level0RePct': float(result['levels']['rePct'][0]),
                },
            }
        )
    )


if __name__ == '__main__':
    main()
