/**
 * Issue 5 benchmark (`npm run bench:temperature`): temperature-aware physics.
 *
 *   - carriers at T through the public API (incomplete ionization + Klaassen resistivity),
 *     at a fixed temperature and with the temperature changing every call;
 *   - the neutrality kernel alone; the crossover solve; the reading temperature correction;
 *   - layer solves (Irvin): forward (Cs → R_s) and inverse (R_s → Cs).
 *
 * Targets (issue 5): a carriers solve under 20 µs, a layer solve under 2 ms. Speed is measured
 * here, never asserted in a test. Inputs are fixed sequences (no randomness) so runs compare.
 */
import { carriersAtTemperature } from '../src/physics/carriers/carriers.js';
import { intrinsicCrossover } from '../src/physics/carriers/crossover.js';
import { solveNeutrality } from '../src/physics/carriers/neutrality.js';
import { layerSheetResistance, layerSurfaceConcentration } from '../src/physics/layer/irvin-1962.js';
import { correctResistivityToReference } from '../src/physics/resistivity/temperature-correction.js';

interface Row {
  readonly name: string;
  readonly opsPerSecond: number;
  readonly usPerOp: number;
  readonly target?: string;
}

let sink = 0;
const MASK = 255;

function logSpaced(min: number, max: number, count: number): Float64Array {
  const out = new Float64Array(count);
  const a = Math.log10(min);
  const b = Math.log10(max);
  for (let i = 0; i < count; i++) out[i] = Math.pow(10, a + (b - a) * ((i * 0.618033988749895) % 1));
  return out;
}

/** Best of `rounds` rounds of `roundMs` each, after a warm-up (the machine is shared). */
function measure(name: string, body: (i: number) => number, target?: string, roundMs = 200, rounds = 5): Row {
  for (let i = 0; i < 300; i++) sink += body(i & MASK);
  let best = Number.POSITIVE_INFINITY;
  for (let r = 0; r < rounds; r++) {
    let ops = 0;
    const start = process.hrtime.bigint();
    let elapsed = 0;
    while (elapsed < roundMs * 1e6) {
      for (let i = 0; i < 16; i++) sink += body((ops + i) & MASK);
      ops += 16;
      elapsed = Number(process.hrtime.bigint() - start);
    }
    best = Math.min(best, elapsed / ops);
  }
  return { name, opsPerSecond: 1e9 / best, usPerOp: best / 1e3, ...(target ? { target } : {}) };
}

const DENSITY = logSpaced(1e13, 1e19, 256);
const TEMPS = new Float64Array(256).map((_, i) => 77 + ((i * 0.618033988749895) % 1) * (800 - 77));
const RS = logSpaced(5, 5000, 256);
const CS = logSpaced(1e17, 1e21, 256);
const RHO = logSpaced(1e-3, 1e3, 256);
const DOPANTS = ['boron', 'phosphorus', 'arsenic', 'antimony'] as const;

const rows: Row[] = [
  measure(
    'carriers API, 300 K (Si, one dopant, with resistivity)',
    (i) => {
      const o = carriersAtTemperature({ dopants: [{ dopant: DOPANTS[i & 3] as (typeof DOPANTS)[number], densityPerCm3: DENSITY[i] as number }], temperatureK: 300 });
      return o.ok ? o.value.electronDensityPerCm3 : 0;
    },
    '< 20 µs',
  ),
  measure(
    'carriers API, T varying 77–800 K every call',
    (i) => {
      const o = carriersAtTemperature({ dopants: [{ dopant: 'phosphorus', densityPerCm3: DENSITY[i] as number }], temperatureK: TEMPS[i] as number });
      return o.ok ? o.value.electronDensityPerCm3 : 0;
    },
    '< 20 µs',
  ),
  measure(
    'carriers API, compensated (B + P), T varying',
    (i) => {
      const o = carriersAtTemperature({
        dopants: [
          { dopant: 'boron', densityPerCm3: DENSITY[i] as number },
          { dopant: 'phosphorus', densityPerCm3: (DENSITY[(i + 7) & MASK] as number) * 0.5 },
        ],
        temperatureK: TEMPS[i] as number,
      });
      return o.ok ? o.value.holeDensityPerCm3 : 0;
    },
    '< 20 µs',
  ),
  measure('neutrality kernel alone (Brent on E_F)', (i) => {
    const T = TEMPS[i] as number;
    const s = solveNeutrality({
      donors: [{ densityPerCm3: DENSITY[i] as number, ionizationEnergyEv: 0.045, degeneracy: 2 }],
      acceptors: [],
      temperatureK: T,
      intrinsicDensityPerCm3: 5.29e19 * Math.pow(T / 300, 2.54) * Math.exp(-6726 / T),
      bandgapEv: 1.12,
      conductionBandDensityPerCm3: 2.86e19,
      valenceBandDensityPerCm3: 3.1e19,
    });
    return s.electronDensityPerCm3;
  }),
  measure('crossover temperature (Brent in 1/T)', (i) => {
    const o = intrinsicCrossover({ netDopingPerCm3: (DENSITY[i] as number) / 10 });
    return o.ok ? o.value.temperatureK : 0;
  }),
  measure('reading corrected to 23 °C (self-consistent, Klaassen)', (i) => {
    const o = correctResistivityToReference({ resistivityOhmCm: RHO[i] as number, temperatureK: 300.15, dopant: 'boron' });
    return o.ok ? o.value.resistivityOhmCm : 0;
  }),
  measure(
    'layer forward: Cs → R_s (erfc on 1e15 p, xj 0.8 µm, Klaassen)',
    (i) => {
      const o = layerSheetResistance({ profile: 'erfc', dopant: 'phosphorus', backgroundDopant: 'boron', backgroundDensityPerCm3: 1e15, junctionDepthCm: 0.8e-4, surfaceConcentrationPerCm3: CS[i] as number });
      return o.ok ? o.value.sheetResistanceOhmPerSq : 0;
    },
    '< 2 ms',
  ),
  measure(
    'layer inverse: R_s → Cs (erfc on 1e15 p, xj 0.8 µm, Klaassen)',
    (i) => {
      const o = layerSurfaceConcentration({ profile: 'erfc', dopant: 'phosphorus', backgroundDopant: 'boron', backgroundDensityPerCm3: 1e15, junctionDepthCm: 0.8e-4, sheetResistanceOhmPerSq: RS[i] as number });
      return o.ok ? o.value.surfaceConcentrationPerCm3 : 0;
    },
    '< 2 ms',
  ),
  measure(
    'layer inverse: R_s → Cs (Gaussian, n on p, Masetti)',
    (i) => {
      const o = layerSurfaceConcentration({ profile: 'gaussian', dopant: 'boron', backgroundDopant: 'phosphorus', backgroundDensityPerCm3: 1e15, junctionDepthCm: 0.8e-4, sheetResistanceOhmPerSq: RS[i] as number, mobilityModelId: 'masetti-1983' });
      return o.ok ? o.value.surfaceConcentrationPerCm3 : 0;
    },
    '< 2 ms',
  ),
];

const width = Math.max(...rows.map((r) => r.name.length));
console.log(`${'benchmark'.padEnd(width)}  ${'ops/s'.padStart(10)}  ${'µs/op'.padStart(9)}  target`);
for (const r of rows) {
  console.log(`${r.name.padEnd(width)}  ${r.opsPerSecond.toFixed(0).padStart(10)}  ${r.usPerOp.toFixed(2).padStart(9)}  ${r.target ?? ''}`);
}
if (sink === 42) console.log('');
