/**
 * The NIST StRD "Thurber" dataset (fixtures/nist-strd-thurber.csv) against ASTM F723.
 *
 * Interpretation (ours, see fixtures/README.md and docs/references.md): x = log10(ρ / Ω·cm) and
 * y = electron mobility (cm²/V·s) in phosphorus-doped silicon, so N = 1/(q·ρ·μ). The
 * tolerance is F723's 4.5 % for phosphorus (ASTM F723-99).
 *
 * Finding: one point fails, x = −1.501 (μ = 401.672). Its mobility is above that of its
 * neighbour at higher resistivity (x = −1.46, μ = 390.724), against the trend of every other
 * pair: mobility rises as doping falls. It sits about 10 % off the smooth curve in N, 5 % in ρ:
 * scatter in the measurement (StRD publishes the data with their scatter to test nonlinear
 * regression), not an error of the conversion or of our reading of the columns.
 * In the ρ→N direction the point x = −1.212 is also just outside, at −4.51 %: the two F723
 * fits (ρ→N and N→ρ) are separate and themselves differ by up to 4.5 %.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ELEMENTARY_CHARGE_C } from '../../../src/physics/constants.js';
import {
  f723PhosphorusDensityPerCm3,
  f723PhosphorusResistivityOhmCm,
} from '../../../src/physics/resistivity/astm-f723.js';

interface Point {
  readonly x: number;
  readonly mobilityCm2PerVs: number;
  readonly resistivityOhmCm: number;
  readonly dopantDensityPerCm3: number;
}

function load(): Point[] {
  const text = readFileSync(new URL('../../../fixtures/nist-strd-thurber.csv', import.meta.url), 'utf8');
  const rows = text.split(/\r?\n/).filter((l) => l.trim() !== '' && !l.startsWith('#'));
  expect(rows[0]).toBe('x,y');
  return rows.slice(1).map((row) => {
    const [x, y] = row.split(',').map(Number) as [number, number];
    const rho = Math.pow(10, x);
    return { x, mobilityCm2PerVs: y, resistivityOhmCm: rho, dopantDensityPerCm3: 1 / (ELEMENTARY_CHARGE_C * rho * y) };
  });
}

const TOL = 0.045; // ASTM F723-99, phosphorus

describe('NIST StRD Thurber data against the ASTM F723 phosphorus conversion', () => {
  const points = load();

  it('has the 37 published observations', () => {
    expect(points).toHaveLength(37);
  });

  it('N = 1/(qρμ) → F723 N→ρ reproduces the measured ρ within 4.5 % at all points but one (x = −1.501)', () => {
    const outside = points.filter(
      (p) => Math.abs(f723PhosphorusResistivityOhmCm(p.dopantDensityPerCm3) / p.resistivityOhmCm - 1) > TOL,
    );
    expect(outside.map((p) => p.x)).toEqual([-1.501]);
  });

  it('F723 ρ→N matches N = 1/(qρμ) within 4.5 % at all points but x = −1.501 and the borderline x = −1.212', () => {
    const deviation = (p: Point) => p.dopantDensityPerCm3 / f723PhosphorusDensityPerCm3(p.resistivityOhmCm) - 1;
    const outside = points.filter((p) => Math.abs(deviation(p)) > TOL).map((p) => p.x);
    expect(outside.sort((a, b) => a - b)).toEqual([-1.501, -1.212]);
    // The borderline point misses by less than 0.1 % of N; the outlier by about 10 %.
    const borderline = points.find((p) => p.x === -1.212) as Point;
    expect(Math.abs(deviation(borderline))).toBeLessThan(TOL + 0.001);
  });

  it('the failing point breaks the monotonic trend of mobility with resistivity (why it fails)', () => {
    const sorted = [...points].sort((a, b) => a.x - b.x);
    const i = sorted.findIndex((p) => p.x === -1.501);
    const next = sorted[i + 1] as Point;
    expect(next.x).toBe(-1.46);
    expect(sorted[i]!.mobilityCm2PerVs).toBeGreaterThan(next.mobilityCm2PerVs);
  });
});
