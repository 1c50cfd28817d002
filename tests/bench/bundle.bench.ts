/**
 * `npm run bench:bundle`: builds the client with Vite (in memory, so a running server's dist/client is
 * left alone), prints the gzip size of every JavaScript and CSS chunk, and exits with 1 when the first
 * route's JavaScript, the entry chunk and every chunk it imports statically, exceeds the budget of
 * 200 kB gzip (issue: AG Grid, charts and heavy pages load lazily). A signed-in user lands on the
 * Overview, so the entry with the Overview route's chunks is held to the same budget; and AG Grid must
 * stay out of both (only the registry route loads it).
 */
import { resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build, type Rolldown } from 'vite';

const rootDir = resolve(import.meta.dirname, '../..');
/** kB as Vite reports them: 1 kB = 1000 bytes. */
const BYTES_PER_KB = 1000;
const BUDGET_KB = 200;

type OutputChunk = Rolldown.OutputChunk;
type OutputAsset = Rolldown.OutputAsset;

const result = await build({
  root: rootDir,
  configFile: resolve(rootDir, 'vite.config.ts'),
  mode: 'production',
  logLevel: 'warn',
  build: { write: false, reportCompressedSize: false },
});
const outputs = (Array.isArray(result) ? result : [result]) as Rolldown.RolldownOutput[];
const files = outputs.flatMap((output) => output.output);
const chunks = new Map(files.filter((file): file is OutputChunk => file.type === 'chunk').map((chunk) => [chunk.fileName, chunk]));
const styles = files.filter((file): file is OutputAsset => file.type === 'asset' && file.fileName.endsWith('.css'));

const gzipBytes = new Map<string, number>();
for (const chunk of chunks.values()) gzipBytes.set(chunk.fileName, gzipSync(chunk.code).length);
for (const style of styles) gzipBytes.set(style.fileName, gzipSync(style.source).length);

/** A chunk and every chunk it imports statically, transitively: what the browser must load before it runs. */
function staticClosure(start: string): Set<string> {
  const seen = new Set<string>();
  const pending = [start];
  while (pending.length > 0) {
    const name = pending.pop()!;
    if (seen.has(name)) continue;
    seen.add(name);
    pending.push(...(chunks.get(name)?.imports ?? []));
  }
  return seen;
}

const totalKb = (names: Iterable<string>) => [...names].reduce((sum, name) => sum + (gzipBytes.get(name) ?? 0), 0) / BYTES_PER_KB;
const kb = (bytes: number) => `${(bytes / BYTES_PER_KB).toFixed(1).padStart(7)} kB`;

const entry = [...chunks.values()].find((chunk) => chunk.isEntry);
if (!entry) throw new Error('the build has no entry chunk');
const firstRoute = staticClosure(entry.fileName);

const rows = [...gzipBytes].sort((a, b) => b[1] - a[1]);
console.log('gzip size of every chunk (· marks the first route’s JavaScript):');
for (const [name, bytes] of rows) {
  const chunk = chunks.get(name);
  const kind = chunk ? (chunk.isEntry ? 'entry' : chunk.isDynamicEntry ? 'lazy' : 'shared') : 'css';
  console.log(`  ${firstRoute.has(name) ? '·' : ' '} ${kb(bytes)}  ${kind.padEnd(6)} ${name}`);
}

const firstRouteKb = totalKb(firstRoute);
const home = [...chunks.values()].find((chunk) => chunk.facadeModuleId?.endsWith('src/app/routes/overview.tsx'));
const grid = [...chunks.values()].find((chunk) => chunk.moduleIds.some((id) => id.includes('/node_modules/ag-grid-community/')));

console.log(`\nfirst route (entry ${entry.fileName} and its ${firstRoute.size - 1} static imports): ${firstRouteKb.toFixed(1)} kB gzip, budget ${BUDGET_KB} kB`);
if (!home) throw new Error('no chunk for src/app/routes/overview.tsx: is the home route still lazy?');
const landing = new Set([...firstRoute, ...staticClosure(home.fileName)]);
const landingKb = totalKb(landing);
console.log(`landing on the Overview (the home page) loads ${landingKb.toFixed(1)} kB gzip in ${landing.size} chunks, budget ${BUDGET_KB} kB`);
if (grid) {
  const gridUpFront = landing.has(grid.fileName);
  console.log(`AG Grid is in ${grid.fileName} (${kb(gzipBytes.get(grid.fileName) ?? 0).trim()}), ${gridUpFront ? 'LOADED UP FRONT' : 'a lazy chunk'}`);
  if (gridUpFront) process.exitCode = 1;
}
for (const [what, sizeKb] of [
  ["The first route's JavaScript", firstRouteKb],
  ['Landing on the Overview', landingKb],
] as const) {
  if (sizeKb <= BUDGET_KB) continue;
  console.error(`${what} is ${sizeKb.toFixed(1)} kB gzip, over the ${BUDGET_KB} kB budget.`);
  process.exitCode = 1;
}
