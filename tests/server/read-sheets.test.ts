import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { checkUpload, reopenUpload } from '@server/modules/imports/check-upload';
import { CellFault } from '@server/modules/imports/read-sheets';
import { readWholeSheet, SHEET_BATCH_ROWS, sheetRowBatches, stopSheetReader, surveyUpload } from '@server/modules/imports/sheet-reader';
import { workbookSheetNames } from '@server/modules/imports/workbook-sheet-names';
import { workbookBuffer } from '@server/modules/exports/spreadsheet-writer';
import { readZipCentralDirectory, withPartsFirst } from '@server/modules/imports/zip-central-directory';

async function checked(buffer: Buffer) {
  return checkUpload({ originalName: 'sheet.xlsx', buffer });
}

describe('reading workbooks (on the reader thread)', () => {
  it('names every sheet as its tab says, in tab order, every time (not only when exceljs read the workbook part first)', async () => {
    const rows = (count: number) => Array.from({ length: count }, (_, index) => [`v${index}`, index]);
    // The streaming writer puts the worksheets before xl/workbook.xml in the file.
    const upload = await checked(
      await workbookBuffer([
        { name: 'Measurements', headers: ['a', 'b'], rows: rows(3) },
        { name: 'Rate points & more', headers: ['a', 'b'], rows: rows(7) },
      ]),
    );
    for (let attempt = 0; attempt < 100; attempt += 1) {
      const sheets = await surveyUpload(upload, 'unused');
      expect(sheets.map((sheet) => [sheet.name, sheet.rowCount])).toEqual([
        ['Measurements', 3],
        ['Rate points & more', 7],
      ]);
    }
    expect((await readWholeSheet(upload, 'Rate points & more')).rows).toHaveLength(7);
  });

  it('reads dates as dates, formula results as values, and spreadsheet errors and uncalculated formulas as faults', async () => {
    const book = new ExcelJS.Workbook();
    const sheet = book.addWorksheet('Data');
    sheet.addRow(['Day', 'Sum', 'Broken', 'Pending', 'Rich']);
    const row = sheet.addRow([new Date(Date.UTC(2026, 2, 4)), { formula: 'B3+1', result: 3 }, { error: '#DIV/0!' }, { formula: 'A1*2' }, { richText: [{ text: 'Ser' }, { text: '112Ala' }] }]);
    row.getCell(1).numFmt = 'yyyy-mm-dd';
    const { headers, rows } = await readWholeSheet(await checked(Buffer.from(await book.xlsx.writeBuffer())), 'Data');
    expect(headers).toEqual(['Day', 'Sum', 'Broken', 'Pending', 'Rich']);
    const [cells] = rows.map((read) => read.cells);
    expect(rows[0].rowNumber).toBe(2);
    expect((cells[0] as Date).toISOString()).toBe('2026-03-04T00:00:00.000Z');
    expect(cells[1]).toBe(3);
    expect(cells[2]).toEqual(new CellFault('holds the spreadsheet error #DIV/0!'));
    expect((cells[3] as CellFault).message).toMatch(/formula without a stored result/);
    expect(cells[4]).toBe('Ser112Ala');
  });
});

describe('reopenUpload', () => {
  it('gives the upload check’s result for the bytes stored under the hash, and checks other bytes in full again', async () => {
    const buffer = await workbookBuffer([
      { name: 'Measurements', headers: ['a'], rows: [['x']] },
      { name: 'Points', headers: ['a'], rows: [] },
    ]);
    const sha256 = createHash('sha256').update(buffer).digest('hex');
    expect(await reopenUpload({ originalName: 'sheet.xlsx', buffer }, sha256)).toEqual(await checked(buffer));
    await expect(reopenUpload({ originalName: 'sheet.xlsx', buffer: Buffer.from('no workbook') }, sha256)).rejects.toThrow(/is not an Excel workbook/);
  });
});

describe('workbookSheetNames', () => {
  it('maps worksheet parts to names through the relationships (ECMA-376 Part 1 §18.2.19, Part 2 §9.3)', () => {
    const workbook = `<workbook xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets>
      <sheet name="Kinetics &amp; pH" sheetId="7" r:id="rId9"/><sheet name="Points" sheetId="2" r:id="rId2"/></sheets></workbook>`;
    const relationships = `<Relationships><Relationship Id="rId2" Target="/xl/worksheets/sheet1.xml" Type="worksheet"/>
      <Relationship Id="rId9" Target="worksheets/sheet4.xml" Type="worksheet"/><Relationship Id="rId3" Target="styles.xml"/></Relationships>`;
    expect([...workbookSheetNames(workbook, relationships)]).toEqual([
      [4, 'Kinetics & pH'],
      [1, 'Points'],
    ]);
  });
});

describe('the reader thread', () => {
  const manyRows = async (count: number) =>
    checked(await workbookBuffer([{ name: 'Rows', headers: ['Variant', 'kcat (1/s)'], rows: Array.from({ length: count }, (_, index) => [`A${index + 2}W`, index]) }]));

  it('hands the rows over in order, in batches, and a reader that stops early leaves the thread free for the next file', async () => {
    const upload = await manyRows(1_800);
    const batches: number[] = [];
    for await (const batch of sheetRowBatches(upload, 'Rows')) {
      batches.push(batch.length);
      expect(batch[0].rowNumber).toBe(2 + (batches.length - 1) * SHEET_BATCH_ROWS);
    }
    expect(batches).toEqual([500, 500, 500, 300]);
    for await (const batch of sheetRowBatches(upload, 'Rows')) {
      expect(batch).toHaveLength(500);
      break;
    }
    expect((await readWholeSheet(upload, 'Rows')).rows).toHaveLength(1_800);
  });

  it('fails the reads in progress with a message when the thread dies, and starts a new thread for the next read', async () => {
    const upload = await manyRows(3_000);
    const reading = (async () => {
      let rows = 0;
      for await (const batch of sheetRowBatches(upload, 'Rows')) {
        rows += batch.length;
        if (rows === SHEET_BATCH_ROWS) await stopSheetReader();
      }
      return rows;
    })();
    await expect(reading).rejects.toThrow(/the spreadsheet reader stopped/);
    expect((await readWholeSheet(upload, 'Rows')).rows).toHaveLength(3_000);
  });

  it('refuses a sheet that is not in the file, naming it', async () => {
    await expect(readWholeSheet(await manyRows(3), 'Elsewhere')).rejects.toThrow('The file has no sheet named Elsewhere.');
  });
});

describe('the reader and the order of the parts in the file', () => {
  it('puts the workbook, its relationships, styles and shared strings first, then the worksheets, keeping every byte', async () => {
    // exceljs's own writer puts the worksheets before the shared strings, styles and workbook part.
    const archive = await workbookBuffer([{ name: 'Rows', headers: ['a'], rows: [['x']] }]);
    const names = (buffer: Buffer) => {
      const found: string[] = [];
      // Walking the local headers as a streaming reader does (APPNOTE 6.3.10 §4.3.7).
      for (const entry of readZipCentralDirectory(archive, 1e9).sort((a, b) => a.localHeaderOffset - b.localHeaderOffset)) {
        const offset = buffer.indexOf(archive.subarray(entry.localHeaderOffset, entry.dataEnd));
        found.push(`${offset}:${entry.name}`);
      }
      return found.sort((a, b) => Number(a.split(':')[0]) - Number(b.split(':')[0])).map((item) => item.split(':').slice(1).join(':'));
    };
    const first = ['[Content_Types].xml', '_rels/.rels', 'xl/workbook.xml', 'xl/_rels/workbook.xml.rels', 'xl/styles.xml', 'xl/sharedStrings.xml'];
    const reordered = withPartsFirst(archive, 1e9, first, (name) => name.startsWith('xl/worksheets/'));
    expect(reordered.length).toBe(archive.length);
    const order = names(reordered).filter((name) => !name.endsWith('/'));
    const present = first.filter((name) => order.includes(name));
    expect(present).toContain('xl/workbook.xml');
    expect(order.slice(0, present.length)).toEqual(present);
    expect(order[present.length]).toBe('xl/worksheets/sheet1.xml');
    expect(names(archive).filter((name) => !name.endsWith('/')).indexOf('xl/workbook.xml')).toBeGreaterThan(names(archive).indexOf('xl/worksheets/sheet1.xml'));
  });
});

