"""Vectorised numpy peer of the sonorigor benchmark models (bench/compare_numpy.ts runs it).

Not part of the product: a side-by-side reference implementation for speed comparisons only.
Prints one JSON object with the timings (seconds) of each repeated run.
"""
import json
import math
import sys
import time

import numpy as np


def intervals(y, p=0.95):
    """JCGM 101:2008 §7.7 probabilistically symmetric and shortest intervals (sorted copy)."""
    m = y.size
    q = int(p * m) if float(p * m).is_integer() else int(math.floor(p * m + 0.5))
    r = (m - q) // 2 if (m - q) % 2 == 0 else (m - q + 1) // 2
    s = np.sort(y)
    widths = s[q:] - s[: m - q]
    j = int(np.argmin(widths))
    return (s[r - 1], s[r + q - 1]), (s[j], s[j + q])


def continuity(rng, m):
    d = rng.normal(2.1, 0.08, m)
    vti_l = rng.normal(21.0, 1.5, m)
    vti_a = rng.normal(95.0, 4.0, m)
    angle = rng.uniform(-15.0, 15.0, m)
    return math.pi * d * d / 4.0 * vti_l / (vti_a / np.cos(np.radians(angle)))


def model_a(seed, m=1_000_000):
    rng = np.random.default_rng(seed)
    y = continuity(rng, m)
    mean, sd = y.mean(), y.std(ddof=1)
    sym, short = intervals(y)
    return mean, sd, sym, short


def model_b(seed, digits=2, p=0.95):
    """JCGM 101:2008 §7.9 adaptive procedure on model (a)."""
    rng = np.random.default_rng(seed)
    m = max(math.ceil(100 / (1 - p)), 10_000)
    ys, us, los, his, batches = [], [], [], [], []
    while True:
        y = continuity(rng, m)
        batches.append(y)
        ys.append(y.mean())
        us.append(y.std(ddof=1))
        sym, _ = intervals(y, p)
        los.append(sym[0])
        his.append(sym[1])
        h = len(batches)
        if h < 2:
            continue
        u = float(np.mean(us))
        ell = math.floor(math.log10(u)) - digits + 1
        if round(u / 10**ell) >= 10**digits:
            ell += 1
        delta = 0.5 * 10**ell
        sds = [np.std(v, ddof=1) / math.sqrt(h) for v in (ys, us, los, his)]
        if all(2 * s <= delta for s in sds):
            break
    y = np.concatenate(batches)
    sym, short = intervals(y, p)
    return y.size, y.mean(), y.std(ddof=1), sym, short


def model_c(height, weight, lvedd):
    """Haycock BSA and the PHN LV end-diastolic dimension Z-score (alpha 0.45, M 3.89, S 0.33)."""
    bad = ~((height >= 15) & (height <= 280) & (weight >= 0.2) & (weight <= 650))
    bsa = 0.024265 * weight**0.5378 * height**0.3964
    z = (lvedd / bsa**0.45 - 3.89) / 0.33
    z[bad] = np.nan
    outside = (bsa < 0.15) | (bsa > 2.4)
    return bsa, z, outside


def main():
    args = dict(zip(sys.argv[1::2], sys.argv[2::2]))
    runs = int(args.get("--runs", "5"))
    data = args.get("--data")
    out = {"numpy": np.__version__, "a": [], "b": [], "c": [], "b_trials": 0}
    for k in range(runs):
        t = time.perf_counter()
        model_a(1 + k)
        out["a"].append(time.perf_counter() - t)
        t = time.perf_counter()
        out["b_trials"] = model_b(1 + k)[0]
        out["b"].append(time.perf_counter() - t)
    if data:
        h = np.fromfile(f"{data}/height.f64", dtype="<f8")
        w = np.fromfile(f"{data}/weight.f64", dtype="<f8")
        x = np.fromfile(f"{data}/lvedd.f64", dtype="<f8")
        for _ in range(runs):
            t = time.perf_counter()
            model_c(h, w, x)
            out["c"].append(time.perf_counter() - t)
    print(json.dumps(out))


if __name__ == "__main__":
    main()
