/**
 * Small data factories for API tests: rows written straight through the repositories, so tests of one
 * module do not depend on another module's services. All names and sequences are invented.
 */
import type { DataSource } from 'typeorm';
import { formatMutationHgvs, formatMutationLabel, mutationKey, type Mutation as MutationSpec } from '@shared/mutations/format-mutations';
import type { CatalyticRole, Cofactor } from '@shared/schemas/enzyme';
import { Campaign } from '@server/modules/campaigns/campaign.entity';
import { CatalyticSite } from '@server/modules/enzymes/catalytic-site.entity';
import { Enzyme } from '@server/modules/enzymes/enzyme.entity';
import { Mutation } from '@server/modules/variants/mutation.entity';
import { Variant } from '@server/modules/variants/variant.entity';

let counter = 0;
const nextNumber = () => (counter += 1);

/** An invented sequence: a repeating filler with chosen residues at chosen 1-based positions. */
export function inventedSequence(length: number, residues: Readonly<Record<number, string>> = {}): string {
  const filler = 'GASTVLKEDR';
  let sequence = '';
  for (let position = 1; position <= length; position += 1) {
    sequence += residues[position] ?? filler[(position - 1) % filler.length];
  }
  return sequence;
}

/** An enzyme row with an invented 300-residue sequence; `sites` are written with it. */
export async function createEnzymeRow(
  dataSource: DataSource,
  options: {
    sequence?: string;
    cofactors?: Cofactor[];
    ecNumber?: string | null;
    sites?: { position: number; residue: string; role: CatalyticRole; expectedPka?: number | null }[];
  } = {},
): Promise<Enzyme> {
  const enzyme = await dataSource.getRepository(Enzyme).save(
    dataSource.getRepository(Enzyme).create({
      name: `Invented amidase ${nextNumber()}`,
      ecNumber: options.ecNumber === undefined ? '3.5.1.4' : options.ecNumber,
      accession: null,
      organism: 'synthetic construct',
      sequence: options.sequence ?? inventedSequence(300),
      cofactors: options.cofactors ?? [],
      otherCofactors: null,
      createdById: null,
    }),
  );
  for (const site of options.sites ?? []) {
    await dataSource.getRepository(CatalyticSite).insert({
      enzymeId: enzyme.id,
      position: site.position,
      residue: site.residue,
      role: site.role,
      expectedPka: site.expectedPka ?? null,
      note: null,
    });
  }
  return enzyme;
}

/** A campaign on an enzyme with its parent variant (the empty mutation set). Target temperature in °C. */
export async function createCampaignWithParent(
  dataSource: DataSource,
  options: { enzyme: Enzyme; targetSubstrate?: string; targetPh?: number; targetTemperatureC?: number },
): Promise<{ campaign: Campaign; parent: Variant }> {
  const campaign = await dataSource.getRepository(Campaign).save(
    dataSource.getRepository(Campaign).create({
      name: `Invented campaign ${nextNumber()}`,
      objective: 'Raise activity at mildly acidic pH (test fixture).',
      enzymeId: options.enzyme.id,
      targetSubstrate: options.targetSubstrate ?? 'pNP-acetate',
      targetPh: options.targetPh ?? 6,
      targetTemperatureK: (options.targetTemperatureC ?? 37) + 273.15,
      leadId: null,
      status: 'active',
    }),
  );
  const parent = await createVariantRow(dataSource, { campaign, mutations: [], status: 'purified' });
  return { campaign, parent };
}

/** A variant row with its mutation rows; label and HGVS from the shared formatter. */
export async function createVariantRow(
  dataSource: DataSource,
  options: { campaign: Campaign; mutations: MutationSpec[]; status?: Variant['status'] },
): Promise<Variant> {
  const label = formatMutationLabel(options.mutations);
  const variant = await dataSource.getRepository(Variant).save(
    dataSource.getRepository(Variant).create({
      campaignId: options.campaign.id,
      enzymeId: options.campaign.enzymeId,
      parentVariantId: null,
      label,
      hgvs: formatMutationHgvs(options.mutations),
      mutationKey: mutationKey(options.mutations),
      mutationCount: options.mutations.length,
      firstPosition: options.mutations.length === 0 ? null : Math.min(...options.mutations.map((mutation) => mutation.position)),
      constructId: null,
      status: options.status ?? 'purified',
      notes: null,
      createdById: null,
    }),
  );
  for (const mutation of options.mutations) {
    await dataSource.getRepository(Mutation).insert({
      variantId: variant.id,
      position: mutation.position,
      fromResidue: mutation.from,
      toResidue: mutation.to,
    });
  }
  return variant;
}

/**
 * Writes a variant's denormalised summary columns directly, as the measurement module would after a
 * fit (SI-coherent units: kcat s⁻¹, Km M, kcat/Km M⁻¹ s⁻¹, ΔΔG‡ kJ/mol).
 */
export async function setVariantSummary(
  dataSource: DataSource,
  variantId: number,
  summary: Partial<
    Pick<
      Variant,
      | 'summaryKcat'
      | 'summaryKm'
      | 'summaryKcatOverKm'
      | 'summaryFoldChange'
      | 'summaryDdgKjPerMol'
      | 'summaryDdgSeKjPerMol'
      | 'summaryPhOptimum'
      | 'summaryMeasurementCount'
      | 'summaryCompleteness'
      | 'summaryFlags'
    >
  >,
): Promise<void> {
  await dataSource.getRepository(Variant).update({ id: variantId }, summary);
}
