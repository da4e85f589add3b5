import { describe, expect, it } from 'vitest';
import { CONVERSION_MODELS, defaultConversionModel, findConversionModel } from '../../../src/physics/resistivity/registry.js';

describe('conversion model registry', () => {
  it('finds models by id and by short alias, case-insensitively', () => {
    expect(findConversionModel('f723')?.id).toBe('f723');
    expect(findConversionModel('ASTM-F723')?.id).toBe('f723');
    expect(findConversionModel('masetti')?.id).toBe('masetti-1983');
    expect(findConversionModel('Caughey-Thomas')?.id).toBe('caughey-thomas-1967');
    expect(findConversionModel('caughey thomas')?.id).toBe('caughey-thomas-1967');
    expect(findConversionModel('nope')).toBeUndefined();
  });
  it('gives every model a citation, equations, validity and a parameter table per dopant', () => {
    for (const m of CONVERSION_MODELS) {
      expect(m.citation.length).toBeGreaterThan(20);
      expect(m.equations.length).toBeGreaterThan(0);
      for (const d of m.dopants) {
        expect(m.validity[d]).toBeDefined();
        expect(m.domain[d]).toBeDefined();
        expect(m.parameters(d).length).toBeGreaterThan(0);
      }
    }
  });
  it('defaults per issue 2: F723 for B and P, Masetti for As, Sb by density', () => {
    expect(defaultConversionModel('boron').model.id).toBe('f723');
    expect(defaultConversionModel('phosphorus').model.id).toBe('f723');
    expect(defaultConversionModel('arsenic').model.id).toBe('masetti-1983');
    const low = defaultConversionModel('antimony', 1e18);
    expect(low.model.id).toBe('f723-phosphorus-for-as-sb');
    expect(low.problems.map((p) => p.code)).toEqual(['substitute_model']);
    const high = defaultConversionModel('antimony', 3e19);
    expect(high.model.id).toBe('masetti-1983-as-for-sb');
    expect(high.problems.map((p) => p.code)).toEqual(['substitute_model', 'estimate_only']);
  });
  it('Caughey–Thomas says its parameters are from memory', () => {
    expect(findConversionModel('caughey-thomas')?.notes.join(' ')).toMatch(/from memory/);
  });
});
