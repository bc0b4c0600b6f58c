import express, { type RequestHandler } from 'express';
import { HttpError } from '../http-error';
import { isReadMethod } from './require-user';

/**
 * How deep a JSON body may nest. The deepest body the API takes (a row with its value inside a list) nests a
 * handful of levels; anything near this is an attack on the parser, not data.
 */
export const MAX_JSON_DEPTH = 32;

/**
 * The largest JSON body of each kind of route. Every mount in server/app.ts names one: `auth` (sign-in and
 * sign-out take next to nothing), `small` (names, settings, tokens, invitations), `sheet` (rows and whole sheets).
 */
export const jsonBodyLimits = { auth: '4kb', small: '64kb', sheet: '1mb' } as const;
export type JsonBodyLimit = keyof typeof jsonBodyLimits;

const OPEN_SQUARE = 0x5b;
const OPEN_CURLY = 0x7b;
const CLOSE_SQUARE = 0x5d;
const CLOSE_CURLY = 0x7d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;

/**
 * Refuses a body nested deeper than MAX_JSON_DEPTH before anything parses it: one pass over the bytes, stopping
 * at the first level too deep (an ASCII bracket or quote never occurs inside a UTF-8 sequence of another character).
 */
function refuseDeepNesting(_req: unknown, _res: unknown, body: Buffer): void {
  let depth = 0;
  let inString = false;
  for (let index = 0; index < body.length; index += 1) {
    const byte = body[index];
    if (inString) {
      if (byte === BACKSLASH) index += 1;
      else if (byte === QUOTE) inString = false;
    } else if (byte === QUOTE) inString = true;
    else if (byte === OPEN_SQUARE || byte === OPEN_CURLY) {
      depth += 1;
      if (depth > MAX_JSON_DEPTH) {
        throw new HttpError(400, 'too_deep', `The request body nests deeper than ${MAX_JSON_DEPTH} levels (at byte ${index})`, {
          maxDepth: MAX_JSON_DEPTH,
          at: index,
        });
      }
    } else if (byte === CLOSE_SQUARE || byte === CLOSE_CURLY) depth -= 1;
  }
}

/**
 * Parses a JSON body of up to the named size and MAX_JSON_DEPTH levels (413 too_large, 400 too_deep, 400
 * invalid_json); reads never have one. Mount it after sign-in is checked, so that nobody's body is read before
 * we know who sent it. Other media types (multipart uploads, which their routes read with multer) pass untouched.
 */
export function jsonBody(limit: JsonBodyLimit): RequestHandler {
  const parse = express.json({ limit: jsonBodyLimits[limit], verify: refuseDeepNesting });
  return (req, res, next) => (isReadMethod(req.method) ? next() : parse(req, res, next));
}
