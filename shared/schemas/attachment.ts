/**
 * Raw instrument files attached to an assay (plate-reader exports). The server decides a file's media type
 * from its extension and checks the content against it; the type the browser claims is not trusted.
 */

/** Largest attachment, bytes. A plate-reader export of a 384-well kinetic run is a few megabytes. */
export const maxAttachmentBytes = 10 * 1024 * 1024;

/** Most files one upload may carry. */
export const maxAttachmentsPerUpload = 5;

/** The multipart form field the files go in. */
export const attachmentField = 'files';

/**
 * Accepted extensions and the media type each is stored and served with: text exports (CSV, TSV, plain
 * text, XML, JSON) and Excel workbooks, which is what plate readers write.
 */
export const attachmentTypes = {
  csv: { mediaType: 'text/csv', content: 'text' },
  tsv: { mediaType: 'text/tab-separated-values', content: 'text' },
  txt: { mediaType: 'text/plain', content: 'text' },
  xml: { mediaType: 'application/xml', content: 'text' },
  json: { mediaType: 'application/json', content: 'text' },
  xlsx: { mediaType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', content: 'zip' },
  xls: { mediaType: 'application/vnd.ms-excel', content: 'ole' },
} as const satisfies Record<string, { mediaType: string; content: 'text' | 'zip' | 'ole' }>;
export type AttachmentExtension = keyof typeof attachmentTypes;

/** Extensions for an `<input type="file" accept>` and for messages. */
export const attachmentExtensions = Object.keys(attachmentTypes) as AttachmentExtension[];

/** A stored attachment as the API returns it. */
export interface AttachmentDto {
  id: number;
  ownerType: 'assay' | 'import';
  ownerId: number;
  originalName: string;
  mediaType: string;
  sizeBytes: number;
  /** SHA-256 of the content, lower-case hex. */
  sha256: string;
  createdById: number | null;
  createdAt: string;
  /** Where the file can be fetched (GET). */
  contentUrl: string;
}
