/**
 * `npm run migration:generate -- <name>`: writes migrations/<timestamp>-<name>.ts with the SQL that
 * brings a database migrated so far up to the entities (what TypeORM's `migration:generate` does), and
 * prints the line to add to server/migrations.ts. Review the SQL before committing it.
 */
import { writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { openDatabase } from '../data-source';

const name = process.argv[2];
if (!name || !/^[a-z0-9-]+$/.test(name)) {
  console.error('Usage: npm run migration:generate -- <kebab-case-name>');
  process.exit(1);
}

const dataSource = await openDatabase({ database: ':memory:' });
const { upQueries, downQueries } = await dataSource.driver.createSchemaBuilder().log();
await dataSource.destroy();
if (upQueries.length === 0) {
  console.log('Entities and migrations already agree; nothing to generate.');
  process.exit(0);
}

const timestamp = Date.now();
const className = `${name.replace(/(^|-)([a-z0-9])/g, (_match, _dash, letter: string) => letter.toUpperCase())}${timestamp}`;
const escape = (sql: string) => sql.replace(/\\/g, '\\\\').replace(/`/g, '\\`').replace(/\$\{/g, '\\${');
const lines = (queries: { query: string }[]) => queries.map((query) => `    await queryRunner.query(\`${escape(query.query)}\`);`).join('\n');

const source = `import type { MigrationInterface, QueryRunner } from 'typeorm';

export class ${className} implements MigrationInterface {
  name = '${className}';

  async up(queryRunner: QueryRunner): Promise<void> {
${lines(upQueries)}
  }

  async down(queryRunner: QueryRunner): Promise<void> {
${lines([...downQueries].reverse())}
  }
}
`;
const file = join(resolve(import.meta.dirname, '../../migrations'), `${timestamp}-${name}.ts`);
writeFileSync(file, source);
console.log(`Wrote ${file}\nAdd to server/migrations.ts: import { ${className} } from '../migrations/${timestamp}-${name}';`);
