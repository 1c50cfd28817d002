import { unitKindsOf } from './unit-spelling';

/** A column header split into the quantity's name and the unit written beside it. */
export interface ReadHeader {
  /** The header as written, trimmed. */
  readonly text: string;
  /** The name for matching: lower case, without spaces, underscores, hyphens or dots (`kcat/km`, `kmse`). */
  readonly name: string;
  /** The unit text as written (`mM`, `1/s`, `M-1 s-1`), or null when the header names none. */
  readonly unit: string | null;
}

// A unit in round or square brackets at the end: `Km (mM)`, `kcat [1/s]`. The bracket content may itself
// hold brackets one level deep, as in `kcat/Km [1/(mM*s)]`.
const BRACKETED_UNIT = /^(.*?)[\s,]*[([]\s*((?:[^()[\]]|\([^()]*\))+?)\s*[)\]]\s*$/;
// A unit after a comma: `Km, mM`.
const COMMA_UNIT = /^(.+?),\s*([^,]+)$/;
// Quantity calculus (IUPAC Green Book, 3rd ed., §1.1): `Km / mM`; the spaces tell it from `kcat/Km`.
const SLASH_UNIT = /^(.+?)\s+\/\s+(.+)$/;

/**
 * Reads a column header: the quantity's name and the unit written in brackets after it (`Km (mM)`,
 * `kcat [1/s]`, `kcat/Km (M-1 s-1)`), after a comma (`Km, mM`) or in quantity-calculus form with spaces
 * around the slash (`Km / mM`, IUPAC Green Book §1.1); the last two only when the text after the comma or
 * slash is a unit Kcatalog knows. Whether the unit is one Kcatalog converts is decided
 * later, against the kind of quantity the column is mapped to.
 *
 * @param header the header cell's text
 * @returns the trimmed text, the matching name and the unit text (or null)
 * @example readHeader('kcat/Km (M-1 s-1)') // { text: 'kcat/Km (M-1 s-1)', name: 'kcat/km', unit: 'M-1 s-1' }
 * @example readHeader('Buffer') // { text: 'Buffer', name: 'buffer', unit: null }
 */
export function readHeader(header: string): ReadHeader {
  const text = header.replace(/\s+/g, ' ').trim();
  const bracketed = BRACKETED_UNIT.exec(text);
  if (bracketed !== null && bracketed[1].trim() !== '') return { text, name: matchingName(bracketed[1]), unit: bracketed[2].trim() };
  // Without brackets only a recognised unit counts, so that `kcat / Km` and `Notes, comments` stay names.
  for (const pattern of [SLASH_UNIT, COMMA_UNIT]) {
    const match = pattern.exec(text);
    if (match !== null && unitKindsOf(match[2]).length > 0) return { text, name: matchingName(match[1]), unit: match[2].trim() };
  }
  return { text, name: matchingName(text), unit: null };
}

/**
 * The form header names and their aliases are compared in: NFKC-folded, lower case, without white space,
 * underscores, hyphens, dots, commas or the brackets of `[S]`.
 *
 * @param text a header name or an alias
 * @returns the compact name
 * @example matchingName('K_m SE') // 'kmse'
 */
export function matchingName(text: string): string {
  return text
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[\s_\-.,[\]]/g, '');
}
