import type { EntityManager } from 'typeorm';
import type { ComparableMeasurement } from '@shared/comparison/compare-with-parent';
import { countedReviewStates, type CountedReviewState } from '@shared/schemas/measurement';
import type { StoredFlag } from '../measurements/measurement.entity';

/** A counted measurement with what the summaries need beside the rates. */
export interface ComparableRow extends ComparableMeasurement {
  variantId: number;
  completenessScore: number;
  flagCodes: string[];
}

interface Row {
  id: number;
  variant_id: number;
  kcat: number | null;
  kcat_se: number | null;
  km: number | null;
  km_se: number | null;
  kcat_over_km: number | null;
  kcat_over_km_se: number | null;
  completeness_score: number;
  flags: string;
  substrate: string;
  temperature_k: number;
  ph: number;
}

// Well below SQLite's limit on bound parameters (32,766).
const ID_CHUNK = 5000;

/**
 * Loads the measurements that count (by default draft, submitted and approved; never superseded) of a
 * campaign, or of some of its variants, with their assay conditions: one query per 5,000 variant ids, so
 * that a whole campaign of 100,000 variants is read in one pass.
 *
 * @param manager entity manager (inside the caller's transaction when there is one)
 * @param options.campaignId the campaign
 * @param options.variantIds only these variants (all of the campaign's when omitted)
 * @param options.states the review states that count
 * @returns the rows, ordered by id
 */
export async function loadComparableMeasurements(
  manager: EntityManager,
  options: { campaignId: number; variantIds?: readonly number[]; states?: readonly CountedReviewState[] },
): Promise<ComparableRow[]> {
  const states = options.states ?? countedReviewStates;
  const base = `SELECT m.id, m.variant_id, m.kcat, m.kcat_se, m.km, m.km_se, m.kcat_over_km, m.kcat_over_km_se,
                       m.completeness_score, m.flags, a.substrate, a.temperature_k, a.ph
                  FROM measurements m
                  JOIN assays a ON a.id = m.assay_id
                  JOIN variants v ON v.id = m.variant_id
                 WHERE v.campaign_id = ? AND m.superseded_by_id IS NULL
                   AND m.review_state IN (${states.map(() => '?').join(', ')})`;
  const rows: Row[] = [];
  if (options.variantIds === undefined) {
    rows.push(...((await manager.query(`${base} ORDER BY m.id`, [options.campaignId, ...states])) as Row[]));
  } else {
    const ids = [...new Set(options.variantIds)];
    for (let start = 0; start < ids.length; start += ID_CHUNK) {
      const chunk = ids.slice(start, start + ID_CHUNK);
      rows.push(
        ...((await manager.query(`${base} AND m.variant_id IN (${chunk.map(() => '?').join(', ')}) ORDER BY m.id`, [
          options.campaignId,
          ...states,
          ...chunk,
        ])) as Row[]),
      );
    }
  }
  return rows.map(toComparable);
}

function toComparable(row: Row): ComparableRow {
  return {
    id: row.id,
    variantId: row.variant_id,
    substrate: row.substrate,
    temperatureKelvin: row.temperature_k,
    ph: row.ph,
    kcatPerSecond: rate(row.kcat, row.kcat_se),
    kmMolar: rate(row.km, row.km_se),
    kcatOverKmPerMolarSecond: rate(row.kcat_over_km, row.kcat_over_km_se),
    completenessScore: row.completeness_score,
    // Most measurements carry no flag; skipping the parse matters when a whole campaign is loaded.
    flagCodes: row.flags === '[]' ? [] : (JSON.parse(row.flags) as StoredFlag[]).map((flag) => flag.code),
  };
}

// A stored value without a standard error cannot be weighted; an infinite SE marks it so for the combination.
function rate(value: number | null, se: number | null): { value: number; se: number } | null {
  return value === null ? null : { value, se: se ?? Number.POSITIVE_INFINITY };
}

/**
 * Groups rows by variant id.
 *
 * @param rows comparable rows
 * @returns a map from variant id to its rows
 */
export function byVariant(rows: readonly ComparableRow[]): Map<number, ComparableRow[]> {
  const grouped = new Map<number, ComparableRow[]>();
  for (const row of rows) {
    const list = grouped.get(row.variantId);
    if (list) list.push(row);
    else grouped.set(row.variantId, [row]);
  }
  return grouped;
}
