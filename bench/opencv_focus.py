#!/usr/bin/env python3
"""Times OpenCV (Debian's python3-opencv) on the bench frames, single-threaded.

Usage: /usr/bin/python3 bench/opencv_focus.py [--repeat N] FILE...
Prints one JSON object: {"opencv": version, "frames": [{file, width, height, readMs,
laplacianVarianceMs, tenengradMs, laplacianVariance, tenengrad}]}. Times are medians of N runs.

Measures (the usual OpenCV idioms):
  variance of Laplacian: cv2.Laplacian(grey, cv2.CV_64F).var()   (Pech-Pacheco et al. 2000)
  Tenengrad: sum(Gx^2 + Gy^2) of 3x3 cv2.Sobel in CV_64F         (Krotkov 1987)
"""
import json
import statistics
import sys
import time

import cv2
import numpy as np

cv2.setNumThreads(1)


def median_ms(fn, repeat):
    times = []
    result = None
    for _ in range(repeat):
        t0 = time.perf_counter()
        result = fn()
        times.append((time.perf_counter() - t0) * 1000)
    return statistics.median(times), result


def main(argv):
    repeat = 5
    if len(argv) >= 2 and argv[0] == "--repeat":
        repeat = int(argv[1])
        argv = argv[2:]
    frames = []
    for path in argv:
        read_ms, grey = median_ms(lambda: cv2.imread(path, cv2.IMREAD_GRAYSCALE), repeat)
        if grey is None:
            raise SystemExit(f"opencv_focus: cannot read {path}")
        lap_ms, lap = median_ms(lambda: cv2.Laplacian(grey, cv2.CV_64F).var(), repeat)

        def tenengrad():
            gx = cv2.Sobel(grey, cv2.CV_64F, 1, 0, ksize=3)
            gy = cv2.Sobel(grey, cv2.CV_64F, 0, 1, ksize=3)
            return float(np.sum(gx * gx + gy * gy))

        ten_ms, ten = median_ms(tenengrad, repeat)
        frames.append(
            {
                "file": path,
                "width": int(grey.shape[1]),
                "height": int(grey.shape[0]),
                "readMs": read_ms,
                "laplacianVarianceMs": lap_ms,
                "tenengradMs": ten_ms,
                "laplacianVariance": float(lap),
                "tenengrad": ten,
            }
        )
    print(json.dumps({"opencv": cv2.__version__, "threads": cv2.getNumThreads(), "frames": frames}))


if __name__ == "__main__":
    main(sys.argv[1:])
