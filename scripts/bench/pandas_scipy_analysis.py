#!/usr/bin/python3
"""The comparison side of `npm run bench:signal`: the same bulk work as `npm run analyze` on a recording file, done
the usual way with pandas and scipy, timed from the command line as a whole (interpreter and imports included).

Run with Debian's python3-pandas and python3-scipy (/usr/bin/python3, not a pyenv python):
    /usr/bin/python3 scripts/bench/pandas_scipy_analysis.py FILE.csv lib/signal/layouts/pair-8.json

Steps, as lib/signal does them (README "Processing"):
  1. pandas.read_csv of the file (`# key: value` metadata lines skipped as comments);
  2. a zero-lag Butterworth low-pass on every sensor column: scipy.signal.butter(N, Wn, output='sos', fs=fs) and
     scipy.signal.sosfiltfilt(sos, x, axis=0) with its default odd padding, the design cutoff corrected for two passes
     (Winter, Biomechanics and Motor Control of Human Movement, 4th ed., section 3.4.4.3; lib/signal/filter/butterworth.ts);
  3. sums: per-foot force, total, lead % and the centre of pressure of the stance (force-weighted sensor positions);
  4. COP speed from np.gradient, and argmin/argmax searches: the stillest sample (minimum COP speed) before each
     lead-% peak over windows of 4 s, a stand-in for the event search.
It prints one JSON line with the sample count, a checksum of the filtered forces and the number of windows, so a
run can be told apart from one that skipped work. Sources: scipy.signal.butter and scipy.signal.sosfiltfilt
(https://docs.scipy.org/doc/scipy/reference/generated/scipy.signal.butter.html,
https://docs.scipy.org/doc/scipy/reference/generated/scipy.signal.sosfiltfilt.html), pandas.read_csv
(https://pandas.pydata.org/docs/reference/api/pandas.read_csv.html).
"""
import json
import math
import sys

import numpy as np
import pandas as pd
from scipy import signal

CUTOFF_HZ = 20.0  # lib/signal/filter/zero-lag.ts DEFAULT_CUTOFF_HZ
ORDER = 2  # single-pass order (DEFAULT_FILTER_ORDER)


def corrected_cutoff(fc, fs, passes=2, order=ORDER):
    c = (2 ** (1 / passes) - 1) ** (1 / (2 * order))
    return fs / math.pi * math.atan(math.tan(math.pi * fc / fs) / c)


def main(path, layout_path):
    with open(layout_path, encoding="utf-8") as f:
        layout = json.load(f)
    frame = pd.read_csv(path, comment="#", skip_blank_lines=True)
    time = frame["time_s"].to_numpy()
    fs = round(1 / np.median(np.diff(time)))
    ids = [s["id"] for s in layout["sensors"]]
    forces = frame[ids].to_numpy(dtype=float)
    sos = signal.butter(ORDER, corrected_cutoff(CUTOFF_HZ, fs), btype="low", output="sos", fs=fs)
    filtered = signal.sosfiltfilt(sos, forces, axis=0)
    filtered[filtered < 0] = 0.0

    left = np.array([s["foot"] == "left" for s in layout["sensors"]])
    x = np.array([s["x_mm"] for s in layout["sensors"]], dtype=float)
    y = np.array([s["y_mm"] for s in layout["sensors"]], dtype=float)
    half = 200.0  # half of a 400 mm stance: the feet sit at -200 and +200 mm
    x_stance = np.where(left, x - half, x + half)
    left_n = filtered[:, left].sum(axis=1)
    right_n = filtered[:, ~left].sum(axis=1)
    total = left_n + right_n
    with np.errstate(invalid="ignore", divide="ignore"):
        lead_pct = 100 * left_n / total
        cop_x = (filtered * x_stance).sum(axis=1) / total
        cop_y = (filtered * y).sum(axis=1) / total
    speed = np.hypot(np.gradient(cop_x, 1 / fs), np.gradient(cop_y, 1 / fs))

    window = int(4 * fs)
    found = 0
    for start in range(0, len(time) - window, window):
        seg = np.nan_to_num(lead_pct[start : start + window], nan=-1)
        peak = int(np.argmax(seg))
        if peak > 0:
            still = int(np.argmin(np.nan_to_num(speed[start : start + peak], nan=np.inf)))
            found += still >= 0
    print(json.dumps({"samples": int(len(time)), "fs": fs, "checksum": float(np.round(filtered.sum(), 3)), "windows": found}))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
