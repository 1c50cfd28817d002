import ExcelJS from 'exceljs';
import { unitsOfKind } from '@shared/imports/unit-spelling';
import { importFields, importKindLabels, maxImportRows, type ImportField, type ImportKind } from '@shared/schemas/import';

/** The unit each quantity's template column is headed with; the instructions list the others accepted. */
const TEMPLATE_UNITS: Record<string, string> = {
  temperature: '°C',
  bufferConcentration: 'mM',
  ionicStrength: 'mM',
  metalConcentration: 'µM',
  enzymeConcentration: 'nM',
  kcat: '1/s',
  km: 'mM',
  kcatOverKm: 'M⁻¹ s⁻¹',
  ki: 'mM',
  substrateMin: 'mM',
  substrateMax: 'mM',
  s: 'mM',
  v: 'µM/min',
  rate: 'M⁻¹ s⁻¹',
};

const DATA_SHEET_NAMES: Record<ImportKind, string> = {
  variants: 'Variants',
  measurements: 'Measurements',
  'rate-points': 'Rate points',
  'ph-series': 'pH series',
};

// exceljs keeps a sheet's validations by address, ranges included (lib/doc/data-validations.js), but its
// type declarations only expose the per-cell setter; one range entry beats 200,000 cell entries.
function rangeValidations(worksheet: ExcelJS.Worksheet): { add: (address: string, validation: ExcelJS.DataValidation) => void } {
  return (worksheet as unknown as { dataValidations: { add: (address: string, validation: ExcelJS.DataValidation) => void } }).dataValidations;
}

/**
 * The header a template writes for a field: its label and, for a quantity, its unit in brackets
 * (`Km (mM)`); a standard error is headed in its value's unit. Every header is one the import detects.
 *
 * @param field the field
 * @returns the header text
 */
export function templateHeader(field: ImportField): string {
  if (field.unitKind === undefined) return field.label;
  return `${field.label} (${TEMPLATE_UNITS[field.errorOf ?? field.key]})`;
}

/**
 * A blank workbook for one import kind: a data sheet whose header row names every field with its unit, drop-
 * down lists (from a Lists sheet) on the columns that take a choice (statuses, models, methods, rate kinds),
 * and an Instructions sheet saying for each column whether it is required, what to write and which units
 * are accepted.
 *
 * @param kind the import kind
 * @returns the .xlsx bytes
 */
export async function importTemplate(kind: ImportKind): Promise<Buffer> {
  const fields = importFields[kind];
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Kcatalog';
  const data = workbook.addWorksheet(DATA_SHEET_NAMES[kind], { views: [{ state: 'frozen', ySplit: 1 }] });
  const instructions = workbook.addWorksheet('Instructions');
  const lists = workbook.addWorksheet('Lists');

  const header = data.addRow(fields.map(templateHeader));
  header.font = { bold: true };
  fields.forEach((field, index) => {
    data.getColumn(index + 1).width = Math.max(12, templateHeader(field).length + 2);
  });

  const choiceFields = fields.filter((field) => field.choices !== undefined);
  choiceFields.forEach((field, listIndex) => {
    const column = lists.getColumn(listIndex + 1);
    column.width = 24;
    lists.getCell(1, listIndex + 1).value = field.label;
    lists.getCell(1, listIndex + 1).font = { bold: true };
    field.choices!.forEach((choice, row) => {
      lists.getCell(row + 2, listIndex + 1).value = choice;
    });
    const letter = column.letter;
    const dataLetter = data.getColumn(fields.indexOf(field) + 1).letter;
    rangeValidations(data).add(`${dataLetter}2:${dataLetter}${maxImportRows + 1}`, {
      type: 'list',
      allowBlank: true,
      formulae: [`Lists!$${letter}$2:$${letter}$${field.choices!.length + 1}`],
      showErrorMessage: true,
      errorTitle: field.label,
      error: `Choose one of: ${field.choices!.join(', ')}`,
    });
  });

  instructions.columns = [
    { header: 'Column', width: 36 },
    { header: 'Required', width: 10 },
    { header: 'What to write', width: 80 },
    { header: 'Units accepted', width: 60 },
  ];
  instructions.getRow(1).font = { bold: true };
  instructions.addRow([`${importKindLabels[kind]}: one row per ${kind === 'variants' ? 'variant' : kind === 'measurements' ? 'measurement' : 'point'}. Keep the header row; columns may be reordered or left out unless required.`]);
  for (const field of fields) {
    instructions.addRow([
      templateHeader(field),
      field.required ? 'yes' : 'no',
      field.hint,
      field.unitKind === undefined ? '' : unitsOfKind[field.unitKind].join(', '),
    ]);
  }
  instructions.addRow([]);
  instructions.addRow(['Units: write the unit in the header in brackets, e.g. Km (mM), kcat [1/s], kcat/Km (M-1 s-1). A column holds one unit; a cell may repeat it (250 µM) but not change it.']);
  instructions.addRow(['Dates: date cells, or text written YYYY-MM-DD. Numbers: a decimal point, not a comma. Empty, NA or n.d. mean no value.']);
  instructions.addRow(['Importing the same file again changes nothing: rows are matched by campaign and mutation set (variants) or variant, conditions and date (assays).']);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
