import { createInflateRaw } from 'node:zlib';

/** One file of a ZIP archive as its central directory describes it. */
export interface ZipEntry {
  name: string;
  /** 0 stored, 8 deflated. */
  method: number;
  compressedSize: number;
  /** As declared; {@link verifyInflatedSizes} checks it against the data. */
  uncompressedSize: number;
  /** Offset of the entry's local file header. */
  localHeaderOffset: number;
  /** Byte range of the compressed data, after the local header. */
  dataStart: number;
  dataEnd: number;
  /** General purpose bit 3: sizes and CRC follow the data in a data descriptor (APPNOTE §4.3.9). */
  hasDataDescriptor: boolean;
}

/** Why an archive is refused; the message is written for the person who uploaded it. */
export class ZipRefusal extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ZipRefusal';
  }
}

// Signatures and fixed sizes from PKWARE's APPNOTE.TXT (version 6.3.10, 2022): §4.3.7 local file header,
// §4.3.12 central directory file header, §4.3.16 end of central directory record.
const LOCAL_HEADER_SIGNATURE = 0x04034b50;
const CENTRAL_HEADER_SIGNATURE = 0x02014b50;
const END_OF_CENTRAL_DIRECTORY_SIGNATURE = 0x06054b50;
const LOCAL_HEADER_SIZE = 30;
const CENTRAL_HEADER_SIZE = 46;
const END_RECORD_SIZE = 22;
// The end record may be followed by a comment of up to 65,535 bytes.
const MAX_COMMENT = 0xffff;
// ZIP64 (APPNOTE §4.4.1.4) marks sizes and counts that do not fit 16 or 32 bits with all ones.
const ZIP64_MARK_16 = 0xffff;
const ZIP64_MARK_32 = 0xffffffff;
// General purpose bit 0 (APPNOTE §4.4.4): the entry is encrypted.
const ENCRYPTED_FLAG = 0x1;
const DATA_DESCRIPTOR_FLAG = 0x8;
// A data descriptor is CRC and two 32-bit sizes, optionally after its own signature (APPNOTE §4.3.9.3).
const DATA_DESCRIPTOR_SIZES = [12, 16];
const STORED = 0;
const DEFLATED = 8;
/** More parts than any workbook has; a directory of millions of empty entries is itself an attack. */
const MAX_ENTRIES = 10_000;

/**
 * Reads a ZIP archive's central directory without decompressing anything, the way the PKWARE
 * specification lays it out (APPNOTE.TXT 6.3.10: §4.3.16 end of central directory record, §4.3.12
 * central directory file headers, §4.3.7 local file headers), and checks what can be checked from the
 * headers alone: the archive is one ZIP (not ZIP64, which a file under 20 MB never needs, and not split),
 * no entry is encrypted or compressed with anything but store or deflate, every entry's data lies inside
 * the file, the entries tile the data with neither overlaps (how the densest zip bombs repeat one compressed
 * block; Fifield, "A better zip bomb", WOOT 2019) nor gaps that could hide unlisted entries, and the declared uncompressed sizes add up to at most
 * `maxUncompressedBytes`.
 *
 * @param archive the whole file
 * @param maxUncompressedBytes the cap on the declared uncompressed total
 * @throws {ZipRefusal} naming what is wrong
 * @returns the entries, in central-directory order
 */
export function readZipCentralDirectory(archive: Buffer, maxUncompressedBytes: number): ZipEntry[] {
  const end = findEndRecord(archive);
  const diskNumber = archive.readUInt16LE(end + 4);
  const directoryDisk = archive.readUInt16LE(end + 6);
  const entriesOnDisk = archive.readUInt16LE(end + 8);
  const entryCount = archive.readUInt16LE(end + 10);
  const directorySize = archive.readUInt32LE(end + 12);
  const directoryOffset = archive.readUInt32LE(end + 16);
  if (entryCount === ZIP64_MARK_16 || directorySize === ZIP64_MARK_32 || directoryOffset === ZIP64_MARK_32) {
    throw new ZipRefusal('it is a ZIP64 archive, which no workbook of this size needs');
  }
  if (diskNumber !== 0 || directoryDisk !== 0 || entriesOnDisk !== entryCount) throw new ZipRefusal('it is a split (multi-part) archive');
  if (entryCount > MAX_ENTRIES) throw new ZipRefusal(`it has ${entryCount} parts; a workbook has far fewer than ${MAX_ENTRIES}`);
  if (directoryOffset + directorySize > end) throw new ZipRefusal('its central directory lies outside the file');

  const entries: ZipEntry[] = [];
  let offset = directoryOffset;
  let declaredTotal = 0;
  for (let index = 0; index < entryCount; index += 1) {
    if (offset + CENTRAL_HEADER_SIZE > end || archive.readUInt32LE(offset) !== CENTRAL_HEADER_SIGNATURE) {
      throw new ZipRefusal('its central directory is damaged');
    }
    const flags = archive.readUInt16LE(offset + 8);
    const method = archive.readUInt16LE(offset + 10);
    const compressedSize = archive.readUInt32LE(offset + 20);
    const uncompressedSize = archive.readUInt32LE(offset + 24);
    const nameLength = archive.readUInt16LE(offset + 28);
    const extraLength = archive.readUInt16LE(offset + 30);
    const commentLength = archive.readUInt16LE(offset + 32);
    const localHeaderOffset = archive.readUInt32LE(offset + 42);
    const name = archive.toString('utf8', offset + CENTRAL_HEADER_SIZE, offset + CENTRAL_HEADER_SIZE + nameLength);
    if (compressedSize === ZIP64_MARK_32 || uncompressedSize === ZIP64_MARK_32 || localHeaderOffset === ZIP64_MARK_32) {
      throw new ZipRefusal('it is a ZIP64 archive, which no workbook of this size needs');
    }
    if ((flags & ENCRYPTED_FLAG) !== 0) throw new ZipRefusal('it is encrypted; save the workbook without a password');
    if (method !== STORED && method !== DEFLATED) throw new ZipRefusal(`part ${name} uses compression method ${method}; only store and deflate are read`);
    declaredTotal += uncompressedSize;
    if (declaredTotal > maxUncompressedBytes) {
      throw new ZipRefusal(`it unpacks to more than ${Math.round(maxUncompressedBytes / 1024 / 1024)} MB, which no workbook of at most 200,000 rows needs`);
    }
    const { start, end: dataEnd } = dataRange(archive, name, localHeaderOffset, compressedSize, directoryOffset);
    const hasDataDescriptor = (flags & DATA_DESCRIPTOR_FLAG) !== 0;
    entries.push({ name, method, compressedSize, uncompressedSize, localHeaderOffset, dataStart: start, dataEnd, hasDataDescriptor });
    offset += CENTRAL_HEADER_SIZE + nameLength + extraLength + commentLength;
  }
  refuseOverlapsAndGaps(entries, directoryOffset);
  return entries;
}

function findEndRecord(archive: Buffer): number {
  const lowest = Math.max(0, archive.length - END_RECORD_SIZE - MAX_COMMENT);
  for (let offset = archive.length - END_RECORD_SIZE; offset >= lowest; offset -= 1) {
    if (archive.readUInt32LE(offset) !== END_OF_CENTRAL_DIRECTORY_SIGNATURE) continue;
    // The comment must end exactly at the end of the file, else these four bytes are data.
    if (offset + END_RECORD_SIZE + archive.readUInt16LE(offset + 20) === archive.length) return offset;
  }
  throw new ZipRefusal('it has no ZIP end record (the file is cut short or is no ZIP archive)');
}

/** The byte range of an entry's compressed data, checked against its local header. */
function dataRange(
  archive: Buffer,
  name: string,
  header: number,
  compressedSize: number,
  directoryOffset: number,
): { start: number; end: number } {
  if (header + LOCAL_HEADER_SIZE > directoryOffset || archive.readUInt32LE(header) !== LOCAL_HEADER_SIGNATURE) {
    throw new ZipRefusal(`part ${name} has no local header where the directory says`);
  }
  const start = header + LOCAL_HEADER_SIZE + archive.readUInt16LE(header + 26) + archive.readUInt16LE(header + 28);
  const end = start + compressedSize;
  if (end > directoryOffset) throw new ZipRefusal(`part ${name} runs past the end of the data`);
  return { start, end };
}

/**
 * The entries must tile the data area: each local header starts where the previous entry's data (and data
 * descriptor) ends. Overlaps repeat one compressed block many times; gaps could hide entries the central
 * directory does not list, which a reader walking the local headers (as exceljs's streaming reader does)
 * would still unpack.
 */
function refuseOverlapsAndGaps(entries: readonly ZipEntry[], directoryOffset: number): void {
  const ordered = [...entries].sort((first, second) => first.localHeaderOffset - second.localHeaderOffset);
  let expected = 0;
  let previous: ZipEntry | null = null;
  for (const entry of ordered) {
    if (previous !== null && entry.localHeaderOffset < previous.dataEnd) {
      throw new ZipRefusal(`parts ${previous.name} and ${entry.name} share their data, as zip bombs do`);
    }
    if (!followsOn(entry.localHeaderOffset, expected, previous)) throw new ZipRefusal('it holds data its central directory does not list');
    expected = entry.dataEnd;
    previous = entry;
  }
  if (!followsOn(directoryOffset, expected, previous)) throw new ZipRefusal('it holds data its central directory does not list');
}

function followsOn(offset: number, end: number, previous: ZipEntry | null): boolean {
  if (offset === end) return true;
  return previous !== null && previous.hasDataDescriptor && DATA_DESCRIPTOR_SIZES.includes(offset - end);
}

/**
 * Inflates every entry once, counting bytes and keeping nothing but the parts asked for, and refuses an
 * entry that inflates to more than its central directory declared: the declared sizes are only a claim,
 * and the reader that comes later must never see more than the capped total.
 *
 * @param archive the whole file, already read by {@link readZipCentralDirectory}
 * @param entries its entries
 * @param keep names of small parts to return the content of (e.g. `[Content_Types].xml`)
 * @throws {ZipRefusal} when an entry is damaged or larger than declared
 * @returns the kept parts' contents by name
 */
export async function verifyInflatedSizes(archive: Buffer, entries: readonly ZipEntry[], keep: readonly string[] = []): Promise<Map<string, Buffer>> {
  const kept = new Map<string, Buffer>();
  for (const entry of entries) {
    const data = archive.subarray(entry.dataStart, entry.dataEnd);
    const wanted = keep.includes(entry.name);
    if (entry.method === STORED) {
      if (data.length !== entry.uncompressedSize) throw new ZipRefusal(`part ${entry.name} is not the size its directory entry declares`);
      if (wanted) kept.set(entry.name, Buffer.from(data));
      continue;
    }
    const content = await inflateCounting(data, entry, wanted);
    if (wanted && content) kept.set(entry.name, content);
  }
  return kept;
}

function inflateCounting(data: Buffer, entry: ZipEntry, keep: boolean): Promise<Buffer | null> {
  return new Promise((resolve, reject) => {
    const inflater = createInflateRaw();
    const chunks: Buffer[] = [];
    let total = 0;
    let settled = false;
    const fail = (message: string) => {
      if (settled) return;
      settled = true;
      inflater.destroy();
      reject(new ZipRefusal(message));
    };
    inflater.on('data', (chunk: Buffer) => {
      total += chunk.length;
      if (total > entry.uncompressedSize) return fail(`part ${entry.name} unpacks to more than the ${entry.uncompressedSize} bytes its directory entry declares, as zip bombs do`);
      if (keep) chunks.push(chunk);
    });
    inflater.on('error', () => fail(`part ${entry.name} is damaged (its compressed data cannot be read)`));
    inflater.on('end', () => {
      if (settled) return;
      if (total !== entry.uncompressedSize) return fail(`part ${entry.name} is not the size its directory entry declares`);
      settled = true;
      resolve(keep ? Buffer.concat(chunks) : null);
    });
    inflater.end(data);
  });
}

/**
 * The same archive with its parts in another order, for a reader that walks the local headers from the
 * start: first the parts named in `first` (in that order), then those `next` picks, then the rest, each
 * group in file order. Each entry's bytes (local header, data and any data descriptor) run from its local
 * header to the next one's, since a checked archive's entries tile it; the central directory follows
 * unchanged. Its offsets then no longer match, which a reader walking the local headers never looks at.
 *
 * @param archive the whole file, already checked by {@link readZipCentralDirectory}
 * @param maxUncompressedBytes the cap it was checked with
 * @param first the parts to put first, in this order
 * @param next which of the other parts come right after them
 * @returns the reordered archive, or the archive itself when it is already in that order
 */
export function withPartsFirst(archive: Buffer, maxUncompressedBytes: number, first: readonly string[], next: (name: string) => boolean): Buffer {
  const directoryOffset = archive.readUInt32LE(findEndRecord(archive) + 16);
  const inFileOrder = [...readZipCentralDirectory(archive, maxUncompressedBytes)].sort((a, b) => a.localHeaderOffset - b.localHeaderOffset);
  const records = inFileOrder.map((entry, index) => ({
    name: entry.name,
    start: entry.localHeaderOffset,
    end: index + 1 < inFileOrder.length ? inFileOrder[index + 1].localHeaderOffset : directoryOffset,
  }));
  const rank = (name: string) => (first.includes(name) ? first.indexOf(name) : first.length + (next(name) ? 0 : 1));
  const reordered = [...records].sort((a, b) => rank(a.name) - rank(b.name) || a.start - b.start);
  if (reordered.every((record, index) => record === records[index])) return archive;
  return Buffer.concat([...reordered.map((record) => archive.subarray(record.start, record.end)), archive.subarray(directoryOffset)]);
}
