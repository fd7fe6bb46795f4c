"""Plain numerical-Python reads of the benchmark CSV, for `npm run bench -- import` to print beside
Setpoint Critic's import: numpy.loadtxt on the bytes (decimal commas turned into points first, as
loadtxt has no decimal-mark option) and the standard csv module with float() per cell. Prints one
JSON object: seconds (wall and CPU) and peak resident memory of each read, rows and columns read.
Usage: python3 bench/importReference.py <file.csv> [--loadtxt-only]   (the second: numpy.loadtxt alone, for bench/importPairsBench.ts)
"""
import csv
import io
import json
import resource
import sys
import time

import numpy as np


def timed(read):
    wall, cpu = time.perf_counter(), time.process_time()
    shape = read()
    return {"wallSeconds": time.perf_counter() - wall, "cpuSeconds": time.process_time() - cpu, "shape": list(shape)}


def with_loadtxt(path):
    with open(path, "rb") as f:
        data = f.read().replace(b",", b".")
    return np.loadtxt(io.BytesIO(data), delimiter=";", skiprows=1).shape


def with_csv_module(path):
    with open(path, newline="") as f:
        reader = csv.reader(f, delimiter=";")
        next(reader)
        rows = [[float(cell.replace(",", ".")) for cell in row] for row in reader]
    return np.array(rows).shape


if __name__ == "__main__":
    path = sys.argv[1]
    result = {"numpyLoadtxt": timed(lambda: with_loadtxt(path))}
    if "--loadtxt-only" not in sys.argv:
        result["csvModule"] = timed(lambda: with_csv_module(path))
    result["peakRssMiB"] = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    result["numpy"] = np.__version__
    print(json.dumps(result))
