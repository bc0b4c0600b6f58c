import express from 'express';
import request from 'supertest';
import { errorHandler } from '@/server/middleware/errors';
import { acceptUpload, cleanFileName, isPlainText, sniffContent, uploadOf } from '@/server/middleware/upload';

const PDF = Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n');
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
/** The first bytes of a Windows executable: "MZ", then padding. */
const EXE = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(126, 0x90)]);

/** A bare app around the middleware: it answers with what the route would see. */
function appAccepting(maxBytes = 1024) {
  const app = express();
  app.post('/upload', acceptUpload({ maxBytes, accept: ['application/pdf', 'image/png', 'text/plain'], fields: ['kind'] }), (req, res) => {
    const upload = uploadOf(req);
    res.json({ name: upload.name, mime: upload.type.mime, size: upload.bytes.length, body: req.body as unknown });
  });
  app.use(errorHandler);
  return app;
}

async function expectRefused(response: request.Response, status: number, code: string, mentions?: RegExp) {
  expect(response.status).toBe(status);
  expect(response.body.error.code).toBe(code);
  if (mentions) expect(response.body.error.message).toMatch(mentions);
}

describe('acceptUpload', () => {
  it('gives the route the file, its sniffed type, its cleaned name and the allowed fields', async () => {
    const response = await request(appAccepting()).post('/upload').field('kind', 'datasheet').attach('file', PDF, 'sail.pdf');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ name: 'sail.pdf', mime: 'application/pdf', size: PDF.length, body: { kind: 'datasheet' } });
  });

  it('reads a UTF-8 name as UTF-8', async () => {
    const response = await request(appAccepting()).post('/upload').attach('file', PDF, 'Wägebericht – Ausleger.pdf');
    expect(response.body.name).toBe('Wägebericht – Ausleger.pdf');
  });

  it('refuses a file over the limit with 413', async () => {
    const response = await request(appAccepting(100)).post('/upload').attach('file', Buffer.alloc(101, 0x61), 'big.txt');
    await expectRefused(response, 413, 'file_too_large', /limit/);
  });

  it('accepts a file of exactly the limit', async () => {
    const response = await request(appAccepting(100)).post('/upload').attach('file', Buffer.alloc(100, 0x61), 'edge.txt');
    expect(response.status).toBe(200);
  });

  it('refuses a request without the file field', async () => {
    await expectRefused(await request(appAccepting()).post('/upload').field('kind', 'other'), 400, 'file_missing', /"file"/);
    await expectRefused(await request(appAccepting()).post('/upload').send({ kind: 'other' }), 400, 'file_missing');
  });

  it('refuses a file in another field, a second file and an unexpected text field', async () => {
    await expectRefused(await request(appAccepting()).post('/upload').attach('document', PDF, 'a.pdf'), 400, 'unexpected_file', /document/);
    const twice = await request(appAccepting()).post('/upload').attach('file', PDF, 'a.pdf').attach('file', PDF, 'b.pdf');
    await expectRefused(twice, 400, 'unexpected_file');
    const extra = await request(appAccepting()).post('/upload').field('owner', 'x').attach('file', PDF, 'a.pdf');
    expect(extra.status).toBe(400);
    expect(extra.body.error.code).toBe('unexpected_field');
  });

  it('refuses multipart that does not parse', async () => {
    const response = await request(appAccepting())
      .post('/upload')
      .set('Content-Type', 'multipart/form-data; boundary=xyz')
      .send('--xyz\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.4 cut short');
    await expectRefused(response, 400, 'malformed_upload');
  });

  it('refuses an empty file', async () => {
    await expectRefused(
      await request(appAccepting()).post('/upload').attach('file', Buffer.alloc(0), 'empty.pdf'),
      400,
      'file_empty',
      /empty\.pdf/,
    );
  });

  it('refuses an executable, even one named .pdf, by its content', async () => {
    const response = await request(appAccepting()).post('/upload').attach('file', EXE, 'datasheet.pdf');
    await expectRefused(response, 415, 'unsupported_file_type', /datasheet\.pdf is a Windows executable/);
  });

  it('refuses an accepted type whose name claims another', async () => {
    const response = await request(appAccepting()).post('/upload').attach('file', PNG, 'report.pdf');
    await expectRefused(response, 415, 'file_type_mismatch', /PNG image/);
  });

  it('stores a name without its folders, line breaks or direction marks', async () => {
    // Browsers escape a line break in a name as %0A; U+202E would make the rest of the name read right to left.
    const response = await request(appAccepting()).post('/upload').attach('file', PDF, 'C:\\Users\\x\\..\\evil%0A\u202Efdp.pdf');
    expect(response.status).toBe(200);
    expect(response.body.name).toBe('evilfdp.pdf');
  });

  it('refuses a name with a raw control character as malformed', async () => {
    const response = await request(appAccepting()).post('/upload').attach('file', PDF, 'bell\u0007.pdf');
    await expectRefused(response, 400, 'malformed_upload');
  });
});

describe('sniffContent', () => {
  it('names types by their bytes', async () => {
    expect((await sniffContent(PDF)).mime).toBe('application/pdf');
    expect((await sniffContent(PNG)).mime).toBe('image/png');
    expect((await sniffContent(Buffer.from('mass,kg\nboom,1.25\n'))).mime).toBe('text/plain');
  });

  it('tells markup from plain text', async () => {
    expect((await sniffContent(Buffer.from('  <!DOCTYPE html><p>hi'))).mime).toBe('text/html');
    expect((await sniffContent(Buffer.from('notes\n<script>alert(1)</script>'))).mime).toBe('text/html');
    expect((await sniffContent(Buffer.from('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"/>'))).mime).toBe('image/svg+xml');
    expect((await sniffContent(Buffer.from('mass < 2 kg and > 1 kg'))).mime).toBe('text/plain');
  });

  it('calls bytes with NUL or control characters, or broken UTF-8, binary', async () => {
    expect(isPlainText(Buffer.from('a\tb\r\nc'))).toBe(true);
    expect(isPlainText(Buffer.from('a\u0000b'))).toBe(false);
    expect(isPlainText(Buffer.from([0x61, 0xff, 0x62]))).toBe(false);
    expect((await sniffContent(Buffer.from([0x01, 0x02, 0x03]))).mime).toBe('application/octet-stream');
  });
});

describe('cleanFileName', () => {
  it('keeps the last part of a path and drops what cannot be shown', () => {
    expect(cleanFileName('../../etc/passwd')).toBe('passwd');
    expect(cleanFileName('a\r\nb.txt')).toBe('ab.txt');
    expect(cleanFileName('...')).toBe('upload');
    expect(cleanFileName('.hidden.txt')).toBe('hidden.txt');
  });

  it('shortens a long name and keeps its extension', () => {
    const cleaned = cleanFileName(`${'x'.repeat(300)}.pdf`);
    expect(cleaned).toHaveLength(200);
    expect(cleaned.endsWith('.pdf')).toBe(true);
  });
});
