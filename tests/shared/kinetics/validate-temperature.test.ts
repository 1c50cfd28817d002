import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { validateTemperature } from '../../../shared/kinetics/validate-temperature';

describe('validateTemperature', () => {
  it('accepts a positive kelvin temperature', () => {
    expect(() => validateTemperature('f', 298.15)).not.toThrow();
  });

  it.each([0, -5, Number.NaN, Number.POSITIVE_INFINITY])('throws KineticsInputError for %s', (temperature) => {
    expect(() => validateTemperature('f', temperature)).toThrow(
      new KineticsInputError('f requires a finite, positive temperature in kelvin'),
    );
  });
});
