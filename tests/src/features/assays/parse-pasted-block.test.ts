import { describe, expect, it } from 'vitest';
import { phRateKindOfUnit } from '@shared/imports/unit-spelling';
import { parsePastedBlock, phBlock, rateBlock, readPastedNumber, splitPastedText } from '@/features/assays/lib/parse-pasted-block';

// Invented rates: the tests are about reading a block, not about kinetics.
describe('splitPastedText', () => {
  it('splits a spreadsheet block on tabs and drops blank lines and surrounding quotes', () => {
    expect(splitPastedText('a\tb\r\n\r\n"1"\t2\n')).toEqual({ rows: [['a', 'b'], ['1', '2']], delimiter: '\t' });
  });

  it('falls back to semicolons, commas and runs of spaces', () => {
    expect(splitPastedText('1;2\n3;4').delimiter).toBe(';');
    expect(splitPastedText('1,2\n3,4').rows).toEqual([['1', '2'], ['3', '4']]);
    expect(splitPastedText('1   2\n 3 4').rows).toEqual([['1', '2'], ['3', '4']]);
  });
});

describe('readPastedNumber', () => {
  it('reads decimals, exponents, a decimal comma and the minus sign, and nothing else', () => {
    expect(readPastedNumber('2.5e-4', false)).toBe(2.5e-4);
    expect(readPastedNumber('0,25', true)).toBe(0.25);
    expect(readPastedNumber('1 250', true)).toBe(1250);
    expect(readPastedNumber('\u22120.5', true)).toBe(-0.5);
    expect(readPastedNumber('', true)).toBeNull();
    expect(readPastedNumber('0,25', false)).toBeNaN();
    expect(readPastedNumber('12 mM', true)).toBeNaN();
    expect(readPastedNumber('0x10', true)).toBeNaN();
  });
});

describe('parsePastedBlock (rates)', () => {
  it('reads a header with units and turns replicate columns into replicates', () => {
    const block = parsePastedBlock('[S] (mM)\tv0 rep 1 (µM/min)\tv0 rep 2 (µM/min)\n0.05\t10.1\t9.8\n0.1\t18.2\t\n0.2\t30.5\t31', rateBlock);
    expect(block.problems).toEqual([]);
    expect(block.xUnit).toBe('mM');
    expect(block.yUnit).toBe('µM/min');
    expect(block.replicateCount).toBe(2);
    expect(block.rows).toEqual([
      { x: 0.05, y: [10.1, 9.8] },
      { x: 0.1, y: [18.2, null] },
      { x: 0.2, y: [30.5, 31] },
    ]);
  });

  it('reads units written after a slash or in the middle of a header, and ASCII spellings of micro', () => {
    const slash = parsePastedBlock('S / uM,v0 / nM/s\n1,2\n3,4', rateBlock);
    expect([slash.xUnit, slash.yUnit]).toEqual(['µM', 'nM/s']);
    const middle = parsePastedBlock('[S] (mM)\tv0 (umol/L/min) plate 1\n1\t2', rateBlock);
    expect(middle.yUnit).toBe('µM/min');
  });

  it('takes the x column a header names, even when it is not the first', () => {
    const block = parsePastedBlock('v0 (µM/min)\tSubstrate (mM)\n5\t0.1\n9\t0.2', rateBlock);
    expect(block.xUnit).toBe('mM');
    expect(block.rows).toEqual([
      { x: 0.1, y: [5] },
      { x: 0.2, y: [9] },
    ]);
  });

  it('skips title rows and summary columns, and says so', () => {
    const block = parsePastedBlock('Plate 3, 45 °C\n[S] (mM)\tv0 (µM/min)\tv0 (µM/min)\tMean\tSD\n0.1\t1\t1.2\t1.1\t0.1', rateBlock);
    expect(block.rows).toEqual([{ x: 0.1, y: [1, 1.2] }]);
    expect(block.notes.join(' ')).toMatch(/Skipped 1 title row/);
    expect(block.notes.join(' ')).toMatch(/“Mean”/);
    expect(block.notes.join(' ')).toMatch(/“SD”/);
  });

  it('reads decimal commas in a tab-separated block', () => {
    expect(parsePastedBlock('0,05\t12,5\n0,1\t20', rateBlock).rows).toEqual([
      { x: 0.05, y: [12.5] },
      { x: 0.1, y: [20] },
    ]);
  });

  it('reports units it does not convert, mixed units and cells that are not numbers, by line', () => {
    const unknownUnit = parsePastedBlock('[S] (mg/mL)\tv0 (µM)\n1\t2', rateBlock);
    expect(unknownUnit.xUnit).toBeUndefined();
    expect(unknownUnit.problems).toEqual([
      'The unit “mg/mL” of “[S] (mg/mL)” is not a concentration Kcatalog converts; choose the unit below.',
      'The unit “µM” of “v0 (µM)” is not a rate unit Kcatalog converts; choose the unit below.',
    ]);
    const mixed = parsePastedBlock('[S] (mM)\tv0 (µM/min)\tv0 (µM/s)\n1\t2\t3', rateBlock);
    expect(mixed.problems[0]).toMatch(/different units \(µM\/min, µM\/s\)/);
    const bad = parsePastedBlock('[S] (mM)\tv0 (µM/min)\n0.1\t1.2.3\nabc', rateBlock);
    expect(bad.problems).toEqual(['Line 2, replicate 1: “1.2.3” is not a number.', 'Line 3: “abc” is not a number.']);
    expect(bad.rows).toEqual([{ x: 0.1, y: [null] }]);
  });

  it('says when nothing can be read', () => {
    expect(parsePastedBlock('Well\tA405\nA1\t0.2', rateBlock).problems).toEqual(['No row starts with a number, so there is nothing to read.']);
  });
});

describe('parsePastedBlock (pH series)', () => {
  it('reads pH and a rate whose unit says what was measured', () => {
    const block = parsePastedBlock('pH\tkcat/Km (M-1 s-1)\n4.0\t1200\n5.0\t3400', phBlock);
    expect(block.yUnit).toBe('M⁻¹ s⁻¹');
    expect(phRateKindOfUnit(block.yUnit!)).toBe('kcatOverKm');
    expect(block.rows).toEqual([
      { x: 4, y: [1200] },
      { x: 5, y: [3400] },
    ]);
    expect(phRateKindOfUnit(parsePastedBlock('pH\tkcat (1/s)\n4\t1', phBlock).yUnit!)).toBe('kcat');
  });
});
