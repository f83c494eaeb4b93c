import type { NextFunction, Request, Response } from 'express';
import type { FieldError } from '@meritline/shared';

export const MAX_JSON_DEPTH = 64;

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The path of a value from the keys that lead to it, built only for a refusal. */
const pathOf = (trail: readonly (string | number)[]) =>
  trail.reduce<string>((parent, key) => (typeof key === 'number' ? `${parent}[${key}]` : parent ? `${parent}.${key}` : key), '');

/**
 * Checks a parsed JSON body before any route sees it: no nesting beyond MAX_JSON_DEPTH, no number beyond the
 * range of a double, no unpaired UTF-16 surrogate (it cannot be stored as UTF-8, so what is read back would
 * differ from what was hashed). Strings are normalised to NFC so equal text is stored and hashed the same way.
 */
export function checkJsonBody(body: unknown): { value: unknown; error: FieldError | null } {
  let error: FieldError | null = null;
  const trail: (string | number)[] = [];
  const visit = (value: unknown, depth: number): unknown => {
    if (error) return value;
    if (typeof value === 'string') {
      if (LONE_SURROGATE.test(value)) {
        error = {
          field: pathOf(trail) || 'body',
          code: 'unpairedSurrogate',
          message: 'The text contains an invalid character (an unpaired UTF-16 surrogate).',
        };
        return value;
      }
      return value.normalize('NFC');
    }
    if (typeof value === 'number') {
      if (!Number.isFinite(value))
        error = { field: pathOf(trail) || 'body', code: 'numberOutOfRange', message: 'The number is too large to be represented.' };
      return value;
    }
    if (value === null || typeof value !== 'object') return value;
    if (depth >= MAX_JSON_DEPTH) {
      error = {
        field: pathOf(trail) || 'body',
        code: 'tooDeep',
        message: `The request nests objects or lists more than ${MAX_JSON_DEPTH} levels deep.`,
      };
      return value;
    }
    if (Array.isArray(value)) {
      for (let i = 0; i < value.length && !error; i++) {
        trail.push(i);
        value[i] = visit(value[i], depth + 1);
        trail.pop();
      }
      return value;
    }
    const record = value as Record<string, unknown>;
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(record)) {
      if (error) break;
      trail.push(key);
      const name = visit(key, depth + 1) as string;
      trail[trail.length - 1] = name;
      out[name] = visit(record[key], depth + 1);
      trail.pop();
    }
    return out;
  };
  const value = visit(body, 0);
  return { value, error };
}

export function jsonBodyGuard(req: Request, res: Response, next: NextFunction): void {
  if (req.body === undefined || req.body === null || typeof req.body !== 'object') return next();
  const { value, error } = checkJsonBody(req.body);
  if (error) {
    res.status(422).json({ statusCode: 422, message: 'The request has invalid fields.', errors: [error] });
    return;
  }
  req.body = value;
  next();
}

type BodyError = Error & { status?: number; type?: string; code?: string; charset?: string; limit?: number };

/** The body parser's refusals in words a caller can act on. */
export function bodyErrorMessage(error: BodyError): string {
  if (error.type === 'entity.parse.failed') return `The request body is not valid JSON: ${error.message}`;
  if (error.type === 'charset.unsupported') return `Send the body as UTF-8 JSON; the charset "${error.charset ?? ''}" is not read.`;
  if (error.type === 'entity.too.large')
    return `The request body is larger than the ${Math.round((error.limit ?? 0) / 1_048_576)} MB allowed.`;
  // zlib's own words ("incorrect header check") do not say that the body is not what its Content-Encoding declares.
  if (error.code?.startsWith('Z_')) return `The request body cannot be decompressed as its Content-Encoding declares (${error.message}).`;
  return error.message;
}

/**
 * Refusals of the body parser, in the one error body. They happen before any route is chosen, where the
 * app's exception filter is not reached (Nest would answer with the parser's bare words).
 */
export function bodyParserErrors(error: BodyError, _req: Request, res: Response, next: NextFunction): void {
  const status = error?.status;
  if (typeof status !== 'number' || status < 400 || status >= 500) return next(error);
  res.status(status).json({ statusCode: status, message: bodyErrorMessage(error) });
}
