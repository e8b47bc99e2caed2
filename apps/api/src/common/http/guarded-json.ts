import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { json } from 'express';
import { wellFormedTextReviver } from './well-formed-text.js';

/** Deepest nesting of arrays and objects a request body may have (a round with Q/RMR inputs needs about 6). */
export const MAX_JSON_DEPTH = 32;

/** Size limits by route: small for anonymous routes, larger for round saves (500 joints), moderate elsewhere. */
export const BODY_LIMITS = { public: '16kb', round: '1mb', default: '256kb' } as const;

const PUBLIC_PATH = /^\/api\/(auth|invitations)(\/|$)/;
const ROUND_SAVE = /^\/api\/projects\/[^/]+\/(rounds\/[^/]+|headings\/[^/]+\/rounds)\/?$/;

export function bodyLimitOf(method: string, path: string): keyof typeof BODY_LIMITS {
  if (PUBLIC_PATH.test(path)) return 'public';
  if ((method === 'PUT' || method === 'POST') && ROUND_SAVE.test(path)) return 'round';
  return 'default';
}

/**
 * Nesting depth of a JSON text, found by one pass over the raw bytes (strings skipped), without parsing.
 * Stops counting as soon as `max` is passed.
 */
export function jsonDepthExceeds(buf: Buffer, max: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i];
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped byte
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      if (++depth > max) return true;
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return false;
}

/** An error body-parser passes on with its status; the global filter turns it into 400. */
export class JsonTooDeepError extends Error {
  readonly status = 400;
  readonly statusCode = 400;
  readonly type = 'entity.too.deep';
  readonly expose = true;
  constructor(readonly max: number) {
    super(`The request body is nested deeper than ${max} levels.`);
  }
}

/**
 * JSON body parsing with a size limit per route and a depth limit checked on the raw bytes before
 * JSON.parse, so refused bodies never reach the class transformer or the validator.
 */
export function guardedJson(maxDepth = MAX_JSON_DEPTH): RequestHandler {
  const verify = (_req: unknown, _res: unknown, buf: Buffer): void => {
    if (jsonDepthExceeds(buf, maxDepth)) throw new JsonTooDeepError(maxDepth);
  };
  type Handler = (req: Request, res: Response, next: NextFunction) => void;
  const parsers: Record<keyof typeof BODY_LIMITS, Handler> = {
    public: json({ limit: BODY_LIMITS.public, verify, reviver: wellFormedTextReviver }),
    round: json({ limit: BODY_LIMITS.round, verify, reviver: wellFormedTextReviver }),
    default: json({ limit: BODY_LIMITS.default, verify, reviver: wellFormedTextReviver }),
  };
  // Named `jsonParser` so Nest sees a JSON parser in place and does not add its default one.
  const jsonParser = (req: Request, res: Response, next: NextFunction): void =>
    parsers[bodyLimitOf(req.method, req.path)](req, res, next);
  return jsonParser;
}
