import type { DataSource, EntityManager } from 'typeorm';

// One queue per data source (the tests open several in one process).
const queues = new WeakMap<DataSource, Promise<unknown>>();
const revisions = new WeakMap<DataSource, number>();

/**
 * A number that changes after every write transaction on the data source. Read caches (such as the
 * registry's counts) keep the revision they were computed at and are void once it moves on; every
 * write of registry data goes through {@link writeTransaction}, so nothing can change behind it.
 */
export function writeRevision(dataSource: DataSource): number {
  return revisions.get(dataSource) ?? 0;
}

/**
 * Runs `work` in a database transaction, one at a time per data source.
 *
 * TypeORM's SQLite drivers share a single connection and query runner: a transaction begun while
 * another is open becomes a savepoint inside it, so a rollback of the outer one would undo the inner
 * one's writes after it had reported success. With better-sqlite3 every query settles at once, so a
 * transaction body only yields to other requests when it awaits real I/O (a file, a hash, a timer);
 * queueing the transactions keeps them apart even then, and keeps each request's read-check-write
 * (version and uniqueness checks) atomic.
 *
 * @param dataSource the application's data source
 * @param work the transaction body; throw to roll back
 * @returns what `work` returns, after the commit
 * @throws whatever `work` throws, after the rollback
 */
export function writeTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const bump = () => revisions.set(dataSource, writeRevision(dataSource) + 1);
  // Bumped on rollback too: harmless, and a transaction that failed half-way might still have run statements.
  const run = previous.then(() => dataSource.transaction(work)).finally(bump);
  queues.set(
    dataSource,
    run.catch(() => undefined),
  );
  return run;
}
