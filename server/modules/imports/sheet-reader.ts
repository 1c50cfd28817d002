import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { CheckedUpload } from './check-upload';
import { allRows, type SheetRow, type SheetSurvey } from './read-sheets';
import { fromWireError, fromWireRows, type ReadTask, type SheetReply, type SheetTask } from './sheet-messages';

/**
 * Reads uploads on a thread of its own (sheet-reader.worker.ts): parsing a large workbook takes about a
 * second of processor time, which would otherwise hold up every other request, and during a commit the rows
 * already read are checked and written here while the thread parses the rest. One thread serves the whole
 * process; it starts on first use (loading exceljs there takes most of a second), stays for the next upload,
 * and holds the process open only while it has work. If it dies, the reads in progress fail and the next one
 * starts a new thread.
 */

/** Rows a batch: the commit's chunk, so each batch is checked and written in one go. */
export const SHEET_BATCH_ROWS = 500;

const workerFile = fileURLToPath(new URL('./sheet-reader.worker.ts', import.meta.url));
// The server runs TypeScript through tsx, whose module hooks a worker thread does not inherit. The worker
// registers tsx's require hook, which compiles in the thread itself, rather than its import hooks, which would
// start one more thread with a heap of its own.
const tsxRequireHook = createRequire(import.meta.url).resolve('tsx/cjs/api');
const bootstrap = `require(${JSON.stringify(tsxRequireHook)}).register(); require(${JSON.stringify(workerFile)});`;

type Listener = (reply: SheetReply) => void;

let worker: Worker | null = null;
const listeners = new Map<number, Listener>();
let lastId = 0;

function readerThread(): Worker {
  if (worker) return worker;
  const started = new Worker(bootstrap, { eval: true, execArgv: [] });
  started.on('message', (reply: SheetReply) => listeners.get(reply.id)?.(reply));
  const fail = (message: string) => {
    if (worker === started) worker = null;
    for (const [id, listener] of listeners) listener({ id, kind: 'failed', error: { message } });
  };
  started.on('error', (error) => fail(`the spreadsheet reader stopped: ${error.message}`));
  started.on('exit', (code) => fail(`the spreadsheet reader stopped (exit code ${code})`));
  started.unref();
  worker = started;
  return started;
}

function start(task: ReadTask, listener: Listener): number {
  const thread = readerThread();
  lastId += 1;
  const id = lastId;
  listeners.set(id, listener);
  // Referenced only while something waits on it, so an idle reader does not keep the process alive.
  if (listeners.size === 1) thread.ref();
  thread.postMessage({ ...task, id } as SheetTask);
  return id;
}

function finish(id: number, cancel: boolean): void {
  if (!listeners.delete(id)) return;
  if (cancel) worker?.postMessage({ id, kind: 'cancel' } satisfies SheetTask);
  if (listeners.size === 0) worker?.unref();
}

/**
 * Every sheet's name, header row and count of data rows (see surveySheets), read on the reader thread.
 *
 * @param upload the checked upload
 * @param csvSheetName the name a CSV file's single sheet is shown under
 * @throws {HttpError} 400 for too many rows or an unreadable file
 * @returns the sheets in workbook order
 */
export function surveyUpload(upload: CheckedUpload, csvSheetName: string): Promise<SheetSurvey[]> {
  return new Promise((resolve, reject) => {
    const id = start({ kind: 'survey', upload, csvSheetName }, (reply) => {
      finish(id, false);
      if (reply.kind === 'surveyed') resolve(reply.surveys);
      else reject(reply.kind === 'failed' ? fromWireError(reply.error) : new Error(`unexpected reply ${reply.kind}`));
    });
  });
}

/**
 * One sheet's data rows in batches of {@link SHEET_BATCH_ROWS}, in order, as the reader thread parses them
 * (see readSheetInBatches). Stopping early tells the thread to stop parsing.
 *
 * @param upload the checked upload
 * @param sheetName the sheet (a CSV file has one, whatever its name)
 * @param columns 0-based columns to keep; all when omitted
 * @param onHeader gets the header texts before the first batch
 * @throws {HttpError} 400 when the sheet is missing, has too many rows or cannot be read
 */
export async function* sheetRowBatches(
  upload: CheckedUpload,
  sheetName: string,
  columns?: readonly number[],
  onHeader?: (headers: string[]) => void,
): AsyncGenerator<SheetRow[]> {
  const queue: SheetReply[] = [];
  const waiting: { wake: (() => void) | null } = { wake: null };
  const id = start({ kind: 'rows', upload, sheetName, columns: columns && [...columns], batchSize: SHEET_BATCH_ROWS }, (reply) => {
    queue.push(reply);
    waiting.wake?.();
  });
  let ended = false;
  try {
    for (;;) {
      if (queue.length === 0) await new Promise<void>((resolve) => (waiting.wake = resolve));
      waiting.wake = null;
      const reply = queue.shift()!;
      if (reply.kind === 'header') onHeader?.(reply.headers);
      else if (reply.kind === 'rows') yield fromWireRows(reply.rows);
      else {
        ended = true;
        if (reply.kind === 'done') return;
        throw reply.kind === 'failed' ? fromWireError(reply.error) : new Error(`unexpected reply ${reply.kind}`);
      }
    }
  } finally {
    finish(id, !ended);
  }
}

/**
 * The header row and every data row of one sheet, read on the reader thread.
 *
 * @param upload the checked upload
 * @param sheetName the sheet
 * @throws {HttpError} 400 when the sheet is missing, has too many rows or cannot be read
 * @returns the header texts and the data rows
 */
export async function readWholeSheet(upload: CheckedUpload, sheetName: string): Promise<{ headers: string[]; rows: SheetRow[] }> {
  let headers: string[] = [];
  const rows = await allRows(sheetRowBatches(upload, sheetName, undefined, (read) => (headers = read)));
  return { headers, rows };
}

/** Stops the reader thread (shutdown, tests); reads in progress fail, and the next read starts a new thread. */
export async function stopSheetReader(): Promise<void> {
  const running = worker;
  if (running) await running.terminate();
}
