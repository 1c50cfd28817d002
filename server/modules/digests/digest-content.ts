import type { EntityManager } from 'typeorm';
import { compareWithParent } from '@shared/comparison/compare-with-parent';
import { rankMovers, type RankedEntry, type RankMove } from '@shared/digest/rank-movers';
import { rankVariants } from '@shared/digest/rank-variants';
import type { CampaignStatus } from '@shared/schemas/campaign';
import type { DigestContentDto, DigestMoverDto, DigestRankedVariantDto, DigestReviewState } from '@shared/schemas/digest';
import type { VariantStatus } from '@shared/schemas/variant';
import { isoFromSqlite, sqliteFromDate } from '../../sqlite-datetime';
import { ZERO_CELSIUS_KELVIN, roundCelsius } from '../assays/assay-conditions';
import { byVariant, loadComparableMeasurements, type ComparableRow } from '../comparisons/comparable-measurements';
import { INCOMPLETE_REPORTING_FLAG, loadCampaignComparisonContext } from '../comparisons/variant-summary';

/** Items each "this week" list shows (the totals count them all). */
const LIST_LIMIT = 20;
/** Longest note a digest quotes. */
const NOTE_LIMIT = 280;
const WEEK_MS = 7 * 24 * 60 * 60 * 1000;
// Well below SQLite's limit on bound parameters.
const ID_CHUNK = 5000;

/** What a digest is generated with. */
export interface DigestContentOptions {
  reviewStates: readonly DigestReviewState[];
  topCount: number;
  /** The end of the digest's week: the scheduled slot, or now for "send now" and the preview. */
  periodEnd: Date;
  timezone: string;
  /** The digest compared with for rank movers; null for a campaign's first. */
  previous: { runId: number; at: Date; ranking: readonly RankedEntry[] } | null;
}

interface CampaignRow {
  id: number;
  name: string;
  objective: string;
  status: CampaignStatus;
  target_substrate: string;
  target_ph: number;
  target_temperature_k: number;
  lead_id: number | null;
  lead_name: string | null;
}

/**
 * Generates one campaign's digest content from the database: the top variants by ΔΔG‡ for kcat/Km
 * against the condition-matched parent (each variant's primary comparison, see compareWithParent, on the
 * measurements in the chosen review states only), rank movers since the previous digest, variants and
 * measurements added in the seven days before `periodEnd`, measurements waiting for review, and flagged
 * variants (plausibility flags and incomplete reporting). Reads only; returns null for an unknown campaign.
 *
 * @param manager entity manager
 * @param campaignId the campaign
 * @param options review states, list length, period end, time zone and the previous digest
 * @returns the content DTO, or null
 */
export async function buildDigestContent(manager: EntityManager, campaignId: number, options: DigestContentOptions): Promise<DigestContentDto | null> {
  const [campaign] = (await manager.query(
    `SELECT c.id, c.name, c.objective, c.status, c.target_substrate, c.target_ph, c.target_temperature_k, c.lead_id, u.name AS lead_name
       FROM campaigns c LEFT JOIN users u ON u.id = c.lead_id WHERE c.id = ?`,
    [campaignId],
  )) as CampaignRow[];
  const context = await loadCampaignComparisonContext(manager, campaignId);
  if (!campaign || !context) return null;
  const states = [...options.reviewStates];
  const periodStart = new Date(options.periodEnd.getTime() - WEEK_MS);

  const rows = await loadComparableMeasurements(manager, { campaignId, states });
  const measurements = byVariant(rows);
  const reviewStateOf = await loadReviewStates(manager, campaignId, states);
  const labels = await loadLabels(manager, campaignId);
  const parentRows = context.parentVariantId === null ? [] : (measurements.get(context.parentVariantId) ?? []);

  const candidates: (Omit<DigestRankedVariantDto, 'rank' | 'clearOfParent'> & { label: string })[] = [];
  let unmatchedCount = 0;
  const flagsByVariant = new Map<number, string[]>();
  for (const [variantId, variantRows] of measurements) {
    const codes = flagCodes(variantRows);
    if (codes.length > 0) flagsByVariant.set(variantId, codes);
    if (variantId === context.parentVariantId) continue;
    const primary = compareWithParent(variantRows, parentRows, context.target).primary;
    const ddg = primary?.ddgKcatOverKm?.kJPerMol;
    if (!primary || !ddg) {
      unmatchedCount += 1;
      continue;
    }
    const counted: Partial<Record<DigestReviewState, number>> = {};
    for (const id of primary.measurementIds) {
      const state = reviewStateOf.get(id);
      if (state) counted[state] = (counted[state] ?? 0) + 1;
    }
    candidates.push({
      variantId,
      label: labels.get(variantId) ?? `variant ${variantId}`,
      ddgKjPerMol: { value: ddg.value, se: ddg.se },
      foldChange: primary.foldChangeKcatOverKm,
      kcatOverKmPerMolarSecond: primary.variant.kcatOverKmPerMolarSecond?.value ?? null,
      n: primary.measurementIds.length,
      reviewStates: counted,
      substrate: primary.substrate,
      temperatureC: roundCelsius(primary.temperatureKelvin - ZERO_CELSIUS_KELVIN),
      ph: Math.round(primary.ph * 100) / 100,
      flags: codes,
      notes: null,
    });
  }
  const ranked = rankVariants(candidates);
  const top = ranked.slice(0, options.topCount);
  const notes = await loadNotes(manager, top.map((entry) => entry.variantId));
  for (const entry of top) entry.notes = notes.get(entry.variantId) ?? null;

  const rankOf = new Map(ranked.map((entry) => [entry.variantId, entry.rank]));
  const mover = (move: RankMove): DigestMoverDto => ({ ...move, label: labels.get(move.variantId) ?? `variant ${move.variantId}` });
  const moves = options.previous ? rankMovers(options.previous.ranking, top, rankOf) : { up: [], down: [], new: [] };

  const flagged = [...flagsByVariant.entries()]
    .map(([variantId, codes]) => ({ variantId, label: labels.get(variantId) ?? `variant ${variantId}`, codes }))
    .sort((first, second) => (rankOf.get(first.variantId) ?? Infinity) - (rankOf.get(second.variantId) ?? Infinity) || compareText(first.label, second.label));

  const parentId = context.parentVariantId;
  return {
    campaign: {
      id: campaign.id,
      name: campaign.name,
      objective: campaign.objective,
      status: campaign.status,
      targetSubstrate: campaign.target_substrate,
      targetPh: campaign.target_ph,
      targetTemperatureC: roundCelsius(campaign.target_temperature_k - ZERO_CELSIUS_KELVIN),
      lead: campaign.lead_id === null ? null : { id: campaign.lead_id, name: campaign.lead_name ?? '' },
    },
    generatedAt: new Date().toISOString(),
    period: { start: periodStart.toISOString(), end: options.periodEnd.toISOString() },
    timezone: options.timezone,
    reviewStates: states,
    topCount: options.topCount,
    parent: parentId === null ? null : { variantId: parentId, label: labels.get(parentId) ?? 'parent', measurementCount: parentRows.length },
    ranking: top,
    rankedCount: ranked.length,
    unmatchedCount,
    movers: {
      since: options.previous ? { runId: options.previous.runId, at: options.previous.at.toISOString() } : null,
      up: moves.up.map(mover),
      down: moves.down.map(mover),
      new: moves.new.map(mover),
    },
    addedVariants: await loadAddedVariants(manager, campaignId, periodStart, options.periodEnd),
    addedMeasurements: await loadAddedMeasurements(manager, campaignId, periodStart, options.periodEnd),
    awaitingReview: await loadAwaitingReview(manager, campaignId),
    flags: { total: flagged.length, items: flagged.slice(0, LIST_LIMIT) },
    registryPath: `/registry?campaignId=${campaign.id}&sort=ddg&order=asc`,
  };
}

/** Plausibility flag codes of a variant's counted measurements, and incomplete reporting when none is complete. */
function flagCodes(rows: readonly ComparableRow[]): string[] {
  const codes = new Set<string>();
  let completeness = 0;
  for (const row of rows) {
    completeness = Math.max(completeness, row.completenessScore);
    for (const code of row.flagCodes) codes.add(code);
  }
  if (completeness < 1) codes.add(INCOMPLETE_REPORTING_FLAG);
  return [...codes].sort();
}

async function loadReviewStates(manager: EntityManager, campaignId: number, states: readonly string[]): Promise<Map<number, DigestReviewState>> {
  const rows = (await manager.query(
    `SELECT m.id, m.review_state FROM measurements m JOIN variants v ON v.id = m.variant_id
      WHERE v.campaign_id = ? AND m.superseded_by_id IS NULL AND m.review_state IN (${states.map(() => '?').join(', ')})`,
    [campaignId, ...states],
  )) as { id: number; review_state: DigestReviewState }[];
  return new Map(rows.map((row) => [row.id, row.review_state]));
}

async function loadLabels(manager: EntityManager, campaignId: number): Promise<Map<number, string>> {
  const rows = (await manager.query(`SELECT id, label FROM variants WHERE campaign_id = ?`, [campaignId])) as { id: number; label: string }[];
  return new Map(rows.map((row) => [row.id, row.label]));
}

async function loadNotes(manager: EntityManager, ids: readonly number[]): Promise<Map<number, string>> {
  const notes = new Map<number, string>();
  for (let start = 0; start < ids.length; start += ID_CHUNK) {
    const chunk = ids.slice(start, start + ID_CHUNK);
    const rows = (await manager.query(`SELECT id, notes FROM variants WHERE notes IS NOT NULL AND id IN (${chunk.map(() => '?').join(', ')})`, [
      ...chunk,
    ])) as { id: number; notes: string }[];
    for (const row of rows) notes.set(row.id, shorten(row.notes));
  }
  return notes;
}

async function loadAddedVariants(manager: EntityManager, campaignId: number, start: Date, end: Date): Promise<DigestContentDto['addedVariants']> {
  const window = [campaignId, sqliteFromDate(start), sqliteFromDate(end)];
  const where = `campaign_id = ? AND mutation_count > 0 AND created_at >= ? AND created_at <= ?`;
  const [{ n }] = (await manager.query(`SELECT COUNT(*) AS n FROM variants WHERE ${where}`, window)) as { n: number }[];
  const rows = (await manager.query(
    `SELECT id, label, status, notes, created_at FROM variants WHERE ${where} ORDER BY created_at DESC, id DESC LIMIT ${LIST_LIMIT}`,
    window,
  )) as { id: number; label: string; status: VariantStatus; notes: string | null; created_at: string }[];
  return {
    total: n,
    items: rows.map((row) => ({ variantId: row.id, label: row.label, status: row.status, notes: row.notes === null ? null : shorten(row.notes), createdAt: isoFromSqlite(row.created_at) })),
  };
}

async function loadAddedMeasurements(manager: EntityManager, campaignId: number, start: Date, end: Date): Promise<DigestContentDto['addedMeasurements']> {
  const window = [campaignId, sqliteFromDate(start), sqliteFromDate(end)];
  const from = `FROM measurements m JOIN variants v ON v.id = m.variant_id
               WHERE v.campaign_id = ? AND m.superseded_by_id IS NULL AND m.created_at >= ? AND m.created_at <= ?`;
  const counts = (await manager.query(`SELECT m.review_state AS state, COUNT(*) AS n ${from} GROUP BY m.review_state`, window)) as { state: string; n: number }[];
  const rows = (await manager.query(
    `SELECT m.id, m.variant_id, v.label, m.review_state, m.kcat_over_km, m.created_at ${from} ORDER BY m.created_at DESC, m.id DESC LIMIT ${LIST_LIMIT}`,
    window,
  )) as { id: number; variant_id: number; label: string; review_state: string; kcat_over_km: number | null; created_at: string }[];
  return {
    total: counts.reduce((sum, row) => sum + row.n, 0),
    byState: Object.fromEntries(counts.map((row) => [row.state, row.n])),
    items: rows.map((row) => ({
      measurementId: row.id,
      variantId: row.variant_id,
      label: row.label,
      reviewState: row.review_state,
      kcatOverKmPerMolarSecond: row.kcat_over_km,
      createdAt: isoFromSqlite(row.created_at),
    })),
  };
}

async function loadAwaitingReview(manager: EntityManager, campaignId: number): Promise<DigestContentDto['awaitingReview']> {
  const from = `FROM measurements m JOIN variants v ON v.id = m.variant_id
               WHERE v.campaign_id = ? AND m.superseded_by_id IS NULL AND m.review_state = 'submitted'`;
  const [{ n }] = (await manager.query(`SELECT COUNT(*) AS n ${from}`, [campaignId])) as { n: number }[];
  // A submitted measurement is unchanged since it was submitted, so updated_at is when it started waiting.
  const rows = (await manager.query(`SELECT m.id, m.variant_id, v.label, m.updated_at ${from} ORDER BY m.updated_at, m.id LIMIT ${LIST_LIMIT}`, [campaignId])) as {
    id: number;
    variant_id: number;
    label: string;
    updated_at: string;
  }[];
  return {
    total: n,
    items: rows.map((row) => ({ measurementId: row.id, variantId: row.variant_id, label: row.label, since: isoFromSqlite(row.updated_at) })),
  };
}

function shorten(text: string): string {
  return text.length <= NOTE_LIMIT ? text : `${text.slice(0, NOTE_LIMIT - 1)}…`;
}

function compareText(first: string, second: string): number {
  return first < second ? -1 : first > second ? 1 : 0;
}
