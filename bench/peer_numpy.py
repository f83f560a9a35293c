"""Vectorised numpy peer of the sonorigor benchmark models (bench/compare_numpy.ts runs it).

Not part of the product: a side-by-side reference implementation for speed comparisons only.
Answers timed requests one per line on stdin (see main), so that runs can be alternated.
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


def summary(mean, sd, sym, short):
    return {"mean": float(mean), "sd": float(sd), "symmetric": [float(sym[0]), float(sym[1])],
            "shortest": [float(short[0]), float(short[1])]}


def main():
    """Serves one timed run per request line, so the caller can alternate its own runs with numpy's:

    "a SEED" -> model (a); "b SEED" -> model (b); "load DIR" reads the cohort columns;
    "c" -> model (c); "sort SEED" -> np.sort of model (a)'s 10^6 values alone. Each answer is one
    JSON line with the time in seconds and the results (for the caller's agreement check).
    """
    cohort = None
    print(json.dumps({"numpy": np.__version__}), flush=True)
    for line in sys.stdin:
        words = line.split()
        if not words:
            continue
        what, arg = words[0], (words[1] if len(words) > 1 else "")
        if what == "load":
            cohort = [np.fromfile(f"{arg}/{n}.f64", dtype="<f8") for n in ("height", "weight", "lvedd")]
            out = {"rows": int(cohort[0].size)}
        elif what == "a":
            t = time.perf_counter()
            r = model_a(int(arg))
            out = {"t": time.perf_counter() - t, **summary(*r)}
        elif what == "b":
            t = time.perf_counter()
            r = model_b(int(arg))
            out = {"t": time.perf_counter() - t, "trials": int(r[0]), **summary(*r[1:])}
        elif what == "c":
            t = time.perf_counter()
            bsa, z, outside = model_c(*cohort)
            out = {"t": time.perf_counter() - t, "bsaSum": float(np.sum(bsa)),
                   "zSum": float(np.nansum(z)), "zMissing": int(np.isnan(z).sum()),
                   "outside": int(outside.sum()), "z0": float(z[0])}
        elif what == "sort":
            y = continuity(np.random.default_rng(int(arg)), 1_000_000)
            t = time.perf_counter()
            np.sort(y)
            out = {"t": time.perf_counter() - t}
        else:
            out = {"error": f"unknown request {what!r}"}
        print(json.dumps(out), flush=True)


if __name__ == "__main__":
    main()
