import { describe, expect, it } from 'vitest';
import { validateEcNumber } from '../../../shared/sequence/ec-number';

// Format from NC-IUBMB, Enzyme Nomenclature (iubmb.qmul.ac.uk/enzyme/rules.html) and K. Tipton and
// A. McDonald, "A Brief Guide to Enzyme Classification and Nomenclature": four components separated
// by full stops, classes 1-7 (translocases, class 7, added in 2018). EC 3.5.1.4 (amidase) and
// EC 3.4.11.4 (tripeptide aminopeptidase) are entries of the IUBMB list. The partial form `3.5.1.-`
// and the preliminary serial `3.5.1.n3` are the conventions of the ENZYME and UniProtKB databases.
describe('validateEcNumber', () => {
  it.each([
    ['3.5.1.4', '3.5.1.4'],
    ['3.4.11.4', '3.4.11.4'],
    ['1.1.1.1', '1.1.1.1'],
    ['7.1.1.1', '7.1.1.1'],
    ['2.7.11.30', '2.7.11.30'],
    ['EC 3.5.1.4', '3.5.1.4'],
    ['ec3.5.1.4', '3.5.1.4'],
    ['EC:3.5.1.4', '3.5.1.4'],
    ['  3.5.1.4 ', '3.5.1.4'],
  ])('accepts %j as the complete number %s', (text, value) => {
    expect(validateEcNumber(text)).toEqual({ ok: true, value, kind: 'complete' });
  });

  it.each(['3.5.1.-', '3.5.-.-', '3.-.-.-'])('accepts the partial number %s', (text) => {
    expect(validateEcNumber(text)).toEqual({ ok: true, value: text, kind: 'partial' });
  });

  it('accepts a preliminary serial number', () => {
    expect(validateEcNumber('3.5.1.n3')).toEqual({ ok: true, value: '3.5.1.n3', kind: 'preliminary' });
  });

  it('refuses an empty number', () => {
    expect(validateEcNumber(' EC ')).toEqual({
      ok: false,
      message: 'EC number is empty (e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown)',
    });
  });

  it.each([
    ['3.5.1', "EC number '3.5.1' has 3 parts; it needs four separated by dots (e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown)"],
    ['3', "EC number '3' has 1 part; it needs four separated by dots (e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown)"],
    ['3.5.1.4.2', "EC number '3.5.1.4.2' has 5 parts; it needs four separated by dots (e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown)"],
  ])('refuses %j for its number of parts', (text, message) => {
    expect(validateEcNumber(text)).toEqual({ ok: false, message });
  });

  it.each([
    ['8.1.1.1', 'EC class must be 1 to 7 (the first part), got 8'],
    ['0.1.1.1', 'EC class must be 1 to 7 (the first part), got 0'],
    ['x.1.1.1', 'EC class must be 1 to 7 (the first part), got x'],
    ['-.-.-.-', 'EC class (the first part) must be known, 1 to 7'],
  ])('refuses %j for its class', (text, message) => {
    expect(validateEcNumber(text)).toEqual({ ok: false, message });
  });

  it.each([
    ['3.5.-.4', "EC number '3.5.-.4' has a known level after an unknown one; once a part is '-', the following parts must be '-' too"],
    ['3.05.1.4', "EC number '3.05.1.4': the subclass (part 2) is '05'; it must be a whole number from 1 without leading zeros, or '-'"],
    ['3.5..4', "EC number '3.5..4': the sub-subclass (part 3) is ''; it must be a whole number from 1 without leading zeros, or '-'"],
    ['3.5.a.-', "EC number '3.5.a.-': the sub-subclass (part 3) is 'a'; it must be a whole number from 1 without leading zeros, or '-'"],
    ['3.5.1.0', "EC number '3.5.1.0': the serial number (part 4) is '0'; it must be a whole number from 1 without leading zeros, 'n' and a number for a preliminary one, or '-'"],
    ['3.5.1.n', "EC number '3.5.1.n': the serial number (part 4) is 'n'; it must be a whole number from 1 without leading zeros, 'n' and a number for a preliminary one, or '-'"],
    ['3.5.n1.1', "EC number '3.5.n1.1': the sub-subclass (part 3) is 'n1'; it must be a whole number from 1 without leading zeros, or '-'"],
  ])('refuses %j for a malformed part', (text, message) => {
    expect(validateEcNumber(text)).toEqual({ ok: false, message });
  });
});
