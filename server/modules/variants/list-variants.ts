import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { CatalyticRole } from '@shared/schemas/enzyme';
import {
  variantUnits,
  type ListVariantsQuery,
  type VariantListDto,
  type VariantListRowDto,
  type VariantSortKey,
  type VariantStatus,
} from '@shared/schemas/variant';
import { isoFromSqlite } from '../../sqlite-datetime';
import { writeRevision } from '../../write-transaction';

/** The variant columns every variant read selects, under the names of {@link VariantRecord}. */
export const variantColumns = `v.id, v.campaign_id, v.enzyme_id, v.parent_variant_id, v.label, v.hgvs, v.mutation_count,
  v.construct_id, v.status, v.summary_kcat, v.summary_km, v.summary_kcat_over_km, v.summary_fold_change,
  v.summary_ddg_kj_per_mol, v.summary_ddg_se_kj_per_mol, v.summary_ph_optimum, v.summary_measurement_count,
  v.summary_completeness, v.summary_flags, v.version, v.created_at, v.updated_at`;

/** A variants row as raw SQL returns {@link variantColumns}. */
export interface VariantRecord {
  id: number;
  campaign_id: number;
  enzyme_id: number;
  parent_variant_id: number | null;
  label: string;
  hgvs: string;
  mutation_count: number;
  construct_id: string | null;
  status: VariantStatus;
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
  version: number;
  created_at: string;
  updated_at: string;
}

interface MutationRecord {
  variant_id: number;
  position: number;
  from_residue: string;
  to_residue: string;
}

/** Catalytic roles by enzyme and position, keyed `enzymeId:position`. */
type RolesBySite = Map<string, CatalyticRole[]>;

const sortColumns: Record<VariantSortKey, { column: string; nullable: boolean }> = {
  label: { column: 'v.label', nullable: false },
  position: { column: 'v.first_position', nullable: true },
  kcat: { column: 'v.summary_kcat', nullable: true },
  km: { column: 'v.summary_km', nullable: true },
  kcatOverKm: { column: 'v.summary_kcat_over_km', nullable: true },
  foldChange: { column: 'v.summary_fold_change', nullable: true },
  ddg: { column: 'v.summary_ddg_kj_per_mol', nullable: true },
  updated: { column: 'v.updated_at', nullable: false },
};

/**
 * One page of the variant registry with the total count, filtered and sorted in SQL on indexed columns.
 *
 * Mutation-level filters (position, residue, catalytic role) are one sub-query on a single mutation
 * row, so they hold for the same mutated site. Nulls sort last in both directions: rows with
 * a value are paged first, straight off the sort column's index, then the rows without one by id, so
 * neither part needs a sort of the whole filtered set (SQLite cannot read `NULLS LAST` off an
 * ascending index). The page's rows, their mutations and the roles of their sites are then read in
 * one query each.
 *
 * @param dataSource the application's data source
 * @param query the parsed list query
 * @returns `{ rows, total, page, pageSize }`
 */
export async function listVariants(dataSource: DataSource, query: ListVariantsQuery): Promise<VariantListDto> {
  return remembered(pageCaches, dataSource, JSON.stringify(query), () => readVariantPage(dataSource, query));
}

/** A list page ready to send: its JSON bytes and their entity tag. */
export interface VariantListResponse {
  body: Buffer;
  etag: string;
}

/**
 * The same page serialised as JSON, as the list route sends it, with an entity tag; remembered like the
 * page itself, since turning 50–500 rows into bytes and hashing them costs more than finding them in a
 * warm cache.
 *
 * @param dataSource the application's data source
 * @param query the parsed list query
 * @returns the JSON bytes of `{ rows, total, page, pageSize }` and a strong ETag of them
 */
export async function listVariantsResponse(dataSource: DataSource, query: ListVariantsQuery): Promise<VariantListResponse> {
  return remembered(responseCaches, dataSource, JSON.stringify(query), async () => {
    const body = Buffer.from(JSON.stringify(await listVariants(dataSource, query)));
    return { body, etag: `"${createHash('sha1').update(body).digest('base64url')}"` };
  });
}

async function readVariantPage(dataSource: DataSource, query: ListVariantsQuery): Promise<VariantListDto> {
  const { where, parameters } = filterClause(query);
  const { column, nullable } = sortColumns[query.sort];
  const direction = query.order === 'desc' ? 'DESC' : 'ASC';
  const offset = (query.page - 1) * query.pageSize;
  const whereSql = (conditions: readonly string[]) => (conditions.length === 0 ? '' : `WHERE ${conditions.join(' AND ')}`);

  const total = await countVariants(dataSource, whereSql(where), parameters);
  const ids: number[] = [];
  if (offset < total) {
    const valuedWhere = nullable ? [...where, `${column} IS NOT NULL`] : where;
    const valued: { id: number }[] = await dataSource.query(
      `SELECT v.id FROM variants v ${whereSql(valuedWhere)} ORDER BY ${column} ${direction}, v.id ${direction} LIMIT ? OFFSET ?`,
      [...parameters, query.pageSize, offset],
    );
    ids.push(...valued.map((row) => row.id));
    if (nullable && ids.length < query.pageSize && offset + ids.length < total) {
      // The page reaches the rows without a value. Where it starts among them follows from the rows with
      // one: all of them lie before this page when none was found, else they end within it.
      const valuedCount =
        ids.length > 0 ? offset + ids.length : Number((await dataSource.query(`SELECT COUNT(*) AS n FROM variants v ${whereSql(valuedWhere)}`, parameters))[0].n);
      const unvalued: { id: number }[] = await dataSource.query(
        `SELECT v.id FROM variants v ${whereSql([...where, `${column} IS NULL`])} ORDER BY v.id ${direction} LIMIT ? OFFSET ?`,
        [...parameters, query.pageSize - ids.length, Math.max(0, offset - valuedCount)],
      );
      ids.push(...unvalued.map((row) => row.id));
    }
  }

  // The page's ids come off an index; the rows are then read by primary key and put back in page order.
  const records: VariantRecord[] =
    ids.length === 0 ? [] : await dataSource.query(`SELECT ${variantColumns} FROM variants v WHERE v.id IN (${ids.map(() => '?').join(', ')})`, ids);
  const byId = new Map(records.map((record) => [record.id, record]));
  const rows = await withMutations(
    dataSource.manager,
    ids.map((id) => byId.get(id)).filter((record): record is VariantRecord => record !== undefined),
  );
  return { rows, total, page: query.page, pageSize: query.pageSize };
}

interface RevisionCache<T> {
  entries: Map<string, { revision: number; value: T }>;
}
const cacheSize = 500;
const countCaches = new WeakMap<DataSource, RevisionCache<number>>();
const pageCaches = new WeakMap<DataSource, RevisionCache<VariantListDto>>();
const responseCaches = new WeakMap<DataSource, RevisionCache<VariantListResponse>>();

/**
 * A read result remembered until the next write on the data source (least recently used first out).
 * Scrolling the registry asks for page after page of one filter, so its count is asked again and again;
 * a shared view link or a back/forward step asks for the same page again. Every registry write goes
 * through writeTransaction, which moves the revision on, so a remembered result is never stale.
 */
async function remembered<T>(
  caches: WeakMap<DataSource, RevisionCache<T>>,
  dataSource: DataSource,
  key: string,
  read: () => Promise<T>,
): Promise<T> {
  let cache = caches.get(dataSource);
  if (!cache) caches.set(dataSource, (cache = { entries: new Map() }));
  const revision = writeRevision(dataSource);
  const cached = cache.entries.get(key);
  cache.entries.delete(key);
  if (cached && cached.revision === revision) {
    cache.entries.set(key, cached);
    return cached.value;
  }
  const value = await read();
  // Only a result read at the current revision may be kept: a write may have landed while reading.
  if (writeRevision(dataSource) === revision) {
    cache.entries.set(key, { revision, value });
    if (cache.entries.size > cacheSize) cache.entries.delete(cache.entries.keys().next().value as string);
  }
  return value;
}

async function countVariants(dataSource: DataSource, whereSql: string, parameters: readonly unknown[]): Promise<number> {
  return remembered(countCaches, dataSource, `${whereSql}\u0000${JSON.stringify(parameters)}`, async () => {
    // COUNT(*) alone can be answered from an index; counting the sort column's values would read rows.
    const [{ total }] = await dataSource.query(`SELECT COUNT(*) AS total FROM variants v ${whereSql}`, [...parameters]);
    return Number(total);
  });
}

/** Builds list rows for variant records, reading their mutations and site roles in one query each. */
export async function withMutations(manager: EntityManager, records: readonly VariantRecord[]): Promise<VariantListRowDto[]> {
  if (records.length === 0) return [];
  const ids = records.map((record) => record.id);
  const mutations: MutationRecord[] = await manager.query(
    `SELECT variant_id, position, from_residue, to_residue FROM mutations
      WHERE variant_id IN (${ids.map(() => '?').join(', ')})
      ORDER BY variant_id, position`,
    ids,
  );
  const byVariant = new Map<number, MutationRecord[]>();
  for (const mutation of mutations) {
    const list = byVariant.get(mutation.variant_id);
    if (list) list.push(mutation);
    else byVariant.set(mutation.variant_id, [mutation]);
  }
  const roles = await rolesForEnzymes(manager, [...new Set(records.map((record) => record.enzyme_id))]);
  return records.map((record) => toListRow(record, byVariant.get(record.id) ?? [], roles));
}

async function rolesForEnzymes(manager: EntityManager, enzymeIds: readonly number[]): Promise<RolesBySite> {
  const roles: RolesBySite = new Map();
  if (enzymeIds.length === 0) return roles;
  const sites: { enzyme_id: number; position: number; role: CatalyticRole }[] = await manager.query(
    `SELECT enzyme_id, position, role FROM catalytic_sites WHERE enzyme_id IN (${enzymeIds.map(() => '?').join(', ')}) ORDER BY role`,
    [...enzymeIds],
  );
  for (const site of sites) {
    const key = `${site.enzyme_id}:${site.position}`;
    roles.set(key, [...(roles.get(key) ?? []), site.role]);
  }
  return roles;
}

function toListRow(record: VariantRecord, mutations: readonly MutationRecord[], roles: RolesBySite): VariantListRowDto {
  const mutationDtos = mutations.map((mutation) => ({
    position: mutation.position,
    from: mutation.from_residue,
    to: mutation.to_residue,
    roles: roles.get(`${record.enzyme_id}:${mutation.position}`) ?? [],
  }));
  return {
    id: record.id,
    campaignId: record.campaign_id,
    enzymeId: record.enzyme_id,
    label: record.label,
    hgvs: record.hgvs,
    isParent: record.mutation_count === 0,
    mutations: mutationDtos,
    positions: mutationDtos.map((mutation) => mutation.position),
    roles: [...new Set(mutationDtos.flatMap((mutation) => mutation.roles))],
    status: record.status,
    constructId: record.construct_id,
    parentVariantId: record.parent_variant_id,
    kcat: record.summary_kcat === null ? null : { value: record.summary_kcat, unit: variantUnits.kcat },
    km: record.summary_km === null ? null : { value: record.summary_km, unit: variantUnits.km },
    kcatOverKm: record.summary_kcat_over_km === null ? null : { value: record.summary_kcat_over_km, unit: variantUnits.kcatOverKm },
    foldChange: record.summary_fold_change,
    ddg:
      record.summary_ddg_kj_per_mol === null
        ? null
        : { value: record.summary_ddg_kj_per_mol, se: record.summary_ddg_se_kj_per_mol, unit: variantUnits.ddg },
    phOptimum: record.summary_ph_optimum,
    measurementCount: record.summary_measurement_count,
    completeness: record.summary_completeness,
    flags: record.summary_flags.split(',').filter((flag) => flag !== ''),
    version: record.version,
    createdAt: isoFromSqlite(record.created_at),
    updatedAt: isoFromSqlite(record.updated_at),
  };
}

// LIKE's wildcards typed by a user are searched for literally.
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`;
}

function filterClause(query: ListVariantsQuery): { where: string[]; parameters: unknown[] } {
  const where: string[] = [];
  const parameters: unknown[] = [];
  if (query.campaignId !== undefined) {
    where.push('v.campaign_id = ?');
    parameters.push(query.campaignId);
  }
  if (query.status !== undefined) {
    where.push(`v.status IN (${query.status.map(() => '?').join(', ')})`);
    parameters.push(...query.status);
  }
  if (query.minFoldChange !== undefined) {
    where.push('v.summary_fold_change >= ?');
    parameters.push(query.minFoldChange);
  }
  if (query.ddgMin !== undefined) {
    where.push('v.summary_ddg_kj_per_mol >= ?');
    parameters.push(query.ddgMin);
  }
  if (query.ddgMax !== undefined) {
    where.push('v.summary_ddg_kj_per_mol <= ?');
    parameters.push(query.ddgMax);
  }
  if (query.q !== undefined) {
    const pattern = likePattern(query.q);
    where.push(
      `(v.label LIKE ? ESCAPE '\\' OR v.hgvs LIKE ? ESCAPE '\\' OR v.construct_id LIKE ? ESCAPE '\\' OR v.notes LIKE ? ESCAPE '\\')`,
    );
    parameters.push(pattern, pattern, pattern, pattern);
  }
  const mutationFilter = mutationFilterClause(query);
  if (mutationFilter !== undefined) {
    where.push(mutationFilter.sql);
    parameters.push(...mutationFilter.parameters);
  }
  return { where, parameters };
}

/**
 * The mutation-level filters as one condition on a single mutation row, so that position, residue and
 * role hold for the same mutated site. A position or a role is selective (a few hundred mutations of
 * 300,000), so those are an uncorrelated IN driven from the mutations' position index; a residue alone
 * matches about a tenth of all mutations, where a correlated EXISTS per candidate variant is cheaper
 * than collecting every matching variant id first.
 */
function mutationFilterClause(query: ListVariantsQuery): { sql: string; parameters: unknown[] } | undefined {
  if (query.position === undefined && query.residue === undefined && query.role === undefined) return undefined;
  const conditions: string[] = [];
  const parameters: unknown[] = [];
  if (query.role !== undefined) {
    conditions.push('cs.role = ?');
    parameters.push(query.role);
  }
  if (query.position !== undefined) {
    conditions.push('m.position = ?');
    parameters.push(query.position);
  }
  if (query.residue !== undefined) {
    conditions.push('(m.from_residue = ? OR m.to_residue = ?)');
    parameters.push(query.residue, query.residue);
  }
  if (query.position === undefined && query.role === undefined) {
    return { sql: `EXISTS (SELECT 1 FROM mutations m WHERE m.variant_id = v.id AND ${conditions.join(' AND ')})`, parameters };
  }
  // A site annotates the enzyme the mutation's variant is built on, hence the join through variants.
  const from =
    query.role === undefined
      ? 'mutations m'
      : `catalytic_sites cs
         JOIN mutations m ON m.position = cs.position
         JOIN variants mv ON mv.id = m.variant_id AND mv.enzyme_id = cs.enzyme_id`;
  return { sql: `v.id IN (SELECT m.variant_id FROM ${from} WHERE ${conditions.join(' AND ')})`, parameters };
}
