import type { DataSource } from 'typeorm';
import { compareWithParent, type CombinedRates, type ConditionComparison } from '@shared/comparison/compare-with-parent';
import { doubleMutantCycles, type CycleEnergies, type CycleVariant } from '@shared/comparison/double-mutant-cycles';
import type { FreeEnergyDifference } from '@shared/kinetics/types';
import { siUnits } from '@shared/schemas/assay';
import type {
  CampaignCyclesDto,
  CampaignLandscapeDto,
  CombinedRatesDto,
  ConditionComparisonDto,
  CycleEnergiesDto,
  EnergyDto,
  LandscapeCellDto,
  VariantComparisonDto,
} from '@shared/schemas/comparison';
import { countedReviewStates, type CountedReviewState } from '@shared/schemas/measurement';
import { notFound } from '../../http/errors';
import { ZERO_CELSIUS_KELVIN, roundCelsius } from '../assays/assay-conditions';
import { byVariant, loadComparableMeasurements } from './comparable-measurements';
import { loadCampaignComparisonContext } from './variant-summary';

/** Columns of the landscape: the twenty standard amino acids by one-letter code, then the stop. */
const LANDSCAPE_AMINO_ACIDS = [...'ACDEFGHIKLMNPQRSTVWY', '*'];

/**
 * A variant compared with the campaign's parent under matched conditions: every condition group of its
 * counted measurements, best first (the primary comparison first; see compareWithParent), with ΔΔG‡ for
 * kcat/Km and kcat, fold change and Km ratio, or the reason there is no comparison. 404 for an unknown
 * variant.
 *
 * @param dataSource the data source
 * @param variantId the variant
 * @param states the review states that count (default draft, submitted, approved)
 * @returns the comparison DTO
 */
export async function getVariantComparison(
  dataSource: DataSource,
  variantId: number,
  states: readonly CountedReviewState[] = countedReviewStates,
): Promise<VariantComparisonDto> {
  const [variant] = (await dataSource.query(`SELECT id, label, campaign_id FROM variants WHERE id = ?`, [variantId])) as {
    id: number;
    label: string;
    campaign_id: number;
  }[];
  if (!variant) throw notFound('The variant');
  const context = await loadCampaignComparisonContext(dataSource.manager, variant.campaign_id);
  if (!context) throw notFound('The campaign');
  const parentId = context.parentVariantId;
  const ids = parentId === null ? [variant.id] : [variant.id, parentId];
  const measurements = byVariant(
    await loadComparableMeasurements(dataSource.manager, { campaignId: variant.campaign_id, variantIds: ids, states }),
  );
  const isParent = variant.id === parentId;
  const result = compareWithParent(
    measurements.get(variant.id) ?? [],
    parentId === null ? [] : (measurements.get(parentId) ?? []),
    context.target,
    { variantIsParent: isParent },
  );
  let parentVariant: { id: number; label: string } | null = null;
  if (parentId !== null) {
    const [row] = (await dataSource.query(`SELECT id, label FROM variants WHERE id = ?`, [parentId])) as { id: number; label: string }[];
    parentVariant = row;
  }
  const comparisons = result.comparisons.map(toComparisonDto);
  return {
    variant: { id: variant.id, label: variant.label, campaignId: variant.campaign_id, isParent },
    parentVariant,
    target: {
      substrate: context.target.substrate,
      temperatureC: roundCelsius(context.target.temperatureKelvin - ZERO_CELSIUS_KELVIN),
      ph: context.target.ph,
    },
    reviewStates: [...states],
    comparisons,
    primary: comparisons[0] ?? null,
  };
}

/**
 * The campaign's double-mutant cycles (see doubleMutantCycles) from its counted measurements, with the
 * cycles whose corners exist but were never measured under matched conditions. 404 for an unknown campaign.
 *
 * @param dataSource the data source
 * @param campaignId the campaign
 * @param states the review states that count
 * @returns the cycles DTO
 */
export async function getCampaignCycles(
  dataSource: DataSource,
  campaignId: number,
  states: readonly CountedReviewState[] = countedReviewStates,
): Promise<CampaignCyclesDto> {
  const context = await loadCampaignComparisonContext(dataSource.manager, campaignId);
  if (!context) throw notFound('The campaign');
  const measurements = byVariant(await loadComparableMeasurements(dataSource.manager, { campaignId, states }));
  const rows = (await dataSource.query(
    `SELECT v.id, v.label, m.position, m.from_residue, m.to_residue
       FROM variants v JOIN mutations m ON m.variant_id = v.id
      WHERE v.campaign_id = ?
        AND EXISTS (SELECT 1 FROM measurements me
                     WHERE me.variant_id = v.id AND me.superseded_by_id IS NULL
                       AND me.review_state IN (${states.map(() => '?').join(', ')}))
      ORDER BY v.id, m.position`,
    [campaignId, ...states],
  )) as { id: number; label: string; position: number; from_residue: string; to_residue: string }[];
  const variants = new Map<number, CycleVariant & { mutations: { position: number; from: string; to: string }[] }>();
  for (const row of rows) {
    const variant = variants.get(row.id) ?? { id: row.id, label: row.label, mutations: [] };
    variant.mutations.push({ position: row.position, from: row.from_residue, to: row.to_residue });
    variants.set(row.id, variant);
  }
  const { cycles, unmatched } = doubleMutantCycles({
    variants: [...variants.values()],
    measurementsByVariant: measurements,
    parentMeasurements: context.parentVariantId === null ? [] : (measurements.get(context.parentVariantId) ?? []),
  });
  return {
    campaignId,
    reviewStates: [...states],
    cycles: cycles.map((cycle) => ({
      combination: cycle.combination,
      a: cycle.a,
      b: cycle.b,
      substrate: cycle.substrate,
      temperatureC: roundCelsius(cycle.temperatureKelvin - ZERO_CELSIUS_KELVIN),
      ph: cycle.ph,
      measurementIds: cycle.measurementIds,
      kcatOverKm: cycleEnergiesDto(cycle.kcatOverKm),
      kcat: cycleEnergiesDto(cycle.kcat),
    })),
    unmatched,
  };
}

/**
 * The campaign's landscape: for every single-substitution variant, its position, residues and the log10
 * fold change in kcat/Km of its summary (the primary comparison with the matched parent), as a position ×
 * amino-acid matrix. Positions are those with a single-substitution variant or an annotated site; annotated
 * positions carry their catalytic roles. 404 for an unknown campaign.
 *
 * @param dataSource the data source
 * @param campaignId the campaign
 * @returns the landscape DTO
 */
export async function getCampaignLandscape(dataSource: DataSource, campaignId: number): Promise<CampaignLandscapeDto> {
  const [campaign] = (await dataSource.query(
    `SELECT c.id, e.id AS enzyme_id, e.sequence FROM campaigns c JOIN enzymes e ON e.id = c.enzyme_id WHERE c.id = ?`,
    [campaignId],
  )) as { id: number; enzyme_id: number; sequence: string }[];
  if (!campaign) throw notFound('The campaign');
  const singles = (await dataSource.query(
    `SELECT v.id, v.label, v.status, v.summary_fold_change, v.summary_ddg_kj_per_mol, v.summary_measurement_count,
            m.position, m.from_residue, m.to_residue
       FROM variants v JOIN mutations m ON m.variant_id = v.id
      WHERE v.campaign_id = ? AND v.mutation_count = 1
      ORDER BY m.position, m.to_residue`,
    [campaignId],
  )) as {
    id: number;
    label: string;
    status: string;
    summary_fold_change: number | null;
    summary_ddg_kj_per_mol: number | null;
    summary_measurement_count: number;
    position: number;
    from_residue: string;
    to_residue: string;
  }[];
  const sites = (await dataSource.query(
    `SELECT position, role FROM catalytic_sites WHERE enzyme_id = ? ORDER BY position, role`,
    [campaign.enzyme_id],
  )) as { position: number; role: string }[];

  const roles = new Map<number, string[]>();
  for (const site of sites) roles.set(site.position, [...(roles.get(site.position) ?? []), site.role]);
  const positions = [...new Set([...singles.map((single) => single.position), ...roles.keys()])].sort((a, b) => a - b);
  const cells: LandscapeCellDto[] = singles.map((single) => ({
    position: single.position,
    from: single.from_residue,
    to: single.to_residue,
    variantId: single.id,
    label: single.label,
    status: single.status,
    measurementCount: single.summary_measurement_count,
    foldChange: single.summary_fold_change,
    log10FoldChange:
      single.summary_fold_change !== null && single.summary_fold_change > 0 ? Math.log10(single.summary_fold_change) : null,
    ddgKjPerMol: single.summary_ddg_kj_per_mol,
  }));
  return {
    campaignId,
    aminoAcids: LANDSCAPE_AMINO_ACIDS,
    positions: positions.map((position) => ({
      position,
      parentResidue: campaign.sequence[position - 1] ?? '',
      catalyticRoles: roles.get(position) ?? [],
    })),
    cells,
    counts: {
      singleVariants: cells.length,
      measured: cells.filter((cell) => cell.measurementCount > 0).length,
      withFoldChange: cells.filter((cell) => cell.log10FoldChange !== null).length,
      positions: positions.length,
      catalyticPositions: roles.size,
    },
  };
}

function toComparisonDto(comparison: ConditionComparison): ConditionComparisonDto {
  const fold = comparison.foldChangeKcatOverKm;
  return {
    substrate: comparison.substrate,
    temperatureC: roundCelsius(comparison.temperatureKelvin - ZERO_CELSIUS_KELVIN),
    ph: comparison.ph,
    measurementIds: comparison.measurementIds,
    parentMeasurementIds: comparison.parentMeasurementIds,
    variant: ratesDto(comparison.variant),
    parent: comparison.parent === null ? null : ratesDto(comparison.parent),
    matched: comparison.parent !== null,
    reason: comparison.reason,
    ddgKcatOverKm: energyDto(comparison.ddgKcatOverKm),
    ddgKcat: energyDto(comparison.ddgKcat),
    foldChange: fold,
    log10FoldChange: fold === null ? null : Math.log10(fold.value),
    kcatRatio: comparison.kcatRatio,
    kmRatio: comparison.kmRatio,
    notes: comparison.notes,
    onTargetSubstrate: comparison.onTargetSubstrate,
    targetDistance: comparison.targetDistance,
  };
}

function ratesDto(rates: CombinedRates): CombinedRatesDto {
  return {
    kcat: rates.kcatPerSecond && { ...rates.kcatPerSecond, unit: siUnits.turnover },
    km: rates.kmMolar && { ...rates.kmMolar, unit: siUnits.concentration },
    kcatOverKm: rates.kcatOverKmPerMolarSecond && { ...rates.kcatOverKmPerMolarSecond, unit: siUnits.specificity },
  };
}

function energyDto(energy: FreeEnergyDifference | null): EnergyDto | null {
  return energy === null ? null : { kJPerMol: energy.kJPerMol, kcalPerMol: energy.kcalPerMol };
}

function cycleEnergiesDto(energies: CycleEnergies | null): CycleEnergiesDto | null {
  return energies === null
    ? null
    : {
        ddgA: energies.ddgA,
        ddgB: energies.ddgB,
        ddgAB: energies.ddgAB,
        predictedAdditive: energies.predictedAdditive,
        coupling: { kJPerMol: energies.coupling.kJPerMol, kcalPerMol: energies.coupling.kcalPerMol },
      };
}
