import { aminoAcidFromOneLetter, aminoAcidFromSymbol, type AminoAcid } from '../sequence/amino-acids';
import { maxSequenceResidues } from '../sequence/validate-sequence';
import { formatMutation, formatMutationHgvs, formatMutationLabel, type Mutation } from './format-mutations';

/** A parsed mutation set on one parent. */
export interface MutationSet {
  /** Substitutions by ascending position. */
  readonly mutations: readonly Mutation[];
  /** Canonical label, e.g. `C112A/H190N`; `parent` for the empty set. */
  readonly label: string;
  /** HGVS protein description, e.g. `p.[Cys112Ala;His190Asn]`; `p.=` for the empty set. */
  readonly hgvs: string;
}

/** Why one written mutation was refused; shown to the user as `${token}: ${message}`. */
export interface MutationProblem {
  /** The mutation as written (`C112A`), or the whole input when the problem is the input's form. */
  readonly token: string;
  readonly message: string;
}

export type MutationParseResult =
  | { readonly ok: true; readonly value: MutationSet }
  | { readonly ok: false; readonly problems: readonly MutationProblem[] };

export interface ParseMutationsOptions {
  /**
   * The parent's validated one-letter sequence. Without it only the notation is checked (imports
   * validate the format of a sheet before they know which parent each row belongs to).
   */
  readonly parentSequence?: string;
}

// Ways people write "no mutation". `p.=` is HGVS for a protein without change.
const PARENT_WORDS = new Set(['', 'parent', 'wt', 'wild type', 'wild-type', 'wildtype', 'p.=']);

// A reference sequence identifier before `p.` (`NP_003997.1:p.Trp24Cys`, `LRG_199p1:p.Trp24Cys`) is
// dropped: the parent enzyme is the reference, whatever the source called it.
const REFERENCE_PREFIX = /^[^\s:;,/+[\]()]+:(?=p\.)/i;
const ALLELE = /^p\.(\()?\[(.*)\](\))?$/is;
const SEPARATORS = /[\s,;/+]+/;
const PROTEIN_PREFIX = /^p\./i;
const SUBSTITUTION = /^([A-Za-z]{3}|[A-Za-z*])(-?[0-9]+)([A-Za-z]{3}|[A-Za-z*=])$/;
const NUCLEOTIDE_PREFIX = /^[cgmnor]\./i;
const OTHER_VARIANT_TYPE = /[0-9].*(?:delins|del|ins|dup|fs|ext)/i;

const EXAMPLES = 'e.g. C112A, Cys112Ala or p.Cys112Ala';

/**
 * Parses a set of amino-acid substitutions, checks it against the parent sequence when one is given,
 * and returns it with its canonical label and HGVS description.
 *
 * Notation follows the HGVS recommendations for protein substitutions (hgvs-nomenclature.org,
 * "Protein: substitution"; den Dunnen et al., Hum. Mutat. 37:564-569, 2016) and the one-letter
 * shorthand of the protein engineering literature. Accepted for each substitution: `C112A`,
 * `Cys112Ala` (three-letter symbols in any case), `p.Cys112Ala`, the predicted form `p.(Cys112Ala)`,
 * and a stop as `Ter` or `*` (`p.Trp24Ter`, `p.Trp24*`, `W24*`); a reference sequence identifier
 * before `p.` is ignored. Several substitutions are separated by `/`, `+`, `,`, `;` or spaces, or
 * written as one HGVS allele `p.[Cys112Ala;His190Asn]` (also `p.([...])` and `p.[(...)]`). The
 * prediction parentheses are not kept: the set describes the variant as registered. An empty input,
 * `parent`, `WT`, `wild type` or `p.=` is the empty set, the parent itself.
 *
 * Refused, one problem per written substitution: an unparseable token; an unknown amino acid; a
 * position below 1 or beyond the parent (or, without a parent, beyond the longest accepted
 * sequence); a stop as the parent residue; a synonymous change (`C112C`, `p.Cys112=`); two changes
 * at one position; and, with a parent, a parent residue that differs from the one written.
 *
 * @param text the mutation set as typed or imported
 * @param options `parentSequence` to check positions and parent residues
 * @returns `{ ok: true, value }` or `{ ok: false, problems }` listing every problem found
 * @example parseMutations('H190N+c112a')
 * // { ok: true, value: { mutations: [{ position: 112, from: 'C', to: 'A' }, { position: 190, from: 'H', to: 'N' }],
 * //   label: 'C112A/H190N', hgvs: 'p.[Cys112Ala;His190Asn]' } }
 * @example parseMutations('C2A', { parentSequence: 'MSKV' })
 * // { ok: false, problems: [{ token: 'C2A', message: 'position 2 of the parent is Ser, not Cys' }] }
 */
export function parseMutations(text: string, options: ParseMutationsOptions = {}): MutationParseResult {
  const input = text.trim();
  if (PARENT_WORDS.has(input.toLowerCase())) return { ok: true, value: setOf([]) };

  const tokens = splitTokens(input);
  if (tokens.length === 0) {
    const message = 'no substitutions found; leave the field empty for the parent';
    return { ok: false, problems: [{ token: input, message }] };
  }

  const problems: MutationProblem[] = [];
  const accepted: Mutation[] = [];
  for (const token of tokens) {
    const parsed = parseToken(token, options.parentSequence);
    if (!parsed.ok) {
      problems.push({ token, message: parsed.message });
      continue;
    }
    const earlier = accepted.find((mutation) => mutation.position === parsed.mutation.position);
    if (earlier !== undefined) {
      const first = formatMutation(earlier);
      const second = formatMutation(parsed.mutation);
      const message =
        first === second
          ? `${first} is listed twice`
          : `two changes at position ${parsed.mutation.position} (${first} and ${second})`;
      problems.push({ token, message });
      continue;
    }
    accepted.push(parsed.mutation);
  }

  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, value: setOf(accepted) };
}

function setOf(mutations: readonly Mutation[]): MutationSet {
  return {
    mutations: [...mutations].sort((left, right) => left.position - right.position),
    label: formatMutationLabel(mutations),
    hgvs: formatMutationHgvs(mutations),
  };
}

function splitTokens(input: string): string[] {
  const unprefixed = input.replace(REFERENCE_PREFIX, '');
  const allele = ALLELE.exec(unprefixed);
  // Only a balanced `p.([...])` or a bare `p.[...]` is an allele; anything else is read token by token
  // and the odd bracket shows up as an unparseable token.
  if (allele !== null && (allele[1] === undefined) === (allele[3] === undefined)) {
    let inner = allele[2].trim();
    if (inner.startsWith('(') && inner.endsWith(')')) inner = inner.slice(1, -1);
    return inner
      .split(';')
      .map((item) => item.trim())
      .filter((item) => item !== '');
  }
  return input.split(SEPARATORS).filter((token) => token !== '');
}

type TokenResult = { ok: true; mutation: Mutation } | { ok: false; message: string };

function parseToken(token: string, parentSequence: string | undefined): TokenResult {
  let body = token.replace(REFERENCE_PREFIX, '');
  if (NUCLEOTIDE_PREFIX.test(body)) {
    return { ok: false, message: `a DNA or RNA description, not a protein change (${EXAMPLES})` };
  }
  if (PROTEIN_PREFIX.test(body)) {
    body = body.slice(2);
    if (body.startsWith('(') && body.endsWith(')')) body = body.slice(1, -1);
  }

  // Checked before the substitution pattern, which would read `Lys2del` as an unknown residue `del`.
  if (OTHER_VARIANT_TYPE.test(body)) {
    return {
      ok: false,
      message: 'only substitutions are supported, not deletions, insertions, duplications, frameshifts or extensions',
    };
  }
  const match = SUBSTITUTION.exec(body);
  if (match === null) return { ok: false, message: `not a substitution (${EXAMPLES})` };
  const [, fromSymbol, positionText, toSymbol] = match;

  const from = aminoAcidFromSymbol(fromSymbol);
  if (from === undefined) return { ok: false, message: unknownAminoAcid(fromSymbol) };
  const synonymousMark = toSymbol === '=';
  const to = synonymousMark ? from : aminoAcidFromSymbol(toSymbol);
  if (to === undefined) return { ok: false, message: unknownAminoAcid(toSymbol) };

  const position = Number(positionText);
  if (position < 1) return { ok: false, message: `position ${position} is not valid; residues are numbered from 1` };
  if (from.oneLetter === '*') {
    return {
      ok: false,
      message: 'the parent residue cannot be a stop (Ter); only amino-acid substitutions are supported',
    };
  }
  if (from === to) {
    return {
      ok: false,
      message: `synonymous change, position ${position} stays ${from.threeLetter}; list only residues that change`,
    };
  }

  if (parentSequence === undefined) {
    if (position > maxSequenceResidues) {
      return {
        ok: false,
        message: `position ${position} is beyond the longest accepted sequence (${maxSequenceResidues} residues)`,
      };
    }
  } else {
    if (position > parentSequence.length) {
      return {
        ok: false,
        message: `position ${position} is beyond the parent sequence (${parentSequence.length} residues)`,
      };
    }
    const parentLetter = parentSequence[position - 1];
    const parentResidue = aminoAcidFromOneLetter(parentLetter);
    if (parentResidue !== from) {
      const parentName = nameOf(parentResidue, parentLetter);
      return { ok: false, message: `position ${position} of the parent is ${parentName}, not ${from.threeLetter}` };
    }
  }

  return { ok: true, mutation: { position, from: from.oneLetter, to: to.oneLetter } };
}

function unknownAminoAcid(symbol: string): string {
  // X once stood for a stop in protein descriptions; HGVS now reserves it for "unknown amino acid".
  const hint = symbol.toUpperCase() === 'X' ? '; write * or Ter for a stop' : '';
  return `unknown amino acid '${symbol}'${hint}`;
}

function nameOf(residue: AminoAcid | undefined, letter: string): string {
  return residue === undefined ? `'${letter}'` : residue.threeLetter;
}
