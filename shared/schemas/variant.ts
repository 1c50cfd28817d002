import { z } from 'zod';
import { aminoAcidFromSymbol } from '../sequence/amino-acids';
import { maxSequenceResidues } from '../sequence/validate-sequence';
import type { CampaignStatus, PersonRefDto } from './campaign';
import { catalyticRoles, type CatalyticRole } from './enzyme';
import { queryNumberText, queryText } from './query-string';

/**
 * The life of a construct, in the order a variant usually moves through it; `failed` and `archived`
 * end it. One list for the server's column, the API's validation and the client's choices.
 */
export const variantStatuses = [
  'designed',
  'cloned',
  'sequence-verified',
  'expressed',
  'purified',
  'characterized',
  'failed',
  'archived',
] as const;
export type VariantStatus = (typeof variantStatuses)[number];

/**
 * Status a campaign's parent variant starts in: a campaign starts from an enzyme the team already has
 * as protein, ready to assay but not yet measured in this campaign.
 */
export const parentVariantStatus: VariantStatus = 'purified';

/** Longest mutation text accepted (far above any combination a team registers). */
export const maxMutationTextLength = 5000;
/** Longest list page. */
export const maxVariantPageSize = 500;

/** Units the API tags its numbers with; the values are in these SI-coherent units. */
export const variantUnits = {
  kcat: 's⁻¹',
  km: 'M',
  kcatOverKm: 'M⁻¹ s⁻¹',
  ddg: 'kJ/mol',
} as const;

const status = z.enum(variantStatuses, { error: `must be one of ${variantStatuses.join(', ')}` });

const constructId = z
  .string({ error: 'must be text or null' })
  .trim()
  .max(100, 'must be at most 100 characters')
  .nullable()
  .transform((value) => (value === null || value === '' ? null : value));

const notes = z
  .string({ error: 'must be text or null' })
  .trim()
  .max(10_000, 'must be at most 10000 characters')
  .nullable()
  .transform((value) => (value === null || value === '' ? null : value));

const id = (what: string) =>
  z.number({ error: `must be the id of ${what}` }).int('must be a whole number').min(1, 'must be at least 1');

/**
 * A new variant: its mutations in any notation the shared parser takes (`C112A/H190N`,
 * `p.[Cys112Ala;His190Asn]`, ...), checked on the server against the campaign's parent sequence.
 * `parentVariantId` is the variant it was made from, in the same campaign.
 */
export const createVariantInput = z.object({
  campaignId: id('a campaign'),
  mutations: z
    .string({ error: 'is required (e.g. C112A/H190N)' })
    .max(maxMutationTextLength, `must be at most ${maxMutationTextLength} characters`),
  parentVariantId: id('a variant').nullable().optional(),
  constructId: constructId.optional(),
  status: status.default('designed'),
  notes: notes.optional(),
});
export type CreateVariantInput = z.infer<typeof createVariantInput>;

/** Changes to a variant: the `version` read plus at least one field; `null` clears a field. */
export const updateVariantInput = z
  .object({
    version: z.number({ error: 'is required' }).int('must be a whole number').min(1, 'must be at least 1'),
    status: status.optional(),
    constructId: constructId.optional(),
    notes: notes.optional(),
    parentVariantId: id('a variant').nullable().optional(),
  })
  .refine((changes) => Object.entries(changes).some(([field, value]) => field !== 'version' && value !== undefined), {
    message: 'give at least one of status, constructId, notes or parentVariantId to change',
    path: ['status'],
  });
export type UpdateVariantInput = z.infer<typeof updateVariantInput>;

/** Sort keys of the variant list. Nulls (unmeasured variants) come last in both directions. */
export const variantSortKeys = ['label', 'position', 'kcat', 'km', 'kcatOverKm', 'foldChange', 'ddg', 'updated'] as const;
export type VariantSortKey = (typeof variantSortKeys)[number];

function queryNumber(message: string) {
  return z.preprocess(queryNumberText, z.number({ error: message }).optional());
}

function queryInteger(min: number, max: number, message: string) {
  return z.preprocess(queryNumberText, z.number({ error: message }).int(message).min(min, message).max(max, message).optional());
}

const residueFilter = z.preprocess(
  queryText,
  z
    .string({ error: 'must be one amino acid, e.g. A or Ala' })
    .transform((value, ctx) => {
      const aminoAcid = aminoAcidFromSymbol(value);
      if (aminoAcid !== undefined) return aminoAcid.oneLetter;
      ctx.addIssue({ code: 'custom', message: `must be one amino acid such as A, Ala or * (stop), got '${value}'` });
      return z.NEVER;
    })
    .optional(),
);

// Several statuses come comma-separated (`status=purified,characterized`) or as repeated parameters.
const statusFilter = z.preprocess(
  (value) => {
    const parts = (Array.isArray(value) ? value : [value])
      .filter((part): part is string => typeof part === 'string')
      .flatMap((part) => part.split(','))
      .map((part) => part.trim())
      .filter((part) => part !== '');
    return parts.length === 0 ? undefined : [...new Set(parts)];
  },
  z
    .array(z.string())
    .optional()
    .transform((values, ctx) => {
      const unknown = values?.filter((value) => !(variantStatuses as readonly string[]).includes(value)) ?? [];
      if (unknown.length === 0) return values as VariantStatus[] | undefined;
      ctx.addIssue({
        code: 'custom',
        message: `'${unknown.join("', '")}' ${unknown.length === 1 ? 'is not a status' : 'are not statuses'}; use ${variantStatuses.join(', ')}`,
      });
      return z.NEVER;
    }),
);

const pageSizeMessage = `must be a whole number from 1 to ${maxVariantPageSize}`;

/**
 * Query string of `GET /api/variants`. Mutation-level filters (`position`, `residue`, `role`) apply to
 * one and the same mutated site: `position=112&residue=A` finds variants with Ala at 112. `residue`
 * matches the parent residue or the new one; `role` is the catalytic role annotated at a mutated
 * position; `q` searches label, HGVS, construct id and notes. ΔΔG‡ bounds are in kJ/mol.
 * Without `order`, `updated` sorts newest first and every other key ascending.
 */
export const listVariantsQuery = z
  .strictObject(
    {
    campaignId: queryInteger(1, Number.MAX_SAFE_INTEGER, 'must be a campaign id (a whole number from 1)'),
    position: queryInteger(1, maxSequenceResidues, `must be a residue number from 1 to ${maxSequenceResidues}`),
    residue: residueFilter,
    role: z.preprocess(queryText, z.enum(catalyticRoles, { error: `must be one of ${catalyticRoles.join(', ')}` }).optional()),
    status: statusFilter,
    minFoldChange: z.preprocess(queryNumberText, z.number({ error: 'must be a number' }).min(0, 'must be at least 0').optional()),
    ddgMin: queryNumber('must be a number (kJ/mol)'),
    ddgMax: queryNumber('must be a number (kJ/mol)'),
    q: z.preprocess(queryText, z.string({ error: 'must be text' }).max(200, 'must be at most 200 characters').optional()),
    sort: z.preprocess(
      queryText,
      z.enum(variantSortKeys, { error: `must be one of ${variantSortKeys.join(', ')}` }).default('updated'),
    ),
    order: z.preprocess(queryText, z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).optional()),
    page: z.preprocess(
      queryNumberText,
      z
        .number({ error: 'must be a whole number from 1' })
        .int('must be a whole number from 1')
        .min(1, 'must be a whole number from 1')
        .max(1_000_000, 'must be at most 1000000')
        .default(1),
    ),
    pageSize: z.preprocess(
      queryNumberText,
      z.number({ error: pageSizeMessage }).int(pageSizeMessage).min(1, pageSizeMessage).max(maxVariantPageSize, pageSizeMessage).default(50),
    ),
    },
    {
      error: (issue) =>
        issue.code === 'unrecognized_keys'
          ? `unknown parameter ${issue.keys.map((key) => `'${key}'`).join(', ')}; the list takes campaignId, position, residue, role, status, minFoldChange, ddgMin, ddgMax, q, sort, order, page and pageSize`
          : undefined,
    },
  )
  .superRefine((query, ctx) => {
    if (query.ddgMin !== undefined && query.ddgMax !== undefined && query.ddgMin > query.ddgMax) {
      ctx.addIssue({ code: 'custom', path: ['ddgMax'], message: `must be at least ddgMin (${query.ddgMin})` });
    }
  })
  .transform((query) => ({ ...query, order: query.order ?? (query.sort === 'updated' ? 'desc' : 'asc') }));
export type ListVariantsQuery = z.infer<typeof listVariantsQuery>;
/** The query as a client writes it (every field optional). */
export type ListVariantsParams = z.input<typeof listVariantsQuery>;

/** A number in a named unit. */
export interface UnitValue<Unit extends string> {
  value: number;
  unit: Unit;
}

/** One substitution, with the catalytic roles annotated at its position. */
export interface VariantMutationDto {
  position: number;
  /** Parent residue, one-letter. */
  from: string;
  /** New residue, one-letter (`*` for a stop). */
  to: string;
  roles: CatalyticRole[];
}

/** A variant as other variants name it (lineage). */
export interface VariantRefDto {
  id: number;
  label: string;
  status: VariantStatus;
}

/**
 * One row of the variant list: identity, status and the summary numbers (from the variant's counted
 * measurements against the condition-matched parent; null until measured).
 */
export interface VariantListRowDto {
  id: number;
  campaignId: number;
  enzymeId: number;
  label: string;
  hgvs: string;
  /** True for the campaign's parent variant (the empty set). */
  isParent: boolean;
  mutations: VariantMutationDto[];
  positions: number[];
  /** Catalytic roles of the mutated positions, without repeats. */
  roles: CatalyticRole[];
  status: VariantStatus;
  constructId: string | null;
  parentVariantId: number | null;
  kcat: (UnitValue<typeof variantUnits.kcat> & { se?: number }) | null;
  km: UnitValue<typeof variantUnits.km> | null;
  kcatOverKm: UnitValue<typeof variantUnits.kcatOverKm> | null;
  /** kcat/Km over the matched parent's, dimensionless. */
  foldChange: number | null;
  ddg: (UnitValue<typeof variantUnits.ddg> & { se: number | null }) | null;
  phOptimum: number | null;
  measurementCount: number;
  /** Best STRENDA completeness of the counted measurements, 0–1. */
  completeness: number | null;
  flags: string[];
  version: number;
  createdAt: string;
  updatedAt: string;
}

/** `GET /api/variants`. */
export interface VariantListDto {
  rows: VariantListRowDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** A status change, read from the audit trail. */
export interface VariantStatusChangeDto {
  status: VariantStatus;
  /** null for the status the variant was registered with. */
  previousStatus: VariantStatus | null;
  at: string;
  actor: PersonRefDto | null;
}

/** An annotated site of the parent that one of the variant's mutations changes. */
export interface TouchedSiteDto {
  id: number;
  position: number;
  residue: string;
  role: CatalyticRole;
  expectedPka: number | null;
  note: string | null;
  /** The substitution at the site, e.g. `C112A`. */
  mutation: string;
}

/** `GET /api/variants/:id` and the answer of every variant write. */
export interface VariantDto extends VariantListRowDto {
  notes: string | null;
  campaign: {
    id: number;
    name: string;
    status: CampaignStatus;
    targetSubstrate: string;
    targetPh: number;
    targetTemperatureC: number;
  };
  createdBy: PersonRefDto | null;
  lineage: {
    parent: VariantRefDto | null;
    /** The first children by label; `childCount` says how many there are. */
    children: VariantRefDto[];
    childCount: number;
  };
  catalyticSites: TouchedSiteDto[];
  statusHistory: VariantStatusChangeDto[];
}
