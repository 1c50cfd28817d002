import type { EntityManager } from 'typeorm';
import { compareWithParent, type ComparableMeasurement, type TargetConditions } from '@shared/comparison/compare-with-parent';
import { byVariant, loadComparableMeasurements, type ComparableRow } from './comparable-measurements';

/** Flag code of a variant whose counted measurements all miss some STRENDA item. */
export const INCOMPLETE_REPORTING_FLAG = 'incomplete-reporting';
/** Flag code of a measured variant whose primary comparison found no matched parent measurement. */
export const NO_MATCHED_PARENT_FLAG = 'no-matched-parent';

/** Longest `summary_flags` text the column holds. */
const FLAGS_MAX_LENGTH = 500;

// Rows per UPDATE … FROM (VALUES …): at 11 parameters a row, each statement stays under SQLite's 32,766.
const UPDATE_BATCH = 2000;

/** The campaign facts the comparison needs: its target conditions and its parent variant. */
export interface CampaignComparisonContext {
  target: TargetConditions;
  parentVariantId: number | null;
}

/**
 * The campaign's target conditions and parent variant (the variant with the empty mutation set), or null
 * when there is no such campaign.
 *
 * @param manager entity manager
 * @param campaignId the campaign
 * @returns the context, or null
 */
export async function loadCampaignComparisonContext(
  manager: EntityManager,
  campaignId: number,
): Promise<CampaignComparisonContext | null> {
  const [campaign] = (await manager.query(
    `SELECT target_substrate, target_temperature_k, target_ph FROM campaigns WHERE id = ?`,
    [campaignId],
  )) as { target_substrate: string; target_temperature_k: number; target_ph: number }[];
  if (!campaign) return null;
  const [parent] = (await manager.query(
    `SELECT id FROM variants WHERE campaign_id = ? AND mutation_count = 0 ORDER BY id LIMIT 1`,
    [campaignId],
  )) as { id: number }[];
  return {
    target: { substrate: campaign.target_substrate, temperatureKelvin: campaign.target_temperature_k, ph: campaign.target_ph },
    parentVariantId: parent?.id ?? null,
  };
}

/** The derived summary columns of one variant. */
interface Summary {
  kcat: number | null;
  km: number | null;
  kcatOverKm: number | null;
  foldChange: number | null;
  ddg: number | null;
  ddgSe: number | null;
  phOptimum: number | null;
  count: number;
  completeness: number | null;
  flags: string;
}

interface SummaryRow {
  id: number;
  summary_kcat: number | null;
  summary_km: number | null;
  summary_kcat_over_km: number | null;
  summary_fold_change: number | null;
  summary_ddg_kj_per_mol: number | null;
  summary_ddg_se_kj_per_mol: number | null;
  summary_ph_optimum: number | null;
  summary_measurement_count: number;
  summary_completeness: number | null;
  summary_flags: string;
}

/**
 * Recomputes the `summary_*` columns of a campaign's variants from their counted measurements (draft,
 * submitted, approved; not superseded) and the condition-matched parent, using the primary comparison
 * (see compareWithParent): kcat, Km and kcat/Km of the variant's combined replicates, the fold change in
 * kcat/Km and ΔΔG‡ ± SE for kcat/Km, the pH optimum of the latest bell-shaped pH profile, the number of
 * counted measurements, the best STRENDA completeness among them, and flag codes (the measurements'
 * plausibility codes, `incomplete-reporting` when none is complete, `no-matched-parent`). The parent's own
 * row gets fold change 1 and ΔΔG‡ 0.
 *
 * Call it inside the transaction of every write that changes measurements or pH profiles. When the given
 * variants include the parent (or none are given), every variant of the campaign depends on the change and
 * the whole campaign is recomputed: one query loads all counted measurements, the comparisons run in memory,
 * and only rows whose numbers changed are written, 2,000 per UPDATE statement. `version` is not touched (a
 * derived value is not an edit, and must not make someone's open edit stale); `updated_at` is.
 *
 * @param manager the write's transaction manager
 * @param campaignId the campaign
 * @param variantIds the variants whose measurements changed; omitted means all
 * @returns how many variant rows were written
 */
export async function recomputeVariantSummaries(
  manager: EntityManager,
  campaignId: number,
  variantIds?: readonly number[],
): Promise<{ updated: number }> {
  const context = await loadCampaignComparisonContext(manager, campaignId);
  if (!context) return { updated: 0 };
  const { parentVariantId } = context;
  const whole = variantIds === undefined || (parentVariantId !== null && variantIds.includes(parentVariantId));

  const loadIds = whole ? undefined : [...new Set([...variantIds, ...(parentVariantId === null ? [] : [parentVariantId])])];
  const measurements = byVariant(await loadComparableMeasurements(manager, { campaignId, variantIds: loadIds }));
  const parentMeasurements: readonly ComparableMeasurement[] =
    parentVariantId === null ? [] : (measurements.get(parentVariantId) ?? []);

  const targetIds = whole ? null : [...new Set(variantIds)];
  const current = await loadSummaryRows(manager, campaignId, targetIds);
  const phOptima = await loadLatestBellOptima(manager, campaignId, targetIds);

  const changed: [number, Summary][] = [];
  for (const row of current) {
    const summary = summarize(
      measurements.get(row.id) ?? [],
      parentMeasurements,
      context.target,
      row.id === parentVariantId,
      phOptima.get(row.id) ?? null,
    );
    if (!sameSummary(row, summary)) changed.push([row.id, summary]);
  }
  await writeSummaries(manager, changed);
  return { updated: changed.length };
}


function summarize(
  measurements: readonly ComparableRow[],
  parentMeasurements: readonly ComparableMeasurement[],
  target: TargetConditions,
  isParent: boolean,
  phOptimum: number | null,
): Summary {
  if (measurements.length === 0) {
    return { kcat: null, km: null, kcatOverKm: null, foldChange: null, ddg: null, ddgSe: null, phOptimum, count: 0, completeness: null, flags: '' };
  }
  const { primary } = compareWithParent(measurements, parentMeasurements, target, { variantIsParent: isParent });
  let completeness = 0;
  const codes = new Set<string>();
  for (const measurement of measurements) {
    completeness = Math.max(completeness, measurement.completenessScore);
    for (const code of measurement.flagCodes) codes.add(code);
  }
  if (completeness < 1) codes.add(INCOMPLETE_REPORTING_FLAG);
  if (!isParent && primary?.parent === null) codes.add(NO_MATCHED_PARENT_FLAG);
  return {
    kcat: primary?.variant.kcatPerSecond?.value ?? null,
    km: primary?.variant.kmMolar?.value ?? null,
    kcatOverKm: primary?.variant.kcatOverKmPerMolarSecond?.value ?? null,
    foldChange: primary?.foldChangeKcatOverKm?.value ?? null,
    ddg: primary?.ddgKcatOverKm?.kJPerMol.value ?? null,
    ddgSe: primary?.ddgKcatOverKm?.kJPerMol.se ?? null,
    phOptimum,
    count: measurements.length,
    completeness,
    flags: [...codes].sort().join(',').slice(0, FLAGS_MAX_LENGTH),
  };
}

function sameSummary(row: SummaryRow, summary: Summary): boolean {
  return (
    row.summary_kcat === summary.kcat &&
    row.summary_km === summary.km &&
    row.summary_kcat_over_km === summary.kcatOverKm &&
    row.summary_fold_change === summary.foldChange &&
    row.summary_ddg_kj_per_mol === summary.ddg &&
    row.summary_ddg_se_kj_per_mol === summary.ddgSe &&
    row.summary_ph_optimum === summary.phOptimum &&
    row.summary_measurement_count === summary.count &&
    row.summary_completeness === summary.completeness &&
    row.summary_flags === summary.flags
  );
}

const SUMMARY_COLUMNS = `id, summary_kcat, summary_km, summary_kcat_over_km, summary_fold_change, summary_ddg_kj_per_mol,
  summary_ddg_se_kj_per_mol, summary_ph_optimum, summary_measurement_count, summary_completeness, summary_flags`;

async function loadSummaryRows(manager: EntityManager, campaignId: number, ids: readonly number[] | null): Promise<SummaryRow[]> {
  if (ids === null) {
    return manager.query(`SELECT ${SUMMARY_COLUMNS} FROM variants WHERE campaign_id = ?`, [campaignId]);
  }
  const rows: SummaryRow[] = [];
  for (let start = 0; start < ids.length; start += UPDATE_BATCH) {
    const chunk = ids.slice(start, start + UPDATE_BATCH);
    rows.push(
      ...((await manager.query(
        `SELECT ${SUMMARY_COLUMNS} FROM variants WHERE campaign_id = ? AND id IN (${chunk.map(() => '?').join(', ')})`,
        [campaignId, ...chunk],
      )) as SummaryRow[]),
    );
  }
  return rows;
}

/** The pH optimum of each variant's most recent bell-shaped profile (ids increase with time). */
async function loadLatestBellOptima(
  manager: EntityManager,
  campaignId: number,
  ids: readonly number[] | null,
): Promise<Map<number, number>> {
  const base = `SELECT p.variant_id, p.ph_optimum FROM ph_profiles p JOIN variants v ON v.id = p.variant_id
                 WHERE v.campaign_id = ? AND p.model = 'bell' AND p.ph_optimum IS NOT NULL`;
  const rows: { variant_id: number; ph_optimum: number }[] = [];
  if (ids === null) {
    rows.push(...((await manager.query(`${base} ORDER BY p.id`, [campaignId])) as typeof rows));
  } else {
    for (let start = 0; start < ids.length; start += UPDATE_BATCH) {
      const chunk = ids.slice(start, start + UPDATE_BATCH);
      rows.push(
        ...((await manager.query(`${base} AND p.variant_id IN (${chunk.map(() => '?').join(', ')}) ORDER BY p.id`, [
          campaignId,
          ...chunk,
        ])) as typeof rows),
      );
    }
  }
  const optima = new Map<number, number>();
  for (const row of rows) optima.set(row.variant_id, row.ph_optimum);
  return optima;
}

async function writeSummaries(manager: EntityManager, changed: readonly [number, Summary][]): Promise<void> {
  // The format TypeORM writes datetime columns in, so ordering by updated_at stays consistent.
  const now = new Date().toISOString().replace('T', ' ').replace('Z', '');
  for (let start = 0; start < changed.length; start += UPDATE_BATCH) {
    const batch = changed.slice(start, start + UPDATE_BATCH);
    const parameters: (number | string | null)[] = [now];
    for (const [id, summary] of batch) {
      parameters.push(
        id,
        summary.kcat,
        summary.km,
        summary.kcatOverKm,
        summary.foldChange,
        summary.ddg,
        summary.ddgSe,
        summary.phOptimum,
        summary.count,
        summary.completeness,
        summary.flags,
      );
    }
    // SQLite names the columns of a VALUES list column1, column2, …
    await manager.query(
      `UPDATE variants
          SET summary_kcat = d.column2, summary_km = d.column3, summary_kcat_over_km = d.column4,
              summary_fold_change = d.column5, summary_ddg_kj_per_mol = d.column6, summary_ddg_se_kj_per_mol = d.column7,
              summary_ph_optimum = d.column8, summary_measurement_count = d.column9, summary_completeness = d.column10,
              summary_flags = d.column11, updated_at = ?
         FROM (VALUES ${batch.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}) AS d
        WHERE variants.id = d.column1`,
      parameters,
    );
  }
}
