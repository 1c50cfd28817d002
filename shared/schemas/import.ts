import { z } from 'zod';
import type { UnitKind } from '../imports/unit-spelling';
import { assayMethods, kineticModels } from './assay';
import { phModels, phRateKinds } from './ph-profile';
import { variantStatuses } from './variant';

/** What a spreadsheet can bring in. */
export const importKinds = ['variants', 'measurements', 'rate-points', 'ph-series'] as const;
export type ImportKind = (typeof importKinds)[number];

/** How each kind is named on the Imports page. */
export const importKindLabels: Record<ImportKind, string> = {
  variants: 'Variants',
  measurements: 'Measurements (fitted values)',
  'rate-points': 'Raw rate points (fitted on import)',
  'ph-series': 'pH series',
};

/** `all-or-nothing` writes every row or none; `valid-only` writes the valid rows and returns the others. */
export const importModes = ['all-or-nothing', 'valid-only'] as const;
export type ImportMode = (typeof importModes)[number];

/** Where a job stands: uploaded, being checked, checked, being written, written, or failed (nothing written). */
export const importStatuses = ['uploaded', 'validating', 'previewed', 'committing', 'committed', 'failed'] as const;
export type ImportStatus = (typeof importStatuses)[number];
/** Statuses in which a job is being worked on in the server. */
export const runningImportStatuses: readonly ImportStatus[] = ['validating', 'committing'];

export { maxImportBytes, maxImportRows, maxUncompressedWorkbookBytes } from '../imports/import-limits';

/** How a cell is read. */
export type ImportValueType = 'text' | 'number' | 'integer' | 'date' | 'boolean' | 'choice';

/** One thing a column can be mapped to. */
export interface ImportField {
  key: string;
  label: string;
  /** Whether the import needs it (campaign is also satisfied by the mapping's default campaign). */
  required: boolean;
  type: ImportValueType;
  /** Quantities only: the kind of unit, written in the header or chosen in the mapping. */
  unitKind?: UnitKind;
  /** A standard error: takes the unit of this field and must not be mapped in another. */
  errorOf?: string;
  /** Choices of a `choice` field, as the API spells them. */
  choices?: readonly string[];
  /** Header names that mean this field, compared in `matchingName` form. */
  aliases: readonly string[];
  /** What to write, shown in the mapping and the template's instructions. */
  hint: string;
}

const campaign: ImportField = {
  key: 'campaign',
  label: 'Campaign',
  required: true,
  type: 'text',
  aliases: ['campaign', 'campaignname', 'campaignid', 'project'],
  hint: 'campaign name or id; may instead be chosen for the whole file',
};

const variant: ImportField = {
  key: 'variant',
  label: 'Variant',
  required: true,
  type: 'text',
  aliases: ['variant', 'variantlabel', 'mutations', 'mutation', 'mutant', 'substitutions', 'label', 'hgvs'],
  hint: 'the variant’s mutations in any accepted notation (C112A/H190N, p.[Cys112Ala;His190Asn]); parent or WT for the parent',
};

const conditionFields: readonly ImportField[] = [
  { key: 'substrate', label: 'Substrate', required: true, type: 'text', aliases: ['substrate', 'substratename'], hint: 'substrate name' },
  {
    key: 'temperature',
    label: 'Temperature',
    required: true,
    type: 'number',
    unitKind: 'temperature',
    aliases: ['temperature', 'temp', 't', 'assaytemperature'],
    hint: 'assay temperature in °C or K',
  },
  { key: 'ph', label: 'pH', required: true, type: 'number', aliases: ['ph', 'assayph'], hint: 'assay pH, 0–14' },
  { key: 'bufferName', label: 'Buffer', required: false, type: 'text', aliases: ['buffer', 'buffername'], hint: 'buffer name, e.g. MES' },
  {
    key: 'bufferConcentration',
    label: 'Buffer concentration',
    required: false,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['bufferconcentration', 'bufferconc', 'buffer'],
    hint: 'needs a buffer name',
  },
  {
    key: 'ionicStrength',
    label: 'Ionic strength',
    required: false,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['ionicstrength', 'i'],
    hint: 'ionic strength',
  },
  { key: 'metalSalt', label: 'Metal salt', required: false, type: 'text', aliases: ['metal', 'metalsalt', 'metalion'], hint: 'salt added, e.g. ZnCl2' },
  {
    key: 'metalConcentration',
    label: 'Metal concentration',
    required: false,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['metalconcentration', 'metalconc', 'metal'],
    hint: 'needs a metal salt',
  },
  {
    key: 'otherComponents',
    label: 'Other components',
    required: false,
    type: 'text',
    aliases: ['othercomponents', 'additives', 'components'],
    hint: 'anything else in the assay mixture',
  },
  { key: 'method', label: 'Method', required: false, type: 'choice', choices: assayMethods, aliases: ['method', 'assaymethod'], hint: assayMethods.join(' or ') },
  { key: 'detection', label: 'Detection', required: false, type: 'text', aliases: ['detection', 'readout'], hint: 'e.g. absorbance at 405 nm' },
  {
    key: 'assayDate',
    label: 'Assay date',
    required: true,
    type: 'date',
    aliases: ['assaydate', 'date', 'measured', 'measuredon', 'experimentdate'],
    hint: 'a date cell or YYYY-MM-DD',
  },
  { key: 'notes', label: 'Notes', required: false, type: 'text', aliases: ['notes', 'note', 'comment', 'comments', 'remarks'], hint: 'free text' },
];

function enzymeConcentration(required: boolean): ImportField {
  return {
    key: 'enzymeConcentration',
    label: 'Enzyme concentration',
    required,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['enzymeconcentration', 'enzymeconc', '[e]', 'et', 'e0', 'e', 'enzyme'],
    hint: 'total enzyme concentration [E]t',
  };
}

const kineticModel: ImportField = {
  key: 'model',
  label: 'Model',
  required: false,
  type: 'choice',
  choices: kineticModels,
  aliases: ['model', 'kineticmodel'],
  hint: `${kineticModels.join(', ')}; michaelis-menten when left out`,
};

function parameterWithError(key: string, label: string, unitKind: UnitKind | undefined, aliases: string[], required: boolean, hint: string): ImportField[] {
  const errorAliases = aliases.flatMap((alias) => [`${alias}se`, `se${alias}`, `${alias}error`, `${alias}stderr`, `${alias}standarderror`, `${alias}±`, `${alias}±se`]);
  return [
    { key, label, required, type: 'number', unitKind, aliases, hint },
    {
      key: `${key}Se`,
      label: `${label} SE`,
      required,
      type: 'number',
      unitKind,
      errorOf: key,
      aliases: errorAliases,
      hint: `standard error of ${label}, in the same unit`,
    },
  ];
}

const variantFields: readonly ImportField[] = [
  campaign,
  { ...variant, key: 'mutations', label: 'Mutations' },
  {
    key: 'status',
    label: 'Status',
    required: false,
    type: 'choice',
    choices: variantStatuses,
    aliases: ['status', 'constructstatus'],
    hint: `${variantStatuses.join(', ')}; designed for a new variant when left out`,
  },
  {
    key: 'constructId',
    label: 'Construct id',
    required: false,
    type: 'text',
    aliases: ['constructid', 'construct', 'constructname', 'plasmid', 'cloneid'],
    hint: 'your construct or plasmid name',
  },
  { key: 'notes', label: 'Notes', required: false, type: 'text', aliases: ['notes', 'note', 'comment', 'comments', 'remarks'], hint: 'free text' },
  {
    key: 'parentVariant',
    label: 'Lineage parent',
    required: false,
    type: 'text',
    aliases: ['lineageparent', 'parentvariant', 'madefrom', 'derivedfrom'],
    hint: 'the variant this one was made from, in the same campaign (registered already or on an earlier row)',
  },
];

const measurementFields: readonly ImportField[] = [
  campaign,
  variant,
  ...conditionFields,
  enzymeConcentration(false),
  kineticModel,
  ...parameterWithError('kcat', 'kcat', 'turnover', ['kcat', 'turnovernumber'], true, 'turnover number'),
  ...parameterWithError('km', 'Km', 'concentration', ['km', 'michaelisconstant', 'k05', 'khalf', 'k½'], true, 'Michaelis constant (K½ for the Hill model)'),
  ...parameterWithError('kcatOverKm', 'kcat/Km', 'specificity', ['kcat/km', 'specificityconstant', 'catalyticefficiency'], false, 'derived from kcat and Km when left out'),
  ...parameterWithError('ki', 'Ki', 'concentration', ['ki'], false, 'substrate-inhibition model only'),
  ...parameterWithError('hill', 'Hill n', undefined, ['hilln', 'hillcoefficient', 'nh', 'hill'], false, 'Hill model only'),
  {
    key: 'substrateMin',
    label: 'Lowest substrate concentration',
    required: false,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['smin', 'substratemin', 'lowestsubstrate', 'lowestsubstrateconcentration', 'minsubstrate'],
    hint: 'lowest substrate concentration tested',
  },
  {
    key: 'substrateMax',
    label: 'Highest substrate concentration',
    required: false,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['smax', 'substratemax', 'highestsubstrate', 'highestsubstrateconcentration', 'maxsubstrate'],
    hint: 'highest substrate concentration tested (same unit as the lowest)',
  },
  { key: 'replicateCount', label: 'Replicates', required: false, type: 'integer', aliases: ['replicates', 'replicatecount', 'nreplicates', 'n'], hint: 'number of replicates' },
  { key: 'fittingMethod', label: 'Fitting method', required: false, type: 'text', aliases: ['fittingmethod', 'fitmethod', 'software'], hint: 'how the values were obtained' },
];

const ratePointFields: readonly ImportField[] = [
  campaign,
  variant,
  ...conditionFields,
  enzymeConcentration(true),
  kineticModel,
  {
    key: 'assayLabel',
    label: 'Assay',
    required: false,
    type: 'text',
    aliases: ['assay', 'assayid', 'assaylabel', 'run', 'series'],
    hint: 'tells apart assays of one variant on one day under the same conditions',
  },
  {
    key: 's',
    label: 'Substrate concentration',
    required: true,
    type: 'number',
    unitKind: 'concentration',
    aliases: ['s', 'substrateconcentration', 'substrateconc', 'substrate', 'conc', 'concentration'],
    hint: 'substrate concentration of the point',
  },
  {
    key: 'v',
    label: 'Initial rate',
    required: true,
    type: 'number',
    unitKind: 'rate',
    aliases: ['v', 'v0', 'vi', 'rate', 'initialrate', 'velocity'],
    hint: 'initial rate, concentration per time',
  },
  { key: 'replicate', label: 'Replicate', required: false, type: 'integer', aliases: ['replicate', 'rep', 'replicateno'], hint: 'replicate series, 1 when left out' },
  { key: 'excluded', label: 'Excluded', required: false, type: 'boolean', aliases: ['excluded', 'exclude', 'outlier'], hint: 'yes/no; excluded points are kept but not fitted' },
  { key: 'exclusionReason', label: 'Exclusion reason', required: false, type: 'text', aliases: ['exclusionreason', 'reason'], hint: 'required for an excluded point' },
];

const phSeriesFields: readonly ImportField[] = [
  campaign,
  variant,
  { key: 'substrate', label: 'Substrate', required: true, type: 'text', aliases: ['substrate', 'substratename'], hint: 'substrate name' },
  {
    key: 'temperature',
    label: 'Temperature',
    required: true,
    type: 'number',
    unitKind: 'temperature',
    aliases: ['temperature', 'temp', 't'],
    hint: 'assay temperature in °C or K',
  },
  {
    key: 'model',
    label: 'pH model',
    required: false,
    type: 'choice',
    choices: phModels,
    aliases: ['model', 'phmodel'],
    hint: `${phModels.join(', ')}; bell when left out`,
  },
  {
    key: 'rateKind',
    label: 'Rate kind',
    required: false,
    type: 'choice',
    choices: phRateKinds,
    aliases: ['ratekind', 'quantity'],
    hint: `${phRateKinds.join(', ')}; must agree with the rate's unit, which decides it when left out`,
  },
  {
    key: 'seriesLabel',
    label: 'Series',
    required: false,
    type: 'text',
    aliases: ['series', 'serieslabel', 'profile'],
    hint: 'tells apart several series of one variant under the same conditions',
  },
  { key: 'ph', label: 'pH', required: true, type: 'number', aliases: ['ph'], hint: 'pH of the point' },
  {
    key: 'rate',
    label: 'Rate',
    required: true,
    type: 'number',
    unitKind: 'phRate',
    aliases: ['rate', 'k', 'kcat', 'kcat/km', 'v0', 'v', 'activity', 'rateconstant'],
    hint: 'kcat (1/s), kcat/Km (M-1 s-1) or v0 (µM/min); the unit says which',
  },
  { key: 'excluded', label: 'Excluded', required: false, type: 'boolean', aliases: ['excluded', 'exclude', 'outlier'], hint: 'yes/no' },
];

/** The fields of each kind, in the order of the template's columns. */
export const importFields: Record<ImportKind, readonly ImportField[]> = {
  variants: variantFields,
  measurements: measurementFields,
  'rate-points': ratePointFields,
  'ph-series': phSeriesFields,
};

const id = z.number({ error: 'must be a whole number from 1' }).int('must be a whole number from 1').min(1, 'must be a whole number from 1');

/** One field's column (0-based position in the header row) and, for quantities, the unit chosen. */
export const columnChoice = z.object({
  column: z.number({ error: 'must be a column number' }).int('must be a column number').min(0, 'must be a column number').max(16_383, 'is beyond the last column'),
  unit: z.string({ error: 'must be a unit' }).trim().max(40, 'must be at most 40 characters').optional(),
});
export type ColumnChoice = z.infer<typeof columnChoice>;

/** Field key → column; fields left out (or null) are not imported. */
export const columnMapping = z.record(z.string().max(40), columnChoice.nullable(), { error: 'must map field names to columns' });
export type ColumnMapping = z.infer<typeof columnMapping>;

const sheetAndColumns = {
  sheet: z.string({ error: 'is required' }).min(1, 'is required').max(200, 'must be at most 200 characters'),
  /** The campaign of every row when the sheet has no campaign column. */
  campaignId: id.nullable().optional(),
  columns: columnMapping,
};

/** Body of POST /api/imports/:id/preview. */
export const previewImportInput = z.object({ version: id, ...sheetAndColumns });
export type PreviewImportInput = z.infer<typeof previewImportInput>;

/** Body of POST /api/imports/:id/commit: the previewed mapping is used unless sheet and columns are given. */
export const commitImportInput = z
  .object({
    version: id,
    mode: z.enum(importModes, { error: `must be one of ${importModes.join(', ')}` }).default('all-or-nothing'),
    sheet: sheetAndColumns.sheet.optional(),
    campaignId: sheetAndColumns.campaignId,
    columns: columnMapping.optional(),
  })
  .refine((input) => (input.sheet === undefined) === (input.columns === undefined), {
    message: 'give sheet and columns together, or neither to use the previewed mapping',
    path: ['columns'],
  });
export type CommitImportInput = z.infer<typeof commitImportInput>;

/** Query of GET /api/imports/:id/problems. */
export const importProblemsQuery = z.object({
  page: z.coerce.number({ error: 'must be a whole number from 1' }).int('must be a whole number from 1').min(1, 'must be a whole number from 1').default(1),
  pageSize: z.coerce
    .number({ error: 'must be a whole number from 1 to 1000' })
    .int('must be a whole number from 1 to 1000')
    .min(1, 'must be a whole number from 1 to 1000')
    .max(1000, 'must be a whole number from 1 to 1000')
    .default(100),
});
export type ImportProblemsQuery = z.infer<typeof importProblemsQuery>;

/** One sheet of an uploaded file. */
export interface ImportSheetDto {
  name: string;
  /** Data rows below the header row. */
  rowCount: number;
  headers: string[];
  /** The mapping offered for this sheet: the user's saved one where its headers are present, else detected. */
  suggested: { columns: ColumnMapping; source: Record<string, 'saved' | 'detected'> };
}

/** Why one row (or the whole mapping, row null) cannot be imported. */
export interface ImportProblemDto {
  /** Row number in the sheet as a spreadsheet shows it; null for a problem of the mapping. */
  row: number | null;
  /** Header of the column, when the problem is in one. */
  column: string | null;
  field: string | null;
  message: string;
}

/** What committing a row does. */
export type ImportOutcome = 'new' | 'updated' | 'unchanged' | 'invalid';

export interface ImportCountsDto {
  new: number;
  updated: number;
  unchanged: number;
  invalid: number;
}

/** A row as it will be stored: values in the stored (SI) units, named with their units. */
export interface ImportPreviewRowDto {
  row: number;
  outcome: ImportOutcome;
  values: Record<string, string | number | boolean | null>;
}

export interface ImportJobDto {
  id: number;
  kind: ImportKind;
  status: ImportStatus;
  fileName: string;
  format: 'xlsx' | 'csv';
  sizeBytes: number;
  /** The original file, kept as an attachment. */
  fileUrl: string;
  sheets: ImportSheetDto[];
  sheet: string | null;
  campaignId: number | null;
  columns: ColumnMapping | null;
  mode: ImportMode | null;
  /** Rows checked or written so far in the running phase, of `total`. */
  progress: { processed: number; total: number };
  counts: ImportCountsDto;
  problemCount: number;
  /** The first problems; GET /api/imports/:id/problems pages through all. */
  problems: ImportProblemDto[];
  preview: { columns: string[]; rows: ImportPreviewRowDto[] };
  /** Rejected rows as a spreadsheet with a reason column, once a valid-only commit has some. */
  rejectedUrl: string | null;
  message: string | null;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
  finishedAt: string | null;
  version: number;
}

/** GET /api/imports: the history, newest first, without sheets, problems or preview. */
export type ImportJobSummaryDto = Omit<ImportJobDto, 'sheets' | 'problems' | 'problemCount' | 'preview'>;

export interface ImportProblemsDto {
  rows: ImportProblemDto[];
  total: number;
  page: number;
  pageSize: number;
}
