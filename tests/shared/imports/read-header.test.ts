import { describe, expect, it } from 'vitest';
import { matchingName, readHeader } from '../../../shared/imports/read-header';

describe('readHeader', () => {
  it.each([
    ['Km (mM)', 'km', 'mM'],
    ['kcat [1/s]', 'kcat', '1/s'],
    ['kcat/Km (M-1 s-1)', 'kcat/km', 'M-1 s-1'],
    ['kcat/Km [1/(mM*s)]', 'kcat/km', '1/(mM*s)'],
    ['[S] (mM)', 's', 'mM'],
    ['Km SE (µM)', 'kmse', 'µM'],
    ['Temperature (°C)', 'temperature', '°C'],
    ['Km, mM', 'km', 'mM'],
    // Quantity calculus, quantity / unit (IUPAC Green Book, 3rd ed., 2007, §1.1).
    ['Km / mM', 'km', 'mM'],
  ])('reads %s as %s in %s', (header, name, unit) => {
    expect(readHeader(header)).toEqual({ text: header, name, unit });
  });

  it('keeps names that only look like a unit after a comma or slash', () => {
    expect(readHeader('kcat / Km')).toEqual({ text: 'kcat / Km', name: 'kcat/km', unit: null });
    expect(readHeader('Notes, comments')).toEqual({ text: 'Notes, comments', name: 'notescomments', unit: null });
    expect(readHeader('  Assay   date ')).toEqual({ text: 'Assay date', name: 'assaydate', unit: null });
  });
});

describe('matchingName', () => {
  it('compares names without case, spaces, underscores, hyphens, dots, commas or brackets', () => {
    expect(matchingName('K_m SE')).toBe('kmse');
    expect(matchingName('Assay-Date')).toBe('assaydate');
    expect(matchingName('[E]0')).toBe('e0');
  });
});
