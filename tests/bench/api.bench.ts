/**
 * `npm run bench:api`: the registry list under load on the 100,000-variant scale registry. Starts the
 * server on the scale data folder (building it first with the scale seed when missing), then loads
 * `GET /api/variants` (filtered, sorted by ΔΔG‡, page 50) and `GET /api/health` with 32 connections each,
 * one after the other in the same run, and prints throughputs, their ratio and p50/p99 latencies.
 * Targets (issue): ratio ≥ 0.3 and variants p99 ≤ 50 ms. Repeating one page is served from the list's
 * result cache (void after any write), so a third load makes every request a new query (a fold-change
 * floor that differs in the ninth decimal) to show the uncached cost beside it.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import autocannon from 'autocannon';
import { signInCookie, startServer } from './start-server';

const dataDir = resolve(process.env.KCATALOG_SCALE_DATA_DIR ?? './data-scale');
const durationSeconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = 32;

if (!existsSync(join(dataDir, 'kcatalog.sqlite'))) {
  console.log('No scale registry yet; building it (npm run seed:scale)…');
  execFileSync(process.execPath, ['--import', 'tsx', 'server/scripts/seed-scale.ts'], { stdio: 'inherit', env: { ...process.env, KCATALOG_SCALE_DATA_DIR: dataDir } });
}

const server = await startServer(dataDir, 3950);
try {
  const cookie = await signInCookie(server.baseUrl, 'lead@kcatalog.example', 'kcatalog-demo');
  const variantsPath = '/api/variants?campaignId=2&status=characterized&minFoldChange=0.2&sort=ddg&order=asc&page=50&pageSize=50';
  const probe = await fetch(`${server.baseUrl}${variantsPath}`, { headers: { Cookie: cookie } });
  const probeBody = (await probe.json()) as { total?: number; rows?: unknown[] };
  if (!probe.ok || !probeBody.rows) throw new Error(`variants probe failed: ${probe.status} ${JSON.stringify(probeBody).slice(0, 300)}`);
  console.log(`GET ${variantsPath}: ${probeBody.rows.length} rows of ${probeBody.total} matching`);

  const load = (path: string, requests?: autocannon.Request[]) =>
    autocannon({ url: `${server.baseUrl}${path}`, connections, duration: durationSeconds, headers: { Cookie: cookie }, requests });
  let requestNumber = 0;
  const uncachedRequests: autocannon.Request[] = [
    {
      setupRequest: (request) => {
        requestNumber += 1;
        return { ...request, path: variantsPath.replace('minFoldChange=0.2', `minFoldChange=0.2${String(requestNumber).padStart(9, '0')}`) };
      },
    },
  ];

  await load('/api/health'); // warm-up of the process and the page cache
  const health = await load('/api/health');
  const variants = await load(variantsPath);
  const uncached = await load(variantsPath, uncachedRequests);

  const row = (name: string, result: autocannon.Result) =>
    `${name.padEnd(14)} ${result.requests.average.toFixed(0).padStart(7)} req/s   p50 ${String(result.latency.p50).padStart(4)} ms   p99 ${String(result.latency.p99).padStart(4)} ms   errors ${result.errors + result.non2xx}`;
  console.log(`\n${connections} connections, ${durationSeconds} s each`);
  console.log(row('/api/health', health));
  console.log(row('/api/variants', variants));
  console.log(row('  uncached', uncached));
  const ratio = variants.requests.average / health.requests.average;
  console.log(`ratio variants/health ${ratio.toFixed(3)} (target ≥ 0.3); variants p99 ${variants.latency.p99} ms (target ≤ 50 ms)`);
} finally {
  await server.stop();
}
