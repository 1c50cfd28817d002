/** What is known about one measurement and its experiment; absent or null means "not reported". */
export type StrendaInput = {
  enzymeName?: string | null;
  ecNumber?: string | null;
  organism?: string | null;
  /** The one-letter sequence of the enzyme (for a variant: the parent's with the mutations applied). */
  sequence?: string | null;
  /** Sequence accession, accepted in place of a sequence. */
  accession?: string | null;
  /** Assay temperature, K. */
  temperatureKelvin?: number | null;
  ph?: number | null;
  bufferName?: string | null;
  /** Buffer concentration, M. */
  bufferMolar?: number | null;
  /** Whether the enzyme needs a metal ion; only then are metal salts a required item. */
  metalCofactorRequired: boolean;
  metalSalt?: string | null;
  /** Metal salt concentration, M. */
  metalMolar?: number | null;
  /** Lowest and highest substrate concentration tested, M. */
  substrateMinMolar?: number | null;
  substrateMaxMolar?: number | null;
  /** Total enzyme concentration, M. */
  enzymeMolar?: number | null;
  /** Kinetic parameters as stored (the unit is part of the stored quantity), with standard errors. */
  kcat?: { value: number; se: number | null } | null;
  km?: { value: number; se: number | null } | null;
  /** Number of independent replicates behind the parameters. */
  replicateCount?: number | null;
  model?: string | null;
  fittingMethod?: string | null;
};

/** A measurement's reporting completeness: the share of applicable items present, and which ones. */
export type StrendaCompleteness = { score: number; present: string[]; missing: string[] };

/** Name of the Level 1B replicates item, for callers that must tell "one replicate" from "not reported". */
export const REPLICATES_ITEM = 'number of replicates';

/** The required items, in the order of the guidelines, with the test of whether each is reported. */
const ITEMS: readonly { name: string; applies: (input: StrendaInput) => boolean; present: (input: StrendaInput) => boolean }[] = [
  // Level 1A, identity of the enzyme.
  { name: 'enzyme name and EC number', applies: always, present: (input) => hasText(input.enzymeName) && hasText(input.ecNumber) },
  { name: 'source organism', applies: always, present: (input) => hasText(input.organism) },
  { name: 'enzyme sequence or accession', applies: always, present: (input) => hasText(input.sequence) || hasText(input.accession) },
  // Level 1A, assay conditions.
  { name: 'assay temperature', applies: always, present: (input) => isFiniteNumber(input.temperatureKelvin) },
  { name: 'assay pH', applies: always, present: (input) => isFiniteNumber(input.ph) },
  { name: 'buffer and its concentration', applies: always, present: (input) => hasText(input.bufferName) && isPositive(input.bufferMolar) },
  {
    name: 'metal salt and its concentration',
    applies: (input) => input.metalCofactorRequired,
    present: (input) => hasText(input.metalSalt) && isPositive(input.metalMolar),
  },
  {
    name: 'substrate concentration range',
    applies: always,
    present: (input) =>
      isFiniteNumber(input.substrateMinMolar) &&
      isPositive(input.substrateMaxMolar) &&
      input.substrateMaxMolar > input.substrateMinMolar,
  },
  { name: 'enzyme concentration', applies: always, present: (input) => isPositive(input.enzymeMolar) },
  // Level 1B, results.
  { name: 'kcat and Km with units', applies: always, present: (input) => isPositive(input.kcat?.value) && isPositive(input.km?.value) },
  {
    name: 'standard errors of kcat and Km',
    applies: always,
    present: (input) => isNonNegative(input.kcat?.se) && isNonNegative(input.km?.se),
  },
  { name: REPLICATES_ITEM, applies: always, present: (input) => isPositive(input.replicateCount) },
  { name: 'kinetic model and fitting method', applies: always, present: (input) => hasText(input.model) && hasText(input.fittingMethod) },
];

/**
 * Scores a measurement against the items the STRENDA Guidelines require for reporting enzyme kinetics:
 * Level 1A (a complete description of the experiment: identity of the enzyme with name, EC number,
 * organism and sequence or accession; assay temperature; pH; buffer and its concentration; metal salts and
 * their concentrations, counted only when the enzyme needs a metal ion; substrate concentrations; enzyme
 * concentration) and Level 1B (the results: kinetic parameters with their units and errors, the number of
 * replicates, the model and the fitting method). Items about preparation, purity and the balanced reaction
 * equation are outside what the registry records, so they are not scored.
 *
 * The score is the share of applicable items present, 0–1; `missing` lists the others in plain words, in
 * the order of the guidelines.
 *
 * Reference: STRENDA Guidelines, Level 1A (version 1.5, 2008, strenda.org "Standard Requirements for
 * Reporting Enzyme Activity Data") and Level 1B (Beilstein-Institut, strenda.org); the Level 1B item
 * wording here is a summary from memory of the guideline, not a quotation.
 *
 * @param input what is recorded about the measurement (concentrations in M, temperature in K)
 * @throws never
 * @returns score, present and missing item names
 * @example
 * strendaCompleteness({ metalCofactorRequired: false, temperatureKelvin: 298.15, ph: 7 }).present;
 * // ['assay temperature', 'assay pH']  (score 2/12)
 */
export function strendaCompleteness(input: StrendaInput): StrendaCompleteness {
  const present: string[] = [];
  const missing: string[] = [];
  for (const item of ITEMS) {
    if (!item.applies(input)) continue;
    (item.present(input) ? present : missing).push(item.name);
  }
  return { score: present.length / (present.length + missing.length), present, missing };
}

function always(): boolean {
  return true;
}

function hasText(value: string | null | undefined): value is string {
  return typeof value === 'string' && value.trim().length > 0;
}

function isFiniteNumber(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

function isPositive(value: number | null | undefined): value is number {
  return isFiniteNumber(value) && value > 0;
}

function isNonNegative(value: number | null | undefined): value is number {
  return isFiniteNumber(value) && value >= 0;
}
