import { z } from 'zod';
import { validateAccession } from '../sequence/accession';
import { aminoAcidFromOneLetter, aminoAcidFromSymbol } from '../sequence/amino-acids';
import { validateEcNumber } from '../sequence/ec-number';
import { parseFasta } from '../sequence/parse-fasta';

/**
 * What an annotated residue does in catalysis. `acid/base` is one residue acting as general acid in
 * one step and general base in another (e.g. the histidine of a serine-hydrolase triad).
 */
export const catalyticRoles = [
  'nucleophile',
  'general acid',
  'general base',
  'acid/base',
  'metal ligand',
  'oxyanion hole',
  'substrate binding',
  'electrostatic',
  'other',
] as const;
export type CatalyticRole = (typeof catalyticRoles)[number];

/**
 * Cofactors offered as choices. Values are plain ASCII so that filters, exports and URLs never
 * depend on superscript characters; {@link cofactorLabels} holds the typeset form for display.
 * Anything else goes in the free-text `otherCofactors`.
 */
export const cofactors = ['Zn2+', 'Mg2+', 'Mn2+', 'Fe2+', 'Cu2+', 'heme', 'PLP', 'FAD', 'NAD(P)H'] as const;
export type Cofactor = (typeof cofactors)[number];

export const cofactorLabels: Record<Cofactor, string> = {
  'Zn2+': 'Zn²⁺',
  'Mg2+': 'Mg²⁺',
  'Mn2+': 'Mn²⁺',
  'Fe2+': 'Fe²⁺',
  'Cu2+': 'Cu²⁺',
  heme: 'heme',
  PLP: 'PLP',
  FAD: 'FAD',
  'NAD(P)H': 'NAD(P)H',
};

/** Most catalytic sites one enzyme may carry in one request; far above any real active site. */
export const maxCatalyticSites = 100;

const name = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(200, 'must be at most 200 characters');

const organism = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required (write "synthetic construct" for a designed enzyme)')
  .max(200, 'must be at most 200 characters');

const ecNumber = z.string({ error: 'is required' }).transform((value, ctx) => {
  const checked = validateEcNumber(value);
  if (checked.ok) return checked.value;
  ctx.addIssue({ code: 'custom', message: checked.message });
  return z.NEVER;
});

// An empty field from a form means "no accession", like null.
const accession = z
  .string({ error: 'must be text or null' })
  .nullable()
  .transform((value, ctx) => {
    if (value === null || value.trim() === '') return null;
    const checked = validateAccession(value);
    if (checked.ok) return checked.value;
    ctx.addIssue({ code: 'custom', message: checked.message });
    return z.NEVER;
  });

// The field takes what people paste: a bare sequence (with spaces, line numbers, a final `*`) or a
// single FASTA record. Several records need a choice, which the FASTA upload offers.
const sequence = z.string({ error: 'is required' }).transform((value, ctx) => {
  const parsed = parseFasta(value);
  if (!parsed.ok) {
    ctx.addIssue({ code: 'custom', message: parsed.message });
    return z.NEVER;
  }
  if (parsed.records.length > 1) {
    ctx.addIssue({
      code: 'custom',
      message: `contains ${parsed.records.length} FASTA records; paste one, or upload the file and pick a record`,
    });
    return z.NEVER;
  }
  return parsed.records[0].sequence;
});

const cofactorList = z
  .array(z.enum(cofactors, { error: `must be one of ${cofactors.join(', ')}` }), { error: 'must be a list' })
  .refine((values) => new Set(values).size === values.length, 'lists a cofactor twice');

const otherCofactors = z.string({ error: 'must be text' }).trim().max(200, 'must be at most 200 characters');

const residue = z.string({ error: 'is required' }).transform((value, ctx) => {
  const aminoAcid = aminoAcidFromSymbol(value.trim());
  if (aminoAcid !== undefined && aminoAcid.oneLetter !== '*') return aminoAcid.oneLetter;
  ctx.addIssue({ code: 'custom', message: `must be a standard amino acid such as C or Cys, got '${value}'` });
  return z.NEVER;
});

/** One annotated residue of an enzyme. The residue is returned as its one-letter code. */
export const catalyticSiteInput = z.object({
  position: z
    .number({ error: 'must be a number' })
    .int('must be a whole number')
    .min(1, 'must be at least 1 (residues are numbered from 1)'),
  residue,
  role: z.enum(catalyticRoles, { error: `must be one of ${catalyticRoles.join(', ')}` }),
  expectedPka: z
    .number({ error: 'must be a number' })
    .min(0, 'must be between 0 and 14')
    .max(14, 'must be between 0 and 14')
    .optional(),
  /** Free text on what the residue does; trimmed, and an empty note is no note. */
  note: z
    .string({ error: 'must be text or null' })
    .trim()
    .max(500, 'must be at most 500 characters')
    .nullable()
    .transform((value) => (value === null || value === '' ? null : value))
    .optional(),
});
export type CatalyticSiteInput = z.infer<typeof catalyticSiteInput>;

/**
 * Checks that an annotated site names the residue the sequence has at that position.
 *
 * @param site a parsed site (one-letter residue)
 * @param enzymeSequence the enzyme's validated one-letter sequence
 * @returns the field at fault and its message, or `undefined` when the site matches
 * @example catalyticSiteProblem({ position: 2, residue: 'C' }, 'MSKV')
 * // { field: 'residue', message: 'position 2 of the sequence is Ser, not Cys' }
 */
export function catalyticSiteProblem(
  site: Pick<CatalyticSiteInput, 'position' | 'residue'>,
  enzymeSequence: string,
): { field: 'position' | 'residue'; message: string } | undefined {
  if (site.position > enzymeSequence.length) {
    return {
      field: 'position',
      message: `position ${site.position} is beyond the sequence (${enzymeSequence.length} residues)`,
    };
  }
  const actual = enzymeSequence[site.position - 1].toUpperCase();
  if (actual === site.residue) return undefined;
  const actualName = aminoAcidFromOneLetter(actual)?.threeLetter ?? `'${actual}'`;
  const expectedName = aminoAcidFromOneLetter(site.residue)?.threeLetter ?? `'${site.residue}'`;
  return {
    field: 'residue',
    message: `position ${site.position} of the sequence is ${actualName}, not ${expectedName}`,
  };
}

/**
 * A new enzyme (a parent or template), optionally with its catalytic sites, which must match the
 * sequence. The sequence may be pasted raw or as one FASTA record and is stored as upper-case
 * one-letter residues; the EC number and accession are stored in canonical form.
 */
export const createEnzymeInput = z
  .object({
    name,
    ecNumber,
    accession: accession.default(null),
    organism,
    sequence,
    cofactors: cofactorList.default([]),
    otherCofactors: otherCofactors.default(''),
    sites: z
      .array(catalyticSiteInput, { error: 'must be a list' })
      .max(maxCatalyticSites, `must have at most ${maxCatalyticSites} sites`)
      .default([]),
  })
  .superRefine((enzyme, ctx) => {
    enzyme.sites.forEach((site, index) => {
      const problem = catalyticSiteProblem(site, enzyme.sequence);
      if (problem !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['sites', index, problem.field], message: problem.message });
        return;
      }
      const earlier = enzyme.sites.findIndex(
        (other, otherIndex) => otherIndex < index && other.position === site.position && other.role === site.role,
      );
      if (earlier !== -1) {
        ctx.addIssue({
          code: 'custom',
          path: ['sites', index, 'role'],
          message: `repeats site ${earlier + 1} (position ${site.position}, ${site.role})`,
        });
      }
    });
  });
export type CreateEnzymeInput = z.infer<typeof createEnzymeInput>;

/**
 * Changes to an enzyme: the `version` read, plus at least one field. A missing field is left as it
 * is; `accession: null` (or an empty string) removes the accession. Sites are not part of an update:
 * when the sequence changes, the enzyme's existing sites are to be re-checked with
 * {@link catalyticSiteProblem} before the change is written.
 */
export const updateEnzymeInput = z
  .object({
    version: z.number({ error: 'is required' }).int('must be a whole number').min(1, 'must be at least 1'),
    name: name.optional(),
    ecNumber: ecNumber.optional(),
    accession: accession.optional(),
    organism: organism.optional(),
    sequence: sequence.optional(),
    cofactors: cofactorList.optional(),
    otherCofactors: otherCofactors.optional(),
  })
  .refine(
    (changes) =>
      Object.entries(changes).some(([field, value]) => field !== 'version' && value !== undefined),
    { message: 'give at least one field to change', path: ['name'] },
  );
export type UpdateEnzymeInput = z.infer<typeof updateEnzymeInput>;

/** A catalytic site added on its own (`POST /api/enzymes/:id/sites`): the same fields as in a new enzyme's list. */
export const createCatalyticSiteInput = catalyticSiteInput;
export type CreateCatalyticSiteInput = z.infer<typeof createCatalyticSiteInput>;

/** Largest FASTA text accepted, in bytes (uploaded) or characters (posted as JSON): 1 MiB. */
export const maxFastaBytes = 1_048_576;

/** FASTA text posted as JSON to `POST /api/enzymes/fasta` instead of a file. */
export const fastaTextInput = z.object({
  fasta: z
    .string({ error: 'is required (FASTA text, or upload a file in the field "file")' })
    .min(1, 'is required')
    .max(maxFastaBytes, `must be at most ${maxFastaBytes} characters`),
});
export type FastaTextInput = z.infer<typeof fastaTextInput>;

/** An annotated residue as the API returns it. */
export interface CatalyticSiteDto {
  id: number;
  enzymeId: number;
  position: number;
  /** One-letter residue. */
  residue: string;
  role: CatalyticRole;
  expectedPka: number | null;
  note: string | null;
}

/** An enzyme in the list: everything but the sequence itself. */
export interface EnzymeSummaryDto {
  id: number;
  name: string;
  ecNumber: string | null;
  accession: string | null;
  organism: string;
  sequenceLength: number;
  cofactors: Cofactor[];
  otherCofactors: string | null;
  siteCount: number;
  campaignCount: number;
  version: number;
  createdAt: string;
  updatedAt: string;
}

/** One enzyme with its sequence, sites (by position) and the campaigns on it. */
export interface EnzymeDto extends EnzymeSummaryDto {
  sequence: string;
  sites: CatalyticSiteDto[];
  campaigns: { id: number; name: string }[];
}

/** One record of an uploaded FASTA file, for the client to pick from. */
export interface FastaRecordDto {
  header: string;
  id: string;
  description: string;
  sequence: string;
  length: number;
}
