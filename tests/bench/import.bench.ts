// Speed and memory of a spreadsheet import: generates a 10,000-row workbook of measurements (fitted values
// for 300 invented variants), times exceljs reading every cell of it (the bare parse, with the same
// streaming reader and options the import uses, on this thread) and the full import of it (parse, validate
// with the API's schemas, convert, compute flags and completeness, write in one transaction, recompute the
// variants' summaries), and prints both, their ratio and the peak memory. The import parses on its reader
// thread while the rows already read are checked and written, so its time is the longer of the two, not
// their sum. Each run is a process of its own, so that one run's heap does not count towards the next one's
// peak; the memory figure comes from a process that only imports, since the bare parse is a measuring stick
// and not part of an import. A benchmark, not a test: `npm run bench:import`.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PassThrough, Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { detectColumns } from '../../shared/imports/detect-columns';
import { openDatabase } from '../../server/data-source';
import { getImport, settleImports, startCommit, uploadImport } from '../../server/modules/imports/imports.service';
import { Campaign } from '../../server/modules/campaigns/campaign.entity';
import { User } from '../../server/modules/users/user.entity';
import { seedDemoAccounts } from '../../server/seed/demo-accounts';
import { createCampaignWithParent, createEnzymeRow, createVariantRow, inventedSequence } from '../factories';

const ROWS = 10_000;
const VARIANTS = 300;
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CHILD_FLAG = '--run';

const sequence = inventedSequence(400);
const substitutions = 'ACDEFGHIKLMNPQRSTVWY';
/** The two campaigns each run registers the variants in: one file is imported into each. */
const CAMPAIGN_NAMES = ['Bench campaign A', 'Bench campaign B'] as const;

/** The single-mutation variants registered in each campaign, at positions 2 to 301. */
function benchMutations() {
  return Array.from({ length: VARIANTS }, (_, index) => {
    const position = 2 + index;
    const to = substitutions[(index * 7) % 20] === sequence[position - 1] ? 'W' : substitutions[(index * 7) % 20];
    return { position, from: sequence[position - 1], to: to === sequence[position - 1] ? 'Y' : to };
  });
}

/** One parse and import of the file. */
interface Timing {
  parseMs: number;
  parseCpuMs: number;
  uploadMs: number;
  importMs: number;
  importCpuMs: number;
}

interface RunFigures {
  fileKilobytes: number;
  cells: number;
  /** The first import in a fresh process, as right after a server start. */
  cold: Timing;
  /** A second file of the same size in the same process, with the code compiled, as in a running server. */
  warm: Timing;
  setupRssMegabytes: number;
  /** Peak RSS by the end of the second import, which includes the bare parses on this thread. */
  peakRssMegabytes: number;
  /** exceljs's in-memory reader (`workbook.xlsx.load`) on the same file, for comparison; measured last, after the peak. */
  loadMs: number;
}

/** CPU time of this process (user and system), ms: less sensitive than the wall clock to other load on the machine. */
function cpuMilliseconds(): number {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
}

function peakRssMegabytes(): number {
  // maxRSS is in kilobytes (getrusage(2)).
  return process.resourceUsage().maxRSS / 1024;
}

// Written with the streaming writer, so that generating the file does not weigh on the memory figure.
async function buildWorkbook(campaignName: string, labels: readonly string[], rows = ROWS): Promise<Buffer> {
  const stream = new PassThrough();
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  const book = new ExcelJS.stream.xlsx.WorkbookWriter({ stream, useStyles: true, useSharedStrings: true });
  const sheet = book.addWorksheet('Measurements');
  sheet
    .addRow([
      'Campaign', 'Variant', 'Substrate', 'Temperature (°C)', 'pH', 'Buffer', 'Buffer concentration (mM)', 'Enzyme concentration (nM)',
      'Assay date', 'Model', 'kcat (1/s)', 'kcat SE (1/s)', 'Km (mM)', 'Km SE (mM)', 'Replicates', 'Fitting method',
    ])
    .commit();
  for (let index = 0; index < rows; index += 1) {
    const day = new Date(Date.UTC(2026, 0, 1 + Math.floor(index / VARIANTS)));
    const kcat = 5 + (index % 97) / 10;
    const km = 0.2 + (index % 53) / 50;
    const row = sheet.addRow([
      campaignName, labels[index % labels.length], 'invented anilide', 37, 5.5 + (index % 5) / 2, 'MES', 50, 10,
      day, 'michaelis-menten', kcat, kcat * 0.05, km, km * 0.08, 3, 'nonlinear least squares',
    ]);
    row.getCell(9).numFmt = 'yyyy-mm-dd';
    row.commit();
  }
  sheet.commit();
  await book.commit();
  return Buffer.concat(chunks);
}

async function bareParse(buffer: Buffer): Promise<{ ms: number; cpuMs: number; cells: number }> {
  const start = performance.now();
  const cpuStart = cpuMilliseconds();
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from(buffer), {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'ignore',
    entries: 'ignore',
  });
  let cells = 0;
  for await (const worksheet of reader) {
    for await (const row of worksheet as unknown as AsyncIterable<{ values: unknown[] }>) {
      for (const value of row.values) if (value !== undefined) cells += 1;
    }
  }
  return { ms: performance.now() - start, cpuMs: cpuMilliseconds() - cpuStart, cells };
}

/** The memory of an import alone: a process that only imports the first file, as a server would. */
interface MemoryFigures {
  setupRssMegabytes: number;
  peakRssMegabytes: number;
}

/**
 * One run, in this process: a fresh database with the two campaigns and their variants; then, for timing,
 * each of the two files (one for each campaign) parsed bare and then imported, or, for memory, only the first
 * file imported. The files are made by the parent process, so that the memory their writing took does not
 * count towards this process's peak.
 */
async function run(mode: 'timing' | 'memory', filePaths: readonly string[]): Promise<RunFigures | MemoryFigures> {
  const dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-import-bench-'));
  const dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  try {
    await seedDemoAccounts(dataSource);
    const lead = await dataSource.getRepository(User).findOneByOrFail({ email: 'lead@kcatalog.example' });
    const actor = { id: lead.id, role: lead.role };
    const enzyme = await createEnzymeRow(dataSource, { sequence });
    for (const name of CAMPAIGN_NAMES) {
      const { campaign } = await createCampaignWithParent(dataSource, { enzyme, targetPh: 5.5, targetTemperatureC: 37 });
      await dataSource.getRepository(Campaign).update({ id: campaign.id }, { name });
      for (const mutation of benchMutations()) await createVariantRow(dataSource, { campaign, mutations: [mutation] });
    }
    let cells = 0;
    const importFile = async (buffer: Buffer, withBareParse: boolean): Promise<Timing> => {
      const parse = withBareParse ? await bareParse(buffer) : { ms: Number.NaN, cpuMs: Number.NaN, cells: 0 };
      cells = parse.cells;
      const uploadStart = performance.now();
      const job = await uploadImport({ dataSource, dataDir }, actor, 'measurements', { originalName: 'bench.xlsx', buffer });
      const uploadMs = performance.now() - uploadStart;
      const { columns } = detectColumns('measurements', job.sheets[0].headers);
      const importStart = performance.now();
      const importCpuStart = cpuMilliseconds();
      await startCommit({ dataSource, dataDir }, actor, job.id, { version: job.version, mode: 'all-or-nothing', sheet: job.sheets[0].name, columns });
      await settleImports(dataSource);
      const importMs = performance.now() - importStart;
      const importCpuMs = cpuMilliseconds() - importCpuStart;
      const result = await getImport(dataSource, actor, job.id);
      if (result.status !== 'committed' || result.counts.new !== ROWS) {
        throw new Error(`the import did not write every row: ${result.status} ${JSON.stringify(result.counts)} ${result.message}`);
      }
      return { parseMs: parse.ms, parseCpuMs: parse.cpuMs, uploadMs, importMs, importCpuMs };
    };

    const files = filePaths.map((path) => readFileSync(path));
    const setupRssMegabytes = process.memoryUsage().rss / 1024 / 1024;
    if (mode === 'memory') {
      await importFile(files[0], false);
      return { setupRssMegabytes, peakRssMegabytes: peakRssMegabytes() };
    }
    const cold = await importFile(files[0], true);
    const warm = await importFile(files[1], true);
    const peak = peakRssMegabytes();
    const loadStart = performance.now();
    await new ExcelJS.Workbook().xlsx.load(files[0] as unknown as ArrayBuffer);
    const loadMs = performance.now() - loadStart;
    return { fileKilobytes: files[0].length / 1024, cells, cold, warm, setupRssMegabytes, peakRssMegabytes: peak, loadMs };
  } finally {
    await dataSource.destroy();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((first, second) => first - second);
  return sorted[Math.floor(sorted.length / 2)];
}

async function main(): Promise<void> {
  const childFlag = process.argv.indexOf(CHILD_FLAG);
  if (childFlag >= 0) {
    const [mode, ...paths] = process.argv.slice(childFlag + 1);
    process.stdout.write(`${JSON.stringify(await run(mode === 'memory' ? 'memory' : 'timing', paths))}\n`);
    return;
  }
  const fileDir = mkdtempSync(join(tmpdir(), 'kcatalog-import-bench-files-'));
  const labels = benchMutations().map((mutation) => `${mutation.from}${mutation.position}${mutation.to}`);
  const filePaths: string[] = [];
  for (const [index, name] of CAMPAIGN_NAMES.entries()) {
    filePaths.push(join(fileDir, `measurements-${index + 1}.xlsx`));
    writeFileSync(filePaths[index], await buildWorkbook(name, labels));
  }
  console.log(`Import benchmark: ${ROWS.toLocaleString('en-US')} measurement rows, ${VARIANTS} variants, ${RUNS} runs, each in a process of its own`);
  const runs: RunFigures[] = [];
  const memoryRuns: MemoryFigures[] = [];
  const describe = (timing: Timing) =>
    `bare exceljs parse ${timing.parseMs.toFixed(0)} ms (CPU ${timing.parseCpuMs.toFixed(0)}), full import ${timing.importMs.toFixed(0)} ms (CPU ${timing.importCpuMs.toFixed(0)}), ` +
    `ratio ${(timing.importMs / timing.parseMs).toFixed(2)} (CPU ${(timing.importCpuMs / timing.parseCpuMs).toFixed(2)}), upload checks and sheet survey ${timing.uploadMs.toFixed(0)} ms`;
  try {
    for (let index = 0; index < RUNS; index += 1) runChild(index);
  } finally {
    rmSync(fileDir, { recursive: true, force: true });
  }
  function runChild(index: number): void {
    const child = (mode: 'timing' | 'memory') => {
      const result = spawnSync(process.execPath, [...process.execArgv, process.argv[1], CHILD_FLAG, mode, ...filePaths], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] });
      if (result.status !== 0) throw new Error(`run ${index + 1} (${mode}) failed with exit code ${result.status}`);
      return JSON.parse(result.stdout.trim().split('\n').pop()!) as unknown;
    };
    const figures = child('timing') as RunFigures;
    const memory = child('memory') as MemoryFigures;
    runs.push(figures);
    memoryRuns.push(memory);
    console.log(
      `run ${index + 1}: file ${figures.fileKilobytes.toFixed(0)} kB, ${figures.cells.toLocaleString('en-US')} cells; a process that only imports the first file: ` +
        `RSS ${memory.setupRssMegabytes.toFixed(0)} MB before, peak ${memory.peakRssMegabytes.toFixed(0)} MB (the timing process, with its bare parses: peak ${figures.peakRssMegabytes.toFixed(0)} MB)`,
    );
    console.log(`  first import in the process: ${describe(figures.cold)}`);
    console.log(`  second import (code compiled): ${describe(figures.warm)}`);
    console.log(`  for comparison, exceljs's in-memory reader (workbook.xlsx.load) on the same file: ${figures.loadMs.toFixed(0)} ms`);
  }
  const ratio = (pick: (figures: RunFigures) => Timing, cpu: boolean) =>
    median(runs.map((figures) => (cpu ? pick(figures).importCpuMs / pick(figures).parseCpuMs : pick(figures).importMs / pick(figures).parseMs))).toFixed(2);
  console.log(
    `Median of ${RUNS}: first import ${median(runs.map((figures) => figures.cold.importMs)).toFixed(0)} ms against a bare parse of ${median(runs.map((figures) => figures.cold.parseMs)).toFixed(0)} ms, ` +
      `ratio ${ratio((figures) => figures.cold, false)} (CPU ${ratio((figures) => figures.cold, true)}); second import ${median(runs.map((figures) => figures.warm.importMs)).toFixed(0)} ms against ` +
      `${median(runs.map((figures) => figures.warm.parseMs)).toFixed(0)} ms, ratio ${ratio((figures) => figures.warm, false)} (CPU ${ratio((figures) => figures.warm, true)}); ` +
      `second import against workbook.xlsx.load ${median(runs.map((figures) => figures.warm.importMs / figures.loadMs)).toFixed(2)}; ` +
      `highest peak RSS of an import ${Math.max(...memoryRuns.map((figures) => figures.peakRssMegabytes)).toFixed(0)} MB. Targets: ratio ≤ 2, peak ≤ 300 MB.`,
  );
}

await main();
