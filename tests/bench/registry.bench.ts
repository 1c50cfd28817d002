/**
 * `npm run bench:registry`: how long the registry takes, in the browser, to show its first rows on the
 * 100,000-variant scale registry (issue: within 1 s; a benchmark that reports, not a timed assertion).
 * Starts the real server with the built client on the scale data folder (building the folder with the
 * scale seed, and the client, when missing or stale), signs in once through the form in headless
 * Chromium, then opens two addresses five times each, every time in a fresh page: the plain registry, and
 * a shared link with a campaign, a catalytic role, a fold-change floor and a sort by ΔΔG‡. Each address
 * gets its own browser context, so its first run starts with an empty HTTP cache and the four after it
 * find the scripts cached, as a colleague's second visit would. Prints every run, the median, and the
 * network waterfall of the cold run and of a warm one (when each script and request started and ended),
 * which is where the time goes. Then the way most visits arrive: from the Overview, a click on Registry in
 * the top bar (the app changes route without reloading the page), five times, each from a fresh load of
 * the Overview.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import type { Browser, BrowserContext, CDPSession, Page } from 'playwright-core';
import { findChromium, launchChromium } from '../e2e/chromium';
import { startServer } from './start-server';
import { freePort } from '../free-port';

const dataDir = resolve(process.env.KCATALOG_SCALE_DATA_DIR ?? './data-scale');
const runsPerAddress = Number(process.env.BENCH_RUNS ?? 5);
/**
 * A network between browser and server, for a team whose server is not on the same machine: the extra
 * round-trip time in ms (0, the default, is the loopback as it is) and a throughput of 50 Mbit/s with it.
 */
const latencyMs = Number(process.env.BENCH_LATENCY_MS ?? 0);
const throughputBytesPerSecond = 50e6 / 8;
const viewport = { width: 1440, height: 900 };
const firstRowsTimeoutMs = 30_000;
/** A variant's row in the registry's list, as the first-rows table or the grid draws it. */
const firstRowSelector = 'main [role="row"] a[href^="/variants/"]';
const gridRowSelector = '.ag-row [col-id="label"] a';

/** The addresses measured: the whole registry, and a filtered and sorted view as a colleague receives it. */
const addresses = [
  { name: 'plain registry', path: '/registry' },
  { name: 'shared link', path: '/registry?campaignId=2&role=general+base&minFoldChange=0.2&sort=ddg&order=asc' },
] as const;

interface ResourceTiming {
  name: string;
  initiatorType: string;
  startTime: number;
  responseStart: number;
  responseEnd: number;
  encodedBodySize: number;
  /** 0 when the browser's cache answered. */
  transferSize: number;
}

interface RunResult {
  /** From the start of navigation to the animation frame after the first variant row entered the page. */
  firstRowsMs: number;
  /** The same for the grid's own first row, when the grid has taken over from the first-rows table. */
  gridRowsMs: number;
  /** The same as seen from outside the page: from `goto` until the page reports the rows (within 20 ms). */
  wallMs: number;
  /**
   * Processor time the browser's renderer processes used over the same span: the page's own work, which,
   * unlike the elapsed time, other programs on a busy machine do not inflate.
   */
  rendererCpuMs: number;
  countText: string;
  domContentLoadedMs: number;
  resources: ResourceTiming[];
}

// Runs in the page before any of its scripts: notes when the first variant row is on screen (drawn first
// as a plain table, then by the grid) and when the grid's own first row is, each as the animation frame
// after the row entered the page (when it is painted), in milliseconds since the navigation started.
const firstRowsProbe = `(() => {
  const watch = (selector, key) => {
    const observer = new MutationObserver(() => {
      if (!document.querySelector(selector)) return;
      observer.disconnect();
      requestAnimationFrame(() => { window[key] = performance.now(); });
    });
    observer.observe(document, { childList: true, subtree: true });
  };
  watch(${JSON.stringify(firstRowSelector)}, '__firstRowsPaintedAt');
  watch(${JSON.stringify(gridRowSelector)}, '__gridRowsPaintedAt');
})();`;

declare global {
  interface Window {
    __firstRowsPaintedAt?: number;
    __gridRowsPaintedAt?: number;
  }
}

async function signIn(browser: Browser, baseUrl: string): Promise<Awaited<ReturnType<BrowserContext['storageState']>>> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill('lead@kcatalog.example');
  await page.getByLabel('Password').fill('kcatalog-demo');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
  const state = await context.storageState();
  await context.close();
  return state;
}

/** Processor time used so far by each renderer process, in milliseconds, by process id. */
async function rendererCpuTimes(browserSession: CDPSession): Promise<Map<number, number>> {
  const { processInfo } = await browserSession.send('SystemInfo.getProcessInfo');
  return new Map(processInfo.filter((process) => process.type === 'renderer').map((process) => [process.id, process.cpuTime * 1000]));
}

async function measure(page: Page, url: string, browserSession: CDPSession): Promise<RunResult> {
  await page.addInitScript(firstRowsProbe);
  if (latencyMs > 0) {
    const pageSession = await page.context().newCDPSession(page);
    await pageSession.send('Network.enable');
    await pageSession.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: latencyMs,
      downloadThroughput: throughputBytesPerSecond,
      uploadThroughput: throughputBytesPerSecond,
    });
  }
  const cpuBefore = await rendererCpuTimes(browserSession);
  const started = Date.now();
  await page.goto(url, { waitUntil: 'commit' });
  // A cheap check every 20 ms rather than Playwright's locator polling, which would compete with the page
  // for its main thread, the very thing being measured.
  await page.waitForFunction(() => window.__firstRowsPaintedAt !== undefined, undefined, { polling: 20, timeout: firstRowsTimeoutMs });
  const wallMs = Date.now() - started;
  await page.waitForFunction(() => window.__gridRowsPaintedAt !== undefined, undefined, { polling: 20, timeout: firstRowsTimeoutMs });
  const cpuAfter = await rendererCpuTimes(browserSession);
  // A renderer started for this page was not there before: all its time is this page's.
  const rendererCpuMs = [...cpuAfter].reduce((sum, [id, cpuMs]) => sum + Math.max(0, cpuMs - (cpuBefore.get(id) ?? 0)), 0);
  const countText = (await page.getByText(/^\d[\d,]* variants? match(es)?$/).textContent()) ?? '';
  // Everything is read once the count is shown, so the waterfall holds the list request too.
  return page.evaluate(
    ({ wallMs, rendererCpuMs, countText }) => {
      const navigation = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined;
      const resources = (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map((entry) => ({
        name: entry.name,
        initiatorType: entry.initiatorType,
        startTime: entry.startTime,
        responseStart: entry.responseStart,
        responseEnd: entry.responseEnd,
        encodedBodySize: entry.encodedBodySize,
        transferSize: entry.transferSize,
      }));
      if (navigation) {
        resources.unshift({
          name: navigation.name,
          initiatorType: 'document',
          startTime: navigation.startTime,
          responseStart: navigation.responseStart,
          responseEnd: navigation.responseEnd,
          encodedBodySize: navigation.encodedBodySize,
          transferSize: navigation.transferSize,
        });
      }
      return {
        firstRowsMs: window.__firstRowsPaintedAt ?? Number.NaN,
        gridRowsMs: window.__gridRowsPaintedAt ?? Number.NaN,
        wallMs,
        rendererCpuMs,
        countText,
        domContentLoadedMs: navigation?.domContentLoadedEventEnd ?? Number.NaN,
        resources,
      };
    },
    { wallMs, rendererCpuMs, countText },
  );
}

// In an open page showing the Overview: the time from a click on the top bar's Registry link to the frame
// after the first variant row is on screen, and to the one after the grid's first row is, read in the page.
async function measureFromOverview(page: Page, baseUrl: string): Promise<{ firstRowsMs: number; gridRowsMs: number }> {
  await page.goto(`${baseUrl}/`);
  await page.getByRole('heading', { level: 1 }).first().waitFor();
  // A string, not a function: the bench runs under tsx, whose helpers a function would carry into the page.
  return page.evaluate<{ firstRowsMs: number; gridRowsMs: number }>(`new Promise((resolveTimes) => {
    const times = {};
    const watch = (selector, key) => {
      const observer = new MutationObserver(() => {
        if (!document.querySelector(selector)) return;
        observer.disconnect();
        requestAnimationFrame(() => {
          times[key] = performance.now() - clickedAt;
          if (times.firstRowsMs !== undefined && times.gridRowsMs !== undefined) resolveTimes(times);
        });
      });
      observer.observe(document, { childList: true, subtree: true });
    };
    watch(${JSON.stringify(firstRowSelector)}, 'firstRowsMs');
    watch(${JSON.stringify(gridRowSelector)}, 'gridRowsMs');
    const clickedAt = performance.now();
    document.querySelector('header nav a[href="/registry"]').click();
  })`);
}

const median = (values: readonly number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
};

const milliseconds = (value: number) => `${value.toFixed(0).padStart(5)} ms`;

function printWaterfall(title: string, result: RunResult, baseUrl: string): void {
  console.log(`  waterfall, ${title} (ms since navigation start; wait = time to the first byte, in the server or the cache):`);
  console.log('     start      end   wait             size  what');
  const rows = [...result.resources].sort((a, b) => a.startTime - b.startTime);
  for (const entry of rows) {
    const what = entry.name.startsWith(baseUrl) ? entry.name.slice(baseUrl.length) : entry.name;
    const size = `${(entry.encodedBodySize / 1000).toFixed(1)} kB${entry.transferSize === 0 ? ' cached' : ''}`;
    const wait = entry.responseStart > 0 ? (entry.responseStart - entry.startTime).toFixed(0) : '–';
    console.log(
      `  ${entry.startTime.toFixed(0).padStart(8)} ${entry.responseEnd.toFixed(0).padStart(8)} ${wait.padStart(6)} ${size.padStart(16)}  ${what.length > 90 ? `${what.slice(0, 87)}…` : what}`,
    );
  }
  console.log(`  ${result.domContentLoadedMs.toFixed(0).padStart(8)}                                   DOMContentLoaded`);
  console.log(`  ${result.firstRowsMs.toFixed(0).padStart(8)}                                   first rows painted`);
  console.log(`  ${result.gridRowsMs.toFixed(0).padStart(8)}                                   grid's rows painted`);
}

if (!existsSync(join(dataDir, 'kcatalog.sqlite'))) {
  console.log('No scale registry yet; building it (npm run seed:scale)…');
  execFileSync(process.execPath, ['--import', 'tsx', 'server/scripts/seed-scale.ts'], { stdio: 'inherit', env: { ...process.env, KCATALOG_SCALE_DATA_DIR: dataDir } });
}
const chromiumPath = findChromium();
if (!chromiumPath) throw new Error('No Chromium found: install it with `apt-get install -y chromium` or set CHROMIUM_PATH.');

const server = await startServer(dataDir, await freePort(), { serveClient: true });
const browser = await launchChromium(chromiumPath);
try {
  const browserSession = await browser.newBrowserCDPSession();
  const storageState = await signIn(browser, server.baseUrl);
  const [oneMinuteLoad] = loadavg();
  console.log(
    `Registry first rows on ${dataDir} in headless Chromium ${browser.version()}, ${viewport.width}×${viewport.height}; ` +
      `load average ${oneMinuteLoad.toFixed(1)} on this machine when it started; ` +
      (latencyMs > 0 ? `network emulated: ${latencyMs} ms round trip, ${(throughputBytesPerSecond * 8) / 1e6} Mbit/s.` : 'loopback network.'),
  );
  const medians: string[] = [];
  for (const address of addresses) {
    const context = await browser.newContext({ viewport, storageState });
    const results: RunResult[] = [];
    console.log(`\n${address.name}: ${address.path}`);
    for (let run = 1; run <= runsPerAddress; run += 1) {
      const page = await context.newPage();
      const result = await measure(page, `${server.baseUrl}${address.path}`, browserSession);
      await page.close();
      results.push(result);
      console.log(
        `  run ${run}${run === 1 ? ' (cold cache)' : '             '} first rows ${milliseconds(result.firstRowsMs)}   from outside ${milliseconds(result.wallMs)}   grid's rows ${milliseconds(result.gridRowsMs)}   renderer CPU ${milliseconds(result.rendererCpuMs)}   ${result.countText}`,
      );
    }
    await context.close();
    const firstRows = results.map((result) => result.firstRowsMs);
    const cpu = results.map((result) => result.rendererCpuMs);
    const summary =
      `median ${milliseconds(median(firstRows))} (cold ${milliseconds(firstRows[0])}, warm median ${milliseconds(median(firstRows.slice(1)))}); ` +
      `grid's rows median ${milliseconds(median(results.map((result) => result.gridRowsMs)))}; renderer CPU median ${milliseconds(median(cpu))}`;
    console.log(`  ${summary}`);
    medians.push(`${address.name.padEnd(15)} ${summary}`);
    printWaterfall('cold run', results[0], server.baseUrl);
    printWaterfall(`warm run ${results.length}`, results[results.length - 1], server.baseUrl);
  }
  const inAppContext = await browser.newContext({ viewport, storageState });
  const inAppPage = await inAppContext.newPage();
  const inApp: number[] = [];
  const inAppGrid: number[] = [];
  console.log('\nfrom the Overview, a click on Registry in the top bar:');
  for (let run = 1; run <= runsPerAddress; run += 1) {
    const times = await measureFromOverview(inAppPage, server.baseUrl);
    inApp.push(times.firstRowsMs);
    inAppGrid.push(times.gridRowsMs);
    console.log(`  run ${run}${run === 1 ? ' (cold cache)' : '             '} first rows ${milliseconds(times.firstRowsMs)}   grid's rows ${milliseconds(times.gridRowsMs)}`);
  }
  await inAppContext.close();
  medians.push(
    `${'from Overview'.padEnd(15)} median ${milliseconds(median(inApp))} (cold ${milliseconds(inApp[0])}, warm median ${milliseconds(median(inApp.slice(1)))}); ` +
      `grid's rows median ${milliseconds(median(inAppGrid))}`,
  );

  console.log(`\nfirst rows, ${runsPerAddress} runs each (target: within 1 s):`);
  for (const line of medians) console.log(`  ${line}`);
} finally {
  await browser.close();
  await server.stop();
}
