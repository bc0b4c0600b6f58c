import { once } from 'node:events';
import zlib from 'node:zlib';
import ExcelJS from 'exceljs';
import yauzl from 'yauzl';
import type request from 'supertest';
import type { Session } from '../helpers/sheet';

/**
 * Workbooks for the exchange tests: downloads read as bytes, exceljs edits as a partner's program would make
 * them, and zip archives written by hand (to build the hostile files: bombs, macros, links, damaged XML).
 */

/** Reads a response body as bytes (supertest parses only text and JSON by itself). */
export function binary(response: request.Response & NodeJS.ReadableStream, done: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => done(null, Buffer.concat(chunks)));
}

/** A revision's export in a format, as bytes. */
export async function download(session: Session, craftId: string, revisionId: string, format: 'xlsx' | 'json' | 'csv') {
  const response = await session.agent
    .get(`/api/crafts/${craftId}/revisions/${revisionId}/export.${format}`)
    .buffer(true)
    .parse(binary as unknown as Parameters<request.Test['parse']>[0])
    .expect(200);
  return { response, bytes: response.body as Buffer };
}

/** An exported workbook opened with exceljs. */
export async function openWorkbook(bytes: Buffer): Promise<ExcelJS.Workbook> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  return workbook;
}

export async function saveWorkbook(workbook: ExcelJS.Workbook): Promise<Buffer> {
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

/** Uploads a file to the imports route as the person. */
export function upload(session: Session, craftId: string, revisionId: string, bytes: Buffer, fileName = 'partner.xlsx') {
  return session.agent
    .post(`/api/crafts/${craftId}/revisions/${revisionId}/imports`)
    .set('x-csrf-token', session.csrfToken)
    .attach('file', bytes, fileName);
}

/** One entry of a zip written by `zipOf`: stored as given, or already deflated with the size to declare. */
export type ZipEntry = { name: string; data: Buffer } | { name: string; deflated: Buffer; crc: number; declaredSize: number };

/** The entries of a zip, inflated. */
export async function unzip(bytes: Buffer): Promise<{ name: string; data: Buffer }[]> {
  const zip = await new Promise<yauzl.ZipFile>((resolve, reject) =>
    yauzl.fromBuffer(bytes, { lazyEntries: true }, (error, file) => (error || !file ? reject(error) : resolve(file))),
  );
  const entries: { name: string; data: Buffer }[] = [];
  await new Promise<void>((resolve, reject) => {
    zip.on('entry', (entry: yauzl.Entry) => {
      zip.openReadStream(entry, (error, stream) => {
        if (error || !stream) return reject(error);
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('end', () => {
          entries.push({ name: entry.fileName, data: Buffer.concat(chunks) });
          zip.readEntry();
        });
      });
    });
    zip.on('end', () => resolve());
    zip.on('error', reject);
    zip.readEntry();
  });
  return entries;
}

/** Writes a zip archive (deflate), declaring what each entry says it unpacks to. */
export function zipOf(entries: readonly ZipEntry[]): Buffer {
  const locals: Buffer[] = [];
  const central: Buffer[] = [];
  let offset = 0;
  for (const entry of entries) {
    const name = Buffer.from(entry.name, 'utf8');
    const deflated = 'data' in entry ? zlib.deflateRawSync(entry.data) : entry.deflated;
    const crc = 'data' in entry ? zlib.crc32(entry.data) : entry.crc;
    const size = 'data' in entry ? entry.data.length : entry.declaredSize;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc >>> 0, 14);
    local.writeUInt32LE(deflated.length, 18);
    local.writeUInt32LE(size >>> 0, 22);
    local.writeUInt16LE(name.length, 26);
    const record = Buffer.alloc(46);
    record.writeUInt32LE(0x02014b50, 0);
    record.writeUInt16LE(20, 4);
    record.writeUInt16LE(20, 6);
    record.writeUInt16LE(0x0800, 8);
    record.writeUInt16LE(8, 10);
    record.writeUInt32LE(crc >>> 0, 16);
    record.writeUInt32LE(deflated.length, 20);
    record.writeUInt32LE(size >>> 0, 24);
    record.writeUInt16LE(name.length, 28);
    record.writeUInt32LE(offset, 42);
    locals.push(local, name, deflated);
    central.push(record, name);
    offset += local.length + name.length + deflated.length;
  }
  const directory = Buffer.concat(central);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

/**
 * A zip bomb in a workbook's clothes: one worksheet of `megabytes` of a single repeated cell, deflated as a stream
 * (never held unpacked), declaring either its true size or a lie of 1 KB.
 */
export async function workbookBomb(megabytes: number, declare: 'truth' | 'lie'): Promise<Buffer> {
  const cell = '<c r="A1"><v>0</v></c>';
  const block = Buffer.from(cell.repeat(Math.ceil((1024 * 1024) / cell.length)).slice(0, 1024 * 1024));
  const head = Buffer.from('<?xml version="1.0"?><worksheet><sheetData><row r="1">');
  const tail = Buffer.from('</row></sheetData></worksheet>');
  const stream = zlib.createDeflateRaw({ level: 9 });
  const parts: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => parts.push(chunk));
  const ended = once(stream, 'end');
  let crc = zlib.crc32(head);
  stream.write(head);
  for (let index = 0; index < megabytes; index += 1) {
    crc = zlib.crc32(block, crc);
    if (!stream.write(block)) await once(stream, 'drain');
  }
  crc = zlib.crc32(tail, crc);
  stream.end(tail);
  await ended;
  const size = head.length + megabytes * block.length + tail.length;
  return zipOf([
    { name: '[Content_Types].xml', data: Buffer.from('<?xml version="1.0"?><Types/>') },
    { name: 'xl/workbook.xml', data: Buffer.from('<?xml version="1.0"?><workbook/>') },
    { name: 'xl/worksheets/sheet1.xml', deflated: Buffer.concat(parts), crc, declaredSize: declare === 'truth' ? size : 1024 },
  ]);
}
