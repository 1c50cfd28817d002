import type { EntityManager } from 'typeorm';

// SQLite takes at most 32,766 bound parameters a statement (SQLITE_MAX_VARIABLE_NUMBER since 3.32);
// rows per statement are also capped so that the statement cache sees a few distinct texts only.
const MAX_PARAMETERS = 30_000;
const MAX_ROWS_PER_STATEMENT = 100;

/**
 * Inserts rows into a table with one multi-row INSERT per batch and returns their new ids in the order of
 * the rows. Ids come back through RETURNING; an integer primary key takes the next value for each row in
 * turn, so the ids sorted ascending are the rows' ids in insertion order.
 *
 * @param manager the transaction's entity manager
 * @param table the table name
 * @param columns the column names
 * @param rows one array of values per row, in column order
 * @param returnIds false when the caller needs no ids (the database then builds no result rows)
 * @returns the new ids, one per row (none when not asked for)
 */
export async function insertRows(manager: EntityManager, table: string, columns: readonly string[], rows: readonly unknown[][], returnIds = true): Promise<number[]> {
  const ids: number[] = [];
  const perStatement = Math.max(1, Math.min(MAX_ROWS_PER_STATEMENT, Math.floor(MAX_PARAMETERS / columns.length)));
  const placeholders = `(${columns.map(() => '?').join(', ')})`;
  const head = `INSERT INTO "${table}" (${columns.map((column) => `"${column}"`).join(', ')}) VALUES `;
  for (let start = 0; start < rows.length; start += perStatement) {
    const batch = rows.slice(start, start + perStatement);
    const parameters: unknown[] = [];
    for (const row of batch) for (const value of row) parameters.push(value);
    if (!returnIds) {
      await manager.query(`${head}${batch.map(() => placeholders).join(', ')}`, parameters);
      continue;
    }
    const returned: { id: number }[] = await manager.query(`${head}${batch.map(() => placeholders).join(', ')} RETURNING id`, parameters);
    ids.push(...returned.map((row) => row.id).sort((first, second) => first - second));
  }
  return ids;
}

/**
 * The audit trail of many writes at once, as recordAudit writes one: JSON before and after, in the caller's
 * transaction.
 *
 * @param manager the transaction's entity manager
 * @param events the events
 */
export async function insertAuditEvents(
  manager: EntityManager,
  events: readonly { actorId: number; entityType: string; entityId: number; campaignId: number | null; action: string; before?: unknown; after?: unknown }[],
): Promise<void> {
  await insertRows(
    manager,
    'audit_events',
    ['actor_id', 'entity_type', 'entity_id', 'campaign_id', 'action', 'before', 'after'],
    events.map((event) => [
      event.actorId,
      event.entityType,
      event.entityId,
      event.campaignId,
      event.action,
      event.before === undefined ? null : JSON.stringify(event.before),
      event.after === undefined ? null : JSON.stringify(event.after),
    ]),
    false,
  );
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
 * @returns the new ids, one per row, in order
 */
export async function insertEntities<T extends object>(
  manager: EntityManager,
  entity: new () => T,
  partials: readonly Partial<T>[],
  now: Date,
): Promise<number[]> {
  if (partials.length === 0) return [];
  const metadata = manager.connection.getMetadata(entity);
  const driver = manager.connection.driver;
  const columns = metadata.columns.filter((column) => !(column.isPrimary && column.isGenerated));
  // Each column's preparation is settled once, not once a cell: TypeORM's per-value path costs more than
  // the insert itself at 10,000 rows.
  const stamp = driver.preparePersistentValue(now, columns.find((column) => column.isCreateDate || column.isUpdateDate) ?? columns[0]);
  const prepare = columns.map((column): ((value: unknown) => unknown) => {
    const fallback = column.isVersion ? 1 : column.isCreateDate || column.isUpdateDate ? stamp : column.default !== undefined && typeof column.default !== 'function' ? column.default : null;
    if (column.transformer) return (value) => driver.preparePersistentValue(value === undefined ? fallback : value, column);
    if (column.type === 'simple-json') return (value) => (value === undefined ? fallback : value === null ? null : JSON.stringify(value));
    if (column.type === 'boolean' || column.type === Boolean) return (value) => (value === undefined ? fallback : value === null ? null : value ? 1 : 0);
    if (column.type === 'datetime' || column.type === Date) return (value) => (value === undefined ? fallback : value === null ? null : driver.preparePersistentValue(value, column));
    return (value) => (value === undefined ? fallback : value);
  });
  const names = columns.map((column) => column.propertyName);
  const rows = partials.map((partial) => {
    const values = partial as Record<string, unknown>;
    return names.map((name, index) => prepare[index](values[name]));
  });
  return insertRows(
    manager,
    metadata.tableName,
    columns.map((column) => column.databaseName),
    rows,
  );
}
