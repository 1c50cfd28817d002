import type { Database, Statement } from 'better-sqlite3';
import type { EntityManager } from 'typeorm';
import type { ColumnMetadata } from 'typeorm/metadata/ColumnMetadata.js';
import type { AuditEntry } from '../audit/record-audit';

// SQLite takes at most 32,766 bound parameters a statement (SQLITE_MAX_VARIABLE_NUMBER since 3.32).
// Beyond 100 rows a statement is no faster (measured on 10,000 measurement rows).
const MAX_PARAMETERS = 30_000;
const MAX_ROWS_PER_STATEMENT = 100;

// Prepared once per connection, column list, table and batch size. A table has two (a full batch and a
// single row, for the rest), so the cache stays a few statements small; column lists are the callers'
// constant arrays, so finding a statement builds no SQL text.
const statementCache = new WeakMap<Database, WeakMap<readonly string[], Map<string, Statement>>>();

/**
 * The better-sqlite3 connection under the caller's transaction. The rows go to it directly rather than
 * through `manager.query`, which copies the bound values and spreads them into the call, thousands a
 * statement. better-sqlite3 has one connection, on which the query runner opened the transaction, so
 * these statements are part of it.
 */
async function transactionConnection(manager: EntityManager): Promise<Database> {
  const runner = manager.queryRunner;
  if (!runner || !runner.isTransactionActive) throw new Error('multi-row inserts must run inside the caller’s transaction');
  return (await runner.connect()) as Database;
}

function insertStatement(connection: Database, table: string, columns: readonly string[], rows: number): Statement {
  let byColumns = statementCache.get(connection);
  if (!byColumns) {
    byColumns = new WeakMap();
    statementCache.set(connection, byColumns);
  }
  let statements = byColumns.get(columns);
  if (!statements) {
    statements = new Map();
    byColumns.set(columns, statements);
  }
  const key = `${table} ${rows}`;
  let statement = statements.get(key);
  if (!statement) {
    const row = `(${columns.map(() => '?').join(', ')})`;
    const values = Array.from({ length: rows }, () => row).join(', ');
    statement = connection.prepare(`INSERT INTO "${table}" (${columns.map((column) => `"${column}"`).join(', ')}) VALUES ${values}`);
    statements.set(key, statement);
  }
  return statement;
}

/** Writes row `index`'s values, in column order, into `parameters` from `offset` on. */
type FillRow = (index: number, parameters: unknown[], offset: number) => void;

/**
 * Inserts the rows and returns their ids in row order. The ids are not asked back with RETURNING, which
 * makes SQLite keep every row a second time: a table with an INTEGER PRIMARY KEY gives each new row the
 * largest id so far plus one (https://www.sqlite.org/autoinc.html), so one statement's rows have
 * consecutive ids ending at its last insert rowid. A count over the id range at the end confirms it.
 */
async function insertFilled(manager: EntityManager, table: string, columns: readonly string[], rowCount: number, fill: FillRow, returnIds: boolean): Promise<number[]> {
  if (rowCount === 0) return [];
  const connection = await transactionConnection(manager);
  const width = columns.length;
  const perStatement = Math.max(1, Math.min(MAX_ROWS_PER_STATEMENT, Math.floor(MAX_PARAMETERS / width)));
  const ids: number[] = [];
  const full = new Array<unknown>(perStatement * width);
  const single = new Array<unknown>(width);
  for (let start = 0; start < rowCount; ) {
    const rows = rowCount - start >= perStatement ? perStatement : 1;
    const parameters = rows === perStatement ? full : single;
    for (let row = 0; row < rows; row += 1) fill(start + row, parameters, row * width);
    const { changes, lastInsertRowid } = insertStatement(connection, table, columns, rows).run(parameters);
    if (changes !== rows) throw new Error(`inserting ${rows} rows into ${table} wrote ${changes}`);
    if (returnIds) for (let id = Number(lastInsertRowid) - rows + 1; id <= Number(lastInsertRowid); id += 1) ids.push(id);
    start += rows;
  }
  if (returnIds) {
    const found = connection.prepare(`SELECT count(*) FROM "${table}" WHERE id BETWEEN ? AND ?`).pluck().get(ids[0], ids[ids.length - 1]);
    if (found !== rowCount || ids[ids.length - 1] - ids[0] + 1 !== rowCount) throw new Error(`the ${rowCount} rows inserted into ${table} did not get consecutive ids`);
  }
  return ids;
}

const AUDIT_COLUMNS = ['actor_id', 'entity_type', 'entity_id', 'campaign_id', 'action', 'before', 'after'] as const;

/**
 * The audit trail of many writes at once, one event each, as recordAudit writes one: JSON before and
 * after, in the caller's transaction.
 *
 * @param manager the transaction's entity manager
 * @param events the events
 * @throws {Error} outside a transaction
 */
export async function insertAuditEvents(manager: EntityManager, events: readonly AuditEntry[]): Promise<void> {
  await insertFilled(
    manager,
    'audit_events',
    AUDIT_COLUMNS,
    events.length,
    (index, parameters, offset) => {
      const event = events[index];
      parameters[offset] = event.actorId;
      parameters[offset + 1] = event.entityType;
      parameters[offset + 2] = event.entityId;
      parameters[offset + 3] = event.campaignId ?? null;
      parameters[offset + 4] = event.action;
      parameters[offset + 5] = event.before === undefined ? null : JSON.stringify(event.before);
      parameters[offset + 6] = event.after === undefined ? null : JSON.stringify(event.after);
    },
    false,
  );
}

// How a column's value is stored, settled once per entity rather than once a cell.
const PLAIN = 0;
const JSON_TEXT = 1;
const TRUTH = 2;
const DATE_TIME = 3;
const TYPEORM = 4;

interface EntityColumns {
  tableName: string;
  databaseNames: string[];
  propertyNames: string[];
  kinds: number[];
  columns: ColumnMetadata[];
  /** The value of a column left out: its declared default, or null (the version and timestamps are set per insert). */
  defaults: unknown[];
  isTimestamp: boolean[];
  isVersion: boolean[];
}

const entityColumnsCache = new WeakMap<object, EntityColumns>();

function entityColumns(manager: EntityManager, entity: new () => object): EntityColumns {
  const metadata = manager.connection.getMetadata(entity);
  const cached = entityColumnsCache.get(metadata);
  if (cached) return cached;
  const columns = metadata.columns.filter((column) => !(column.isPrimary && column.isGenerated));
  const kindOf = (column: ColumnMetadata): number => {
    if (column.transformer) return TYPEORM;
    if (column.type === 'simple-json') return JSON_TEXT;
    if (column.type === 'boolean' || column.type === Boolean) return TRUTH;
    return column.type === 'datetime' || column.type === Date ? DATE_TIME : PLAIN;
  };
  const settled: EntityColumns = {
    tableName: metadata.tableName,
    databaseNames: columns.map((column) => column.databaseName),
    propertyNames: columns.map((column) => column.propertyName),
    kinds: columns.map(kindOf),
    columns,
    defaults: columns.map((column) => (column.default !== undefined && typeof column.default !== 'function' ? column.default : null)),
    isTimestamp: columns.map((column) => column.isCreateDate || column.isUpdateDate),
    isVersion: columns.map((column) => column.isVersion),
  };
  entityColumnsCache.set(metadata, settled);
  return settled;
}

/**
 * Inserts entity rows given as partial entities, in batches, with the values prepared the way TypeORM
 * stores them (simple-json as JSON text, booleans as 0/1, dates as UTC text); the version starts at 1 and
 * both timestamps at `now`, as a repository save would set them. A column left out takes its declared
 * default, or null.
 *
 * @param manager the transaction's entity manager
 * @param entity the entity class
 * @param partials the rows
 * @param now the time to stamp
 * @throws {Error} outside a transaction
 * @returns the new ids, one per row, in order
 */
export async function insertEntities<T extends object>(manager: EntityManager, entity: new () => T, partials: readonly Partial<T>[], now: Date): Promise<number[]> {
  if (partials.length === 0) return [];
  const driver = manager.connection.driver;
  const settled = entityColumns(manager, entity);
  const { propertyNames, kinds, columns } = settled;
  const timestampColumn = columns.find((column) => column.isCreateDate || column.isUpdateDate) ?? columns[0];
  const stamp = driver.preparePersistentValue(now, timestampColumn);
  const fallbacks = settled.defaults.map((value, index) => (settled.isVersion[index] ? 1 : settled.isTimestamp[index] ? stamp : value));
  return insertFilled(
    manager,
    settled.tableName,
    settled.databaseNames,
    partials.length,
    (index, parameters, offset) => {
      const values = partials[index] as Record<string, unknown>;
      for (let column = 0; column < propertyNames.length; column += 1) {
        const value = values[propertyNames[column]];
        const kind = kinds[column];
        let stored: unknown;
        if (kind === TYPEORM) stored = driver.preparePersistentValue(value === undefined ? fallbacks[column] : value, columns[column]);
        else if (value === undefined) stored = fallbacks[column];
        else if (value === null) stored = null;
        else if (kind === PLAIN) stored = typeof value === 'boolean' ? Number(value) : value;
        else if (kind === JSON_TEXT) stored = JSON.stringify(value);
        else if (kind === TRUTH) stored = value ? 1 : 0;
        else stored = driver.preparePersistentValue(value, columns[column]);
        parameters[offset + column] = stored;
      }
    },
    true,
  );
}
