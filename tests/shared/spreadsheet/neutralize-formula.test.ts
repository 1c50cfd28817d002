import { describe, expect, it } from 'vitest';
import { neutralizeFormula, restoreNeutralizedFormula } from '../../../shared/spreadsheet/neutralize-formula';

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells beginning with =, +, -, @, tab
// (0x09) or carriage return (0x0D) are prefixed with a single quote.
describe('neutralizeFormula', () => {
  it.each(['=1+1', '+SUM(A1:A2)', '-2+3', '@SUM(A1)', '\tcmd', '\rcmd', '=HYPERLINK("http://example.invalid","x")'])('guards %j', (text) => {
    expect(neutralizeFormula(text)).toBe(`'${text}`);
  });

  it.each(['C112A', 'p.[Cys112Ala;His190Asn]', '', ' =not at the start', "'quoted", '1e-3'])('leaves %j as it is', (text) => {
    expect(neutralizeFormula(text)).toBe(text);
  });
});

describe('restoreNeutralizedFormula', () => {
  it('takes the guard off exactly what neutralizeFormula guarded', () => {
    for (const text of ['=1+1', '+x', '-x', '@x', '\tx', '\rx', "'s-trans", 'plain', "'"]) {
      expect(restoreNeutralizedFormula(neutralizeFormula(text))).toBe(text);
    }
    expect(restoreNeutralizedFormula("'s-trans")).toBe("'s-trans");
  });
});
