// Guards on request bodies that run before anything heavy: the nesting depth is read from the raw bytes
// (one pass, no parse), and text is checked for lone UTF-16 surrogates (which no column or e-mail check can
// take). Both refuse with a clear 400 instead of a stack overflow or a database error.

/** Deepest nesting of objects and arrays in a JSON text, counted without parsing (strings skipped). */
export function jsonDepth(text: string): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      depth++;
      if (depth > deepest) deepest = depth;
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return deepest;
}

/** The deepest nesting a request body may have (Roundbook's deepest DTO is about 6 levels). */
export const MAX_JSON_DEPTH = 32;

/** A body-parser `verify` hook: refuses a body nested deeper than MAX_JSON_DEPTH before it is parsed. */
export function verifyJsonDepth(_req: unknown, _res: unknown, buf: Buffer): void {
  if (buf.length > 2 * MAX_JSON_DEPTH && jsonDepth(buf.toString('utf8')) > MAX_JSON_DEPTH) {
    throw Object.assign(new Error('request body nested too deeply'), {
      type: 'entity.too.deep',
      status: 400,
    });
  }
}

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The path of the first string (or key) in `value` with a lone surrogate, or null. */
export function loneSurrogatePath(value: unknown, at = ''): string | null {
  if (typeof value === 'string') return LONE_SURROGATE.test(value) ? at || '(body)' : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = loneSurrogatePath(value[i], `${at}[${i}]`);
      if (found !== null) return found;
    }
    return null;
  }
  if (value !== null && typeof value === 'object') {
    for (const [key, v] of Object.entries(value)) {
      const here = at ? `${at}.${key}` : key;
      if (LONE_SURROGATE.test(key)) return here;
      const found = loneSurrogatePath(v, here);
      if (found !== null) return found;
    }
  }
  return null;
}
