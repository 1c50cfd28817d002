import { parentPort } from 'node:worker_threads';
import { readSheetInBatches, surveySheets } from './read-sheets';
import { fromWireUpload, toWireError, toWireRows, type ReadTask, type SheetReply, type SheetTask } from './sheet-messages';

/**
 * The spreadsheet reader thread (started by sheet-reader.ts): parses uploads with exceljs or papaparse and
 * sends back sheet surveys and row batches, so that the server's own thread stays free for requests and,
 * during a commit, checks and writes the rows already read while the rest of the file is parsed.
 */

const port = parentPort;
if (!port) throw new Error('sheet-reader.worker.ts runs in a worker thread');
const cancelled = new Set<number>();
const reply = (message: SheetReply) => port.postMessage(message);

port.on('message', (task: SheetTask) => {
  if (task.kind === 'cancel') cancelled.add(task.id);
  else void run(task);
});

async function run(task: ReadTask & { id: number }): Promise<void> {
  try {
    const upload = fromWireUpload(task.upload);
    if (task.kind === 'survey') {
      reply({ id: task.id, kind: 'surveyed', surveys: await surveySheets(upload, task.csvSheetName) });
      return;
    }
    await readSheetInBatches(
      upload,
      task.sheetName,
      task.columns,
      {
        onHeader: (headers) => reply({ id: task.id, kind: 'header', headers }),
        onRows: (rows) => {
          // The reader of the rows stopped (its import failed): parsing the rest would be wasted.
          if (cancelled.has(task.id)) throw new Error('the reader of these rows stopped');
          reply({ id: task.id, kind: 'rows', rows: toWireRows(rows) });
        },
      },
      task.batchSize,
    );
    reply({ id: task.id, kind: 'done' });
  } catch (error) {
    if (!cancelled.has(task.id)) reply({ id: task.id, kind: 'failed', error: toWireError(error) });
  } finally {
    cancelled.delete(task.id);
  }
}
