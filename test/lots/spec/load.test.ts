/** The spec file: YAML or JSON, zod-checked, every problem with its line and field. */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_SPEC_FILE } from '../../../src/lots/config.js';
import { describeSpecProblems, loadSpecFile, parseSpecText } from '../../../src/lots/spec/load.js';
import { tempDir } from '../harness.js';

const tmp = tempDir();
afterAll(() => tmp.remove());

const GOOD = `fab: Harrowgate Fab 3
products:
  HX-200P:
    type: p
    dopant: boron
    resistivityOhmCm: { min: 8, max: 12 }
`;

describe('spec file loading', () => {
  it('loads the demo specs, marked as demo', () => {
    const load = loadSpecFile(DEMO_SPEC_FILE, { demo: true });
    expect(load.ok).toBe(true);
    if (!load.ok) return;
    expect(load.catalog.demo).toBe(true);
    expect(load.catalog.fab).toBe('Harrowgate Fab 3');
    expect(load.catalog.products.map((p) => p.id)).toContain('HX-200P');
    // Look-up ignores letter case; defaults are filled in.
    expect(load.catalog.find('hx-200p')?.spread?.definition).toBe('range-over-mean');
  });

  it('reads JSON through the same parser', () => {
    const path = join(tmp.dir, 'specs.json');
    writeFileSync(path, JSON.stringify({ products: { 'NV-725N': { type: 'n', dopant: 'phosphorus', dopantDensityPerCm3: { min: 4e14, max: 6e14 } } } }));
    const load = loadSpecFile(path);
    expect(load.ok && load.catalog.find('NV-725N')?.dopantDensityPerCm3).toEqual({ min: 4e14, max: 6e14 });
  });

  it('a field error names the line, column and field path', () => {
    const text = GOOD.replace('max: 12', 'max: 7');
    const load = parseSpecText(text, 'specs.yaml');
    expect(load.ok).toBe(false);
    if (load.ok) return;
    expect(load.problems).toEqual([
      { line: 6, column: 38, field: 'products.HX-200P.resistivityOhmCm.max', message: 'min must be below max' },
    ]);
    expect(describeSpecProblems(load)).toContain('specs.yaml line 6, column 38 products.HX-200P.resistivityOhmCm.max: min must be below max');
  });

  it('a wrong dopant/type pair, an unknown field and a missing window are each reported', () => {
    const text = `products:
  HX-200P:
    type: n
    dopant: boron
    resistivityOhmCm: { min: 8, max: 12 }
  NV-725N:
    type: n
    dopant: phosphorus
    colour: blue
`;
    const load = parseSpecText(text, 'specs.yaml');
    expect(load.ok).toBe(false);
    if (load.ok) return;
    const byField = Object.fromEntries(load.problems.map((p) => [p.field, p]));
    expect(byField['products.HX-200P.type']).toMatchObject({ line: 3, message: 'boron makes p-type silicon, but type is n' });
    // Unknown key: reported on the product, whose line is where the key sits.
    expect(load.problems.find((p) => /colour/.test(p.message))).toMatchObject({ field: 'products.NV-725N.colour', line: 9 });
    expect(load.problems.some((p) => p.field === 'products.NV-725N' && /give a window/.test(p.message))).toBe(true);
  });

  it('a YAML syntax error and a duplicate product id give a line', () => {
    const broken = parseSpecText('products:\n  HX-200P:\n    type: p\n   dopant: [boron\n', 'specs.yaml');
    expect(broken.ok).toBe(false);
    if (!broken.ok) expect(broken.problems[0]?.line).toBeGreaterThanOrEqual(4);
    const dup = parseSpecText(`${GOOD}  HX-200P:\n    type: p\n    dopant: boron\n    resistivityOhmCm: { min: 1, max: 2 }\n`, 'specs.yaml');
    expect(dup.ok).toBe(false);
    if (!dup.ok) expect(dup.problems[0]).toMatchObject({ line: 7 });
    const caseDup = parseSpecText(`${GOOD}  hx-200p:\n    type: p\n    dopant: boron\n    resistivityOhmCm: { min: 1, max: 2 }\n`, 'specs.yaml');
    expect(!caseDup.ok && caseDup.problems[0]).toMatchObject({ line: 7, field: 'products.hx-200p' });
  });

  it('a missing file says so', () => {
    const load = loadSpecFile(join(tmp.dir, 'nope.yaml'));
    expect(!load.ok && load.problems[0]?.message).toBe('file not found');
  });
});
