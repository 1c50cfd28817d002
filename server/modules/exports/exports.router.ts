import { Router, type Response } from 'express';
import type { DataSource } from 'typeorm';
import { listVariantsQuery, type ListVariantsQuery } from '@shared/schemas/variant';
import { requirePermission } from '../../http/auth';
import { badRequest } from '../../http/errors';
import { parseId } from '../../http/params';
import { validateQuery } from '../../http/validate';
import { measurementExportSheets, measurementExportSheetsOf, type MeasurementExportSheet } from './export-measurements';
import { variantExportSheet } from './export-variants';
import { csvText, spreadsheetMediaTypes, workbookBuffer, type OutputSheet } from './spreadsheet-writer';

type Format = 'xlsx' | 'csv';

function formatOf(value: string | string[] | undefined): Format {
  const text = Array.isArray(value) ? value[0] : value;
  if (text === 'xlsx' || text === 'csv') return text;
  throw badRequest('Exports are .xlsx or .csv files.', { format: 'must be xlsx or csv' });
}

async function send(res: Response, format: Format, fileName: string, sheets: readonly OutputSheet[]): Promise<void> {
  const body = format === 'xlsx' ? await workbookBuffer(sheets) : Buffer.from(csvText(sheets[0]), 'utf8');
  res.attachment(`${fileName}.${format}`);
  res.setHeader('Content-Type', spreadsheetMediaTypes[format]);
  res.send(body);
}

function today(): string {
  return new Date().toISOString().slice(0, 10);
}

/**
 * `/api/exports`: the registry's current view (`variants.xlsx` / `variants.csv`, with exactly the query of
 * `GET /api/variants`) and a campaign's measurements (`campaigns/:id/measurements.xlsx` with sheets of
 * measurements, rate points and conditions; as `.csv` one table chosen with `sheet`).
 */
export function exportsRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/variants.:format', requirePermission('read'), validateQuery(listVariantsQuery), async (req, res) => {
    const format = formatOf(req.params.format);
    await send(res, format, `kcatalog-variants-${today()}`, [await variantExportSheet(dataSource, res.locals.query as ListVariantsQuery)]);
  });

  router.get('/campaigns/:id/measurements.:format', requirePermission('read'), async (req, res) => {
    const format = formatOf(req.params.format);
    const campaignId = parseId(req.params.id);
    const requested = typeof req.query.sheet === 'string' ? req.query.sheet : 'measurements';
    const unknown = Object.keys(req.query).filter((key) => key !== 'sheet');
    if (unknown.length > 0) throw badRequest(`Unknown parameter ${unknown.join(', ')}.`, Object.fromEntries(unknown.map((key) => [key, 'is not a parameter of this export'])));
    if (!(measurementExportSheets as readonly string[]).includes(requested)) {
      throw badRequest(`sheet must be one of ${measurementExportSheets.join(', ')}.`, { sheet: `must be one of ${measurementExportSheets.join(', ')}` });
    }
    const sheets = await measurementExportSheetsOf(dataSource, campaignId);
    const chosen = format === 'xlsx' ? measurementExportSheets.map((name) => sheets[name]) : [sheets[requested as MeasurementExportSheet]];
    await send(res, format, `kcatalog-campaign-${campaignId}-${format === 'csv' ? `${requested}-` : ''}${today()}`, chosen);
  });

  return router;
}
