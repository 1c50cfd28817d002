// The limits of an import, apart from the schemas so that the spreadsheet reader thread can use them
// without loading zod and every schema.

/** Largest upload, bytes. */
export const maxImportBytes = 20 * 1024 * 1024;
/** Most data rows one sheet may have (the header row not counted). */
export const maxImportRows = 200_000;
/**
 * Largest total uncompressed size of a workbook's parts, bytes. A 200,000-row sheet of twenty columns is
 * about 150 MB of XML; a zip bomb declares (or inflates to) far more.
 */
export const maxUncompressedWorkbookBytes = 256 * 1024 * 1024;
