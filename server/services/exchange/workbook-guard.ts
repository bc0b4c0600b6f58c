import yauzl from 'yauzl';
import { IMPORT_LIMITS } from '@/shared/exchange/layout';
import { HttpError } from '../../http-error';

/**
 * Checks an uploaded workbook before any spreadsheet library parses it. The zip's directory is read first: too
 * many entries, or more declared unpacked bytes than the limit, is refused at once. Then every entry is inflated
 * as a stream and its bytes counted, without keeping them (a zip bomb that lies about its sizes is stopped at the
 * limit, memory stays bounded), counting the rows of each worksheet on the way. Macros (vbaProject.bin, a
 * macro-enabled content type) and links to other files are refused.
 */

const mb = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

const refuse = (status: number, code: string, message: string) => new HttpError(status, code, message);

/** The media type sniffing gives an OLE compound file: an encrypted (password-protected) workbook, or a legacy .xls. */
export const OLE_CONTAINER = 'application/x-cfb';

/** Refuses what the content says is not an unprotected .xlsx: an OLE container (encrypted or legacy). */
export function refuseContainer(mime: string, fileName: string): void {
  if (mime === OLE_CONTAINER) {
    throw refuse(
      415,
      'encrypted_workbook',
      `${fileName} is an encrypted (password-protected) workbook or a legacy .xls file: save it as an unprotected .xlsx and import that`,
    );
  }
}

function openZip(bytes: Buffer): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true, validateEntrySizes: false, autoClose: false }, (error, zip) => {
      if (error || !zip)
        reject(refuse(400, 'malformed_workbook', `The file is not a readable .xlsx (zip): ${error?.message ?? 'no archive'}`));
      else resolve(zip);
    });
  });
}

/** Every entry of the zip's directory, read without inflating anything. */
function listEntries(zip: yauzl.ZipFile): Promise<yauzl.Entry[]> {
  return new Promise((resolve, reject) => {
    const entries: yauzl.Entry[] = [];
    zip.on('entry', (entry: yauzl.Entry) => {
      entries.push(entry);
      if (entries.length > IMPORT_LIMITS.maxEntries) {
        zip.close();
        reject(
          refuse(413, 'too_many_entries', `The workbook holds more than ${IMPORT_LIMITS.maxEntries} parts; refused before reading it`),
        );
        return;
      }
      zip.readEntry();
    });
    zip.on('end', () => resolve(entries));
    zip.on('error', (error: Error) =>
      reject(refuse(400, 'malformed_workbook', `The workbook's zip directory is damaged: ${error.message}`)),
    );
    zip.readEntry();
  });
}

/** What reading an entry found: its inflated size and, for a worksheet, its rows. */
interface EntryScan {
  bytes: number;
  rows: number;
  /** The first 64 KB of text, for the parts read here (content types). */
  head: string;
}

/** Inflates one entry as a stream, counting bytes against what is left of the limit; keeps nothing but counts. */
function scanEntry(zip: yauzl.ZipFile, entry: yauzl.Entry, budget: number): Promise<EntryScan> {
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (error, stream) => {
      if (error || !stream) {
        reject(refuse(400, 'malformed_workbook', `The part ${entry.fileName} cannot be unpacked: ${error?.message ?? 'no data'}`));
        return;
      }
      const scan: EntryScan = { bytes: 0, rows: 0, head: '' };
      let tail = '';
      stream.on('data', (chunk: Buffer) => {
        scan.bytes += chunk.length;
        if (scan.bytes > budget) {
          stream.destroy();
          reject(
            refuse(
              413,
              'unpacked_too_large',
              `The workbook unpacks to more than ${mb(IMPORT_LIMITS.maxUnpackedBytes)} (counted while unpacking ${entry.fileName}); refused before reading it`,
            ),
          );
          return;
        }
        const text = tail + chunk.toString('latin1');
        scan.rows += (text.match(/<(?:\w+:)?row[\s>]/g) ?? []).length - (tail.match(/<(?:\w+:)?row[\s>]/g) ?? []).length;
        tail = text.slice(-16);
        if (scan.head.length < 65536) scan.head += chunk.toString('utf8').slice(0, 65536 - scan.head.length);
      });
      stream.on('error', (streamError: Error) =>
        reject(refuse(400, 'malformed_workbook', `The part ${entry.fileName} is damaged: ${streamError.message}`)),
      );
      stream.on('end', () => resolve(scan));
    });
  });
}

/**
 * Checks a workbook's zip: sizes (declared, then counted), entries, macros, external links and rows per
 * worksheet. Throws a 4xx naming the problem; returns when the workbook may be parsed.
 */
export async function guardWorkbook(bytes: Buffer): Promise<void> {
  const zip = await openZip(bytes);
  try {
    const entries = await listEntries(zip);
    const declared = entries.reduce((sum, entry) => sum + entry.uncompressedSize, 0);
    if (declared > IMPORT_LIMITS.maxUnpackedBytes) {
      throw refuse(
        413,
        'unpacked_too_large',
        `The workbook declares ${mb(declared)} unpacked, above the limit of ${mb(IMPORT_LIMITS.maxUnpackedBytes)}; refused before reading it`,
      );
    }
    const names = entries.map((entry) => entry.fileName);
    if (names.some((name) => /(^|\/)vbaProject\.bin$/i.test(name) || /vbaData\.xml$/i.test(name))) {
      throw refuse(415, 'macro_workbook', 'The workbook carries macros (a VBA project); save it as a plain .xlsx without macros');
    }
    if (names.some((name) => name.toLowerCase().startsWith('xl/externallinks/'))) {
      throw refuse(400, 'external_links', 'The workbook links to other files (external links); remove the links and import it again');
    }
    if (!names.includes('xl/workbook.xml')) {
      throw refuse(415, 'not_a_workbook', 'The file is a zip archive but not an Excel workbook (it has no xl/workbook.xml)');
    }
    let left = IMPORT_LIMITS.maxUnpackedBytes;
    for (const entry of entries) {
      if (entry.fileName.endsWith('/')) continue;
      const scan = await scanEntry(zip, entry, left);
      left -= scan.bytes;
      if (entry.fileName === '[Content_Types].xml' && /macroEnabled/i.test(scan.head)) {
        throw refuse(415, 'macro_workbook', 'The workbook is macro-enabled (.xlsm); save it as a plain .xlsx without macros');
      }
      if (/^xl\/worksheets\/[^/]+\.xml$/i.test(entry.fileName) && scan.rows > IMPORT_LIMITS.maxSheetRows) {
        throw refuse(
          413,
          'too_many_rows',
          `The worksheet ${entry.fileName} has ${scan.rows} rows, above the limit of ${IMPORT_LIMITS.maxSheetRows.toLocaleString('en')} rows a sheet`,
        );
      }
    }
  } finally {
    zip.close();
  }
}
