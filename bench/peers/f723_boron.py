# The same answer as `shiftprobe --json "rho 8.2 ohm-cm p"` in a minimal script, for bench:start:
# ASTM F723-99 boron, resistivity -> density (the form used in src/physics/resistivity/astm-f723.ts).
# Prints one JSON object.
import json, sys
rho = float(sys.argv[1]) if len(sys.argv) > 1 else 8.2
n = 1.330e16 / rho + 1.082e17 / (rho * (1 + (54.56 * rho) ** 1.105))
print(json.dumps({"ok": True, "values": {"dopantDensityPerCm3": {"value": n, "unit": "cm-3"}}}))
