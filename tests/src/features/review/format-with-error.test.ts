import { describe, expect, it } from 'vitest';
import { kmWithError, withError } from '@/features/review/format-with-error';

// Writing a value with its standard error under one shared power of ten, (a ± b) × 10ⁿ, is common practice.
describe('withError', () => {
  it('writes plain numbers between 0.01 and 10,000', () => {
    expect(withError({ value: 0.8494, se: 0.02187 })).toBe('0.849 ± 0.022');
    expect(withError({ value: 12.5, se: null })).toBe('12.5');
    expect(withError({ value: 0.0324, se: 0.000514 })).toBe('0.0324 ± 0.00051');
    expect(withError({ value: 0.818, se: 0.0103 })).toBe('0.818 ± 0.010');
    expect(withError({ value: 2500, se: 123 })).toBe('2500 ± 120');
  });

  it('shares one power of ten outside that range, and always when asked', () => {
    expect(withError({ value: 2.86e-3, se: 6.15e-5 })).toBe('(2.86 ± 0.06) × 10⁻³');
    expect(withError({ value: 221.3, se: 13.2 }, true)).toBe('(2.21 ± 0.13) × 10²');
    expect(withError({ value: 1.98, se: 0.14 }, true)).toBe('(1.98 ± 0.14) × 10⁰');
    expect(withError({ value: 3.2e5, se: null }, true)).toBe('3.20 × 10⁵');
  });

  it('writes a dash for a missing value', () => {
    expect(withError(null)).toBe('—');
  });
});

describe('kmWithError', () => {
  it('puts Km and its error in the unit that suits Km (1 mM = 10⁻³ M, 1 µM = 10⁻⁶ M)', () => {
    expect(kmWithError({ value: 3.84e-3, se: 2.94e-4 })).toBe('3.84 ± 0.29 mM');
    expect(kmWithError({ value: 2.5e-5, se: 1.2e-6 })).toBe('25 ± 1.2 µM');
    expect(kmWithError({ value: 4e-9, se: null })).toBe('4 nM');
  });
});
