/**
 * How complete an EC number is:
 * - `complete`: four numbers, an enzyme of the IUBMB list (`3.5.1.4`);
 * - `partial`: the class is known, the finest levels are not and are written `-` (`3.5.1.-`);
 * - `preliminary`: a serial number not yet assigned by IUBMB, written `n` plus a number (`3.5.1.n3`).
 */
export type EcNumberKind = 'complete' | 'partial' | 'preliminary';

export type EcNumberCheck =
  | { readonly ok: true; readonly value: string; readonly kind: EcNumberKind }
  | { readonly ok: false; readonly message: string };

/** The seven IUBMB enzyme classes; 7 (translocases) was added in 2018. */
export const ecClasses = [
  { number: 1, name: 'oxidoreductases' },
  { number: 2, name: 'transferases' },
  { number: 3, name: 'hydrolases' },
  { number: 4, name: 'lyases' },
  { number: 5, name: 'isomerases' },
  { number: 6, name: 'ligases' },
  { number: 7, name: 'translocases' },
] as const;

const NUMBER = /^[1-9][0-9]*$/;
const PRELIMINARY_SERIAL = /^n[1-9][0-9]*$/;
const EC_PREFIX = /^EC[\s:]*/i;
const EXAMPLE = 'e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown';

/**
 * Validates an Enzyme Commission number and returns it in canonical form (no `EC` prefix).
 *
 * The number has four parts separated by full stops: class, subclass, sub-subclass and serial number
 * (NC-IUBMB, "Enzyme Nomenclature", rules at iubmb.qmul.ac.uk/enzyme/rules.html; K. Tipton and
 * A. McDonald, "A Brief Guide to Enzyme Classification and Nomenclature"). The class is 1 to 7; the
 * other parts are positive whole numbers without leading zeros. Two conventions of the ENZYME and
 * UniProtKB databases are accepted as well, since records copied from them use them: `-` for the
 * unknown trailing levels of a partly classified enzyme (`3.5.1.-`, `3.5.-.-`, `3.-.-.-`), and a
 * preliminary serial number `n1`, `n2`, ... (`3.5.1.n3`) for an activity awaiting an IUBMB number.
 * A leading `EC`, `EC ` or `EC:` is dropped.
 *
 * @param text what the user typed
 * @returns `{ ok: true, value, kind }` or `{ ok: false, message }`
 * @example validateEcNumber('EC 3.5.1.4') // { ok: true, value: '3.5.1.4', kind: 'complete' }
 * @example validateEcNumber('3.5.1.n3') // { ok: true, value: '3.5.1.n3', kind: 'preliminary' }
 * @example validateEcNumber('8.1.1.1') // { ok: false, message: 'EC class must be 1 to 7 (the first part), got 8' }
 */
export function validateEcNumber(text: string): EcNumberCheck {
  const value = text.trim().replace(EC_PREFIX, '');
  if (value === '') return { ok: false, message: `EC number is empty (${EXAMPLE})` };

  const parts = value.split('.');
  if (parts.length !== 4) {
    return {
      ok: false,
      message:
        `EC number '${value}' has ${parts.length} part${parts.length === 1 ? '' : 's'}; ` +
        `it needs four separated by dots (${EXAMPLE})`,
    };
  }

  const [classPart] = parts;
  if (classPart === '-') return { ok: false, message: 'EC class (the first part) must be known, 1 to 7' };
  if (!NUMBER.test(classPart) || Number(classPart) > ecClasses.length) {
    return { ok: false, message: `EC class must be 1 to 7 (the first part), got ${classPart}` };
  }

  const firstUnknown = parts.indexOf('-');
  if (firstUnknown !== -1) {
    const known = parts.slice(0, firstUnknown);
    const unknown = parts.slice(firstUnknown);
    if (unknown.some((part) => part !== '-')) {
      return {
        ok: false,
        message:
          `EC number '${value}' has a known level after an unknown one; ` +
          "once a part is '-', the following parts must be '-' too",
      };
    }
    const badKnown = known.findIndex((part) => !NUMBER.test(part));
    if (badKnown !== -1) return partProblem(value, badKnown, known[badKnown]);
    return { ok: true, value, kind: 'partial' };
  }

  for (let index = 1; index < 3; index += 1) {
    if (!NUMBER.test(parts[index])) return partProblem(value, index, parts[index]);
  }
  const serial = parts[3];
  if (PRELIMINARY_SERIAL.test(serial)) return { ok: true, value, kind: 'preliminary' };
  if (!NUMBER.test(serial)) return partProblem(value, 3, serial);
  return { ok: true, value, kind: 'complete' };
}

const PART_NAMES = ['class', 'subclass', 'sub-subclass', 'serial number'] as const;

function partProblem(value: string, index: number, part: string): EcNumberCheck {
  const allowed =
    index === 3
      ? "a whole number from 1 without leading zeros, 'n' and a number for a preliminary one, or '-'"
      : "a whole number from 1 without leading zeros, or '-'";
  return {
    ok: false,
    message: `EC number '${value}': the ${PART_NAMES[index]} (part ${index + 1}) is '${part}'; it must be ${allowed}`,
  };
}
