/**
 * UniProtKB accession number format, as published by UniProt ("Accession numbers", UniProt help,
 * uniprot.org/help/accession_numbers): six characters `[OPQ][0-9][A-Z0-9]{3}[0-9]` or
 * `[A-NR-Z][0-9][A-Z][A-Z0-9]{2}[0-9]`, or ten characters (since release 2014_06) with the second
 * letter-digit block repeated. The regular expression is UniProt's, anchored.
 */
export const uniprotAccessionPattern = /^(?:[OPQ][0-9][A-Z0-9]{3}[0-9]|[A-NR-Z][0-9](?:[A-Z][A-Z0-9]{2}[0-9]){1,2})$/;

export type AccessionCheck =
  | { readonly ok: true; readonly value: string }
  | { readonly ok: false; readonly message: string };

// Isoforms are cited as `P12345-2`; the entry's accession is the part before the dash.
const ISOFORM_SUFFIX = /^(.+)-([0-9]+)$/;

/**
 * Checks that a text has the format of a UniProtKB accession, by the published pattern only: the
 * accession is never looked up, so a well-formed accession that UniProt never assigned passes.
 * Surrounding whitespace is dropped and letters are upper-cased, the only form UniProt issues.
 *
 * @param text what the user typed, e.g. `p12345 `
 * @returns `{ ok: true, value }` with the accession in upper case, or `{ ok: false, message }`
 * @example validateAccession(' a0a023gpi8') // { ok: true, value: 'A0A023GPI8' }
 * @example validateAccession('P12345-2').ok // false: the isoform suffix is named in the message
 */
export function validateAccession(text: string): AccessionCheck {
  const value = text.trim().toUpperCase();
  if (uniprotAccessionPattern.test(value)) return { ok: true, value };
  if (value === '') return { ok: false, message: 'accession is empty' };

  const isoform = ISOFORM_SUFFIX.exec(value);
  if (isoform !== null && uniprotAccessionPattern.test(isoform[1])) {
    return {
      ok: false,
      message:
        `'${value}' names isoform ${isoform[2]}; ` +
        `enter the entry's accession ${isoform[1]} and describe the isoform in the sequence`,
    };
  }
  return {
    ok: false,
    message: `'${value}' is not a UniProtKB accession (6 or 10 characters such as P12345 or A0A023GPI8)`,
  };
}
