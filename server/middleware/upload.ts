import type { Request, RequestHandler } from 'express';
import FileType from 'file-type';
import multer, { MulterError } from 'multer';
import { HttpError } from '../http-error';

/** A file type as its bytes say it is. */
export interface SniffedType {
  /** The media type stored and sent back as Content-Type. */
  mime: string;
  /** How people name it in a sentence ("a PDF"). */
  description: string;
}

/** A file received by `acceptUpload`: checked for size, emptiness and type, its type sniffed from its bytes. */
export interface Upload {
  bytes: Buffer;
  /** The sender's name made safe to show and offer back: no folders, no control or text-direction characters. */
  name: string;
  type: SniffedType;
}

/** What a route accepts. */
export interface UploadRules {
  /** The largest file accepted, in bytes; a larger one is 413 file_too_large before it is read to the end. */
  maxBytes: number;
  /** Media types accepted, as `sniffContent` names them. */
  accept: readonly string[];
  /** Text fields allowed beside the file (they land in req.body for `validate`); any other is 400. */
  fields?: readonly string[];
}

const PLAIN_TEXT = 'text/plain';

/** Names for the media types people send; anything else is described by its media type. */
const descriptions: Readonly<Record<string, string>> = {
  'application/pdf': 'a PDF',
  'image/png': 'a PNG image',
  'image/jpeg': 'a JPEG image',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'an Excel workbook (.xlsx)',
  'application/vnd.oasis.opendocument.spreadsheet': 'an OpenDocument spreadsheet (.ods)',
  'application/zip': 'a zip archive',
  'application/x-cfb': 'an encrypted workbook or a legacy Office file (an OLE container)',
  'application/x-msdownload': 'a Windows executable',
  'application/x-elf': 'a Linux executable',
  'application/xml': 'an XML document',
  'text/html': 'an HTML page',
  'image/svg+xml': 'an SVG image',
  'application/octet-stream': 'binary data of no type we accept',
  [PLAIN_TEXT]: 'plain text',
};

/** What a file name's extension claims, for the extensions whose claim we can check against the content. */
const typeByExtension: Readonly<Record<string, string>> = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  ods: 'application/vnd.oasis.opendocument.spreadsheet',
  csv: PLAIN_TEXT,
  tsv: PLAIN_TEXT,
  txt: PLAIN_TEXT,
};

const describe = (mime: string) => descriptions[mime] ?? mime;

// Markup a browser would render or run: the leading tags WHATWG MIME sniffing treats as HTML, plus SVG and XML.
const leadingMarkup = /^\s*<(?:!doctype\s+html|html|head|body|script|iframe|h1|div|font|table|a|style|title|b|br|p|!--)[\s>/]/i;
const embeddedMarkup = /<(?:script|iframe|html|body|object|embed)[\s>/]/i;
const svgMarkup = /<svg[\s>/]/i;

/**
 * Whether the bytes are text a person wrote: valid UTF-8 without NUL or other control characters (tab, line
 * feed, form feed and carriage return allowed).
 */
export function isPlainText(bytes: Buffer): boolean {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  return !/[\u0000-\u0008\u000B\u000E-\u001F\u007F]/.test(text);
}

/** The file's type decided by its content alone: file-type's signatures, then markup, then plain text. */
export async function sniffContent(bytes: Buffer): Promise<SniffedType> {
  const signature = await FileType.fromBuffer(bytes);
  // file-type calls any text opening with an XML declaration XML; SVG is one such.
  const text = (signature === undefined || signature.mime === 'application/xml') && isPlainText(bytes);
  const mime = text ? textType(bytes.toString('utf8')) : (signature?.mime ?? 'application/octet-stream');
  return { mime, description: describe(mime) };
}

/** Text a browser would treat as a page or an image is markup, not plain text. */
function textType(text: string): string {
  const head = text.replace(/^\uFEFF/, '').slice(0, 4096);
  if (svgMarkup.test(head)) return 'image/svg+xml';
  if (leadingMarkup.test(head) || embeddedMarkup.test(head)) return 'text/html';
  if (/^\s*<\?xml[\s?]/i.test(head)) return 'application/xml';
  return PLAIN_TEXT;
}

/**
 * The sender's file name as we store and show it: the last part of any path, without control, format or
 * text-direction characters (which can make "exe.pdf" read as something else), at most 200 characters.
 * "upload" when nothing is left.
 */
export function cleanFileName(raw: string): string {
  const lastPart = raw.split(/[/\\]/).pop() ?? '';
  const cleaned = lastPart
    .normalize('NFC')
    .replace(/[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]/gu, '')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/^\.+/, '');
  if (cleaned === '') return 'upload';
  if (cleaned.length <= 200) return cleaned;
  const extension = /\.[^.]{1,10}$/.exec(cleaned)?.[0] ?? '';
  return cleaned.slice(0, 200 - extension.length) + extension;
}

const megabytes = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** multer's refusals in the one error shape, in our words. */
function multerFault(error: MulterError, rules: UploadRules): HttpError {
  switch (error.code) {
    case 'LIMIT_FILE_SIZE':
      return new HttpError(413, 'file_too_large', `The file is larger than the limit of ${megabytes(rules.maxBytes)}`);
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return new HttpError(400, 'unexpected_file', `Send one file, in the multipart field "file" (got "${error.field ?? '?'}")`);
    case 'LIMIT_FIELD_KEY':
    case 'LIMIT_FIELD_VALUE':
    case 'LIMIT_FIELD_COUNT':
    case 'LIMIT_PART_COUNT':
      return new HttpError(400, 'unexpected_field', `Too many or too long form fields${error.field ? ` ("${error.field}")` : ''}`);
    default:
      return new HttpError(400, 'malformed_upload', `The upload could not be read: ${error.message}`);
  }
}

const uploads = new WeakMap<object, Upload>();

/**
 * Reads one file from the multipart field `file` into memory and checks it: 413 file_too_large over
 * `maxBytes`; 400 file_missing, file_empty, unexpected_file or unexpected_field; 415 unsupported_file_type
 * when the content is of a type the route does not accept, or file_type_mismatch when the name's extension
 * says one type and the content another. Read the result with `uploadOf(req)`.
 */
export function acceptUpload(rules: UploadRules): RequestHandler {
  const allowedFields = new Set(rules.fields ?? []);
  // multer's own types predate defParamCharset, which it passes on to busboy.
  const options: multer.Options & { defParamCharset: string } = {
    storage: multer.memoryStorage(),
    // Browsers send names in UTF-8 without saying so.
    defParamCharset: 'utf8',
    limits: {
      fileSize: rules.maxBytes,
      files: 1,
      fields: allowedFields.size,
      fieldSize: 1024,
      parts: allowedFields.size + 1,
      headerPairs: 50,
    },
  };
  const parse = multer(options).single('file');

  return (req, res, next) => {
    parse(req, res, (error?: unknown) => {
      if (error instanceof MulterError) return next(multerFault(error, rules));
      // Memory storage fails only while parsing: a body that is not well-formed multipart.
      if (error) {
        const reason = error instanceof Error ? ` (${error.message})` : '';
        return next(new HttpError(400, 'malformed_upload', `The upload is not well-formed multipart/form-data${reason}`));
      }
      checkUpload(req, rules, allowedFields).then(
        (upload) => {
          uploads.set(req, upload);
          next();
        },
        (fault: unknown) => next(fault),
      );
    });
  };
}

async function checkUpload(req: Request, rules: UploadRules, allowedFields: ReadonlySet<string>): Promise<Upload> {
  const file = req.file;
  if (!file) throw new HttpError(400, 'file_missing', 'Send the file as multipart/form-data in the field "file"');
  const unexpected = Object.keys((req.body ?? {}) as object).find((field) => !allowedFields.has(field));
  if (unexpected !== undefined) throw new HttpError(400, 'unexpected_field', `The form field "${unexpected}" is not expected here`);
  const name = cleanFileName(file.originalname);
  if (file.buffer.length === 0) throw new HttpError(400, 'file_empty', `${name} is empty`);
  const type = await sniffContent(file.buffer);
  if (!rules.accept.includes(type.mime)) {
    const accepted = rules.accept.map(describe).join(', ');
    throw new HttpError(415, 'unsupported_file_type', `${name} is ${type.description} by its content; accepted here: ${accepted}`, {
      sniffed: type.mime,
    });
  }
  const extension = /\.([^.]+)$/.exec(name)?.[1]?.toLowerCase();
  const claimed = extension === undefined ? undefined : typeByExtension[extension];
  if (claimed !== undefined && claimed !== type.mime) {
    throw new HttpError(
      415,
      'file_type_mismatch',
      `${name} is ${type.description} by its content, not what its name says (.${extension})`,
      {
        sniffed: type.mime,
      },
    );
  }
  return { bytes: file.buffer, name, type };
}

/** The file `acceptUpload` checked for this request. */
export function uploadOf(req: object): Upload {
  const upload = uploads.get(req);
  if (!upload) throw new Error('uploadOf called on a route without acceptUpload');
  return upload;
}
