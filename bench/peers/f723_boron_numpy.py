# The vectorised numerical-Python peer of the batch path (npm run bench): ASTM F723-99 boron,
# resistivity -> density, over the same log-spaced inputs as bench/physics.bench.ts, with NumPy.
# Prints one JSON object: {"sizes": {"10000": ns per element, "100000": ...}, "numpy": "<version>"}
# (the best of 20 rounds per size).
import json, time
import numpy as np

sizes = {}
for count in (10_000, 100_000):
    i = np.arange(count)
    rho = 10.0 ** (-3 + 6 * ((i * 0.618033988749895) % 1))
    best = float("inf")
    for _ in range(20):
        start = time.perf_counter()
        n = 1.330e16 / rho + 1.082e17 / (rho * (1 + (54.56 * rho) ** 1.105))
        best = min(best, time.perf_counter() - start)
    sizes[str(count)] = best / count * 1e9
print(json.dumps({"sizes": sizes, "numpy": np.__version__}))
