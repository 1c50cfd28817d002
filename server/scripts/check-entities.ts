/**
 * Loads every entity under tsx (which, unlike vitest, emits no decorator metadata) on a fresh in-memory
 * database, runs all migrations and asks TypeORM what it would still change. Any pending change means
 * an entity and the migrations disagree: the check fails and prints the SQL that would fix it.
 */
import { openDatabase } from '../data-source';

const dataSource = await openDatabase({ database: ':memory:' });
const pending = await dataSource.driver.createSchemaBuilder().log();
await dataSource.destroy();

if (pending.upQueries.length > 0) {
  console.error(`Entities and migrations disagree; ${pending.upQueries.length} change(s) pending:`);
  for (const query of pending.upQueries) console.error(`  ${query.query}`);
  process.exit(1);
}
console.log(`check:entities ok: ${dataSource.entityMetadatas.length} entities match the migrations`);
