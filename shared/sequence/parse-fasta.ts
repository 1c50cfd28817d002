import { findInvalidResidue, maxSequenceResidues } from './validate-sequence';

/** One protein record of a FASTA text. */
export interface FastaRecord {
  /** The header line without its `>`, trimmed; empty for a raw sequence pasted without one. */
  readonly header: string;
  /** The first word of the header (`sp|Q1AAA9|NAME_ORG` or `my-enzyme`). */
  readonly id: string;
  /** The rest of the header after the id, trimmed. */
  readonly description: string;
  /** One-letter residues, upper case, without the final stop. */
  readonly sequence: string;
}

export type FastaParseResult =
  | { readonly ok: true; readonly records: readonly FastaRecord[] }
  | { readonly ok: false; readonly message: string };

interface RecordDraft {
  readonly header: string;
  readonly headerLine: number;
  readonly residues: string[];
  // Line number of each residue, so a refusal can point at the line the user has to fix.
  readonly residueLines: number[];
}

// Whitespace and digits are the usual debris of sequences copied from flat files, papers and
// alignment viewers (column numbers, blocks of ten); they carry no residues.
const IGNORED_IN_SEQUENCE = /[\s0-9]/;

/**
 * Parses protein FASTA text into records.
 *
 * FASTA as defined by Pearson and Lipman (PNAS 85:2444-2448, 1988) and described by NCBI ("FASTA
 * format", BLAST help): each record is a `>` header line followed by sequence lines. Tolerated:
 * Windows and old Mac line endings, a byte-order mark, blank lines, `;` comment lines, whitespace and
 * digits inside sequence lines, lower case, and one final `*` (stop) per record. Text without any
 * header is read as one raw sequence. Every residue must be one of the 20 standard amino acids.
 *
 * @param text the pasted or uploaded text
 * @returns every record in order, or the first problem: a residue that is not a standard amino acid
 *   (named with its residue number and line), a record without sequence, sequence lines before the
 *   first header, or no sequence at all
 * @example parseFasta('>amd1 invented amidase\nMKVL\nAGHE*\n')
 * // { ok: true, records: [{ header: 'amd1 invented amidase', id: 'amd1',
 * //   description: 'invented amidase', sequence: 'MKVLAGHE' }] }
 * @example parseFasta('>amd1\nMKJL').ok
 * // false: "record 'amd1': residue 3 is 'J': ambiguous (J, Leu or Ile); ..."
 */
export function parseFasta(text: string): FastaParseResult {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const hasHeader = lines.some((line) => line.trimStart().startsWith('>'));
  const drafts: RecordDraft[] = [];
  let current: RecordDraft | undefined;

  for (let index = 0; index < lines.length; index += 1) {
    const lineNumber = index + 1;
    const line = lines[index].trim();
    if (line.startsWith('>')) {
      current = { header: line.slice(1).trim(), headerLine: lineNumber, residues: [], residueLines: [] };
      drafts.push(current);
      continue;
    }
    if (line.startsWith(';')) continue;
    for (const character of line) {
      if (IGNORED_IN_SEQUENCE.test(character)) continue;
      if (current === undefined) {
        if (hasHeader) return { ok: false, message: `line ${lineNumber} has sequence before the first '>' header` };
        current = { header: '', headerLine: lineNumber, residues: [], residueLines: [] };
        drafts.push(current);
      }
      current.residues.push(character);
      current.residueLines.push(lineNumber);
    }
  }

  if (drafts.length === 0) return { ok: false, message: 'no sequence found' };

  const records: FastaRecord[] = [];
  for (let index = 0; index < drafts.length; index += 1) {
    const draft = drafts[index];
    const checked = checkDraft(draft, index + 1, hasHeader);
    if (!checked.ok) return checked;
    records.push(checked.record);
  }
  return { ok: true, records };
}

function checkDraft(
  draft: RecordDraft,
  recordNumber: number,
  hasHeader: boolean,
): { ok: true; record: FastaRecord } | { ok: false; message: string } {
  const id = draft.header.split(/\s+/)[0];
  const name = id === '' ? `record ${recordNumber}` : `record '${id}'`;
  const prefix = hasHeader ? `${name}: ` : '';

  const residues = [...draft.residues];
  const residueLines = [...draft.residueLines];
  if (residues[residues.length - 1] === '*') {
    residues.pop();
    residueLines.pop();
  }

  if (residues.length === 0) {
    if (!hasHeader) return { ok: false, message: 'no sequence found' };
    return { ok: false, message: `${name} (line ${draft.headerLine}) has no sequence` };
  }
  if (residues.length > maxSequenceResidues) {
    return {
      ok: false,
      message: `${prefix}the sequence has ${residues.length} residues; at most ${maxSequenceResidues} are accepted`,
    };
  }

  const sequence = residues.join('');
  const invalid = findInvalidResidue(sequence);
  if (invalid !== undefined) {
    // A one-line paste needs no line number; a multi-line one does, to find the residue.
    const spansLines = residueLines[0] !== residueLines[residueLines.length - 1];
    const where = spansLines ? ` (line ${residueLines[invalid.position - 1]})` : '';
    return {
      ok: false,
      message: `${prefix}residue ${invalid.position}${where} is '${invalid.letter}': ${invalid.reason}`,
    };
  }

  return {
    ok: true,
    record: {
      header: draft.header,
      id,
      description: draft.header.slice(id.length).trim(),
      sequence: sequence.toUpperCase(),
    },
  };
}
