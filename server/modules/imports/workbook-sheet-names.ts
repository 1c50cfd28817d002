// ECMA-376 Part 1, §18.2.19 (sheet) and Part 2, §9.3 (relationships): each <sheet> of xl/workbook.xml names a
// relationship whose target is the sheet's part, here xl/worksheets/sheetN.xml.
const SHEET_ELEMENT = /<(?:[\w-]+:)?sheet\b([^>]*?)\/?>/g;
const RELATIONSHIP_ELEMENT = /<(?:[\w-]+:)?Relationship\b([^>]*?)\/?>/g;
const ATTRIBUTE = /([\w:-]+)\s*=\s*("([^"]*)"|'([^']*)')/g;
const WORKSHEET_PART = /(?:^|\/)worksheets\/sheet(\d+)\.xml$/;

function attributes(text: string): Map<string, string> {
  const found = new Map<string, string>();
  for (const match of text.matchAll(ATTRIBUTE)) found.set(match[1], decodeEntities(match[3] ?? match[4] ?? ''));
  return found;
}

function decodeEntities(text: string): string {
  return text.replace(/&(#x[0-9a-f]+|#\d+|amp|lt|gt|quot|apos);/gi, (entity, body: string) => {
    const lower = body.toLowerCase();
    if (lower.startsWith('#x')) return String.fromCodePoint(parseInt(lower.slice(2), 16));
    if (lower.startsWith('#')) return String.fromCodePoint(Number(lower.slice(1)));
    return { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" }[lower] ?? entity;
  });
}

/**
 * The sheet names of a workbook by the number of their part (`xl/worksheets/sheet3.xml` → 3), in the
 * workbook's order, read from xl/workbook.xml and its relationships. exceljs's streaming reader names a
 * sheet only when it happens to have read those two parts first, so the import names sheets from here.
 *
 * @param workbookXml the content of xl/workbook.xml
 * @param relationshipsXml the content of xl/_rels/workbook.xml.rels
 * @returns part number → sheet name, in the order the workbook lists its sheets
 */
export function workbookSheetNames(workbookXml: string, relationshipsXml: string): Map<number, string> {
  const targets = new Map<string, number>();
  for (const match of relationshipsXml.matchAll(RELATIONSHIP_ELEMENT)) {
    const relationship = attributes(match[1]);
    const part = WORKSHEET_PART.exec(relationship.get('Target') ?? '');
    const id = relationship.get('Id');
    if (part && id) targets.set(id, Number(part[1]));
  }
  const names = new Map<number, string>();
  for (const match of workbookXml.matchAll(SHEET_ELEMENT)) {
    const sheet = attributes(match[1]);
    const relationshipId = [...sheet.entries()].find(([name]) => name === 'id' || name.endsWith(':id'))?.[1];
    const part = relationshipId === undefined ? undefined : targets.get(relationshipId);
    const name = sheet.get('name');
    if (part !== undefined && name !== undefined) names.set(part, name);
  }
  return names;
}
