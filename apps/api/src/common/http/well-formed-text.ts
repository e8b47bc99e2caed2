/** The answer to a body whose text holds a lone UTF-16 surrogate (which MariaDB's utf8mb4 cannot store). */
export const LONE_SURROGATE_MESSAGE =
  'The request holds text with a broken character (a lone UTF-16 surrogate). Retype or paste the text again.';

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True when the text holds a high surrogate without its low half, or a low one without its high half. */
export const hasLoneSurrogate = (text: string): boolean => LONE_SURROGATE.test(text);

/** A JSON.parse reviver that refuses lone surrogates in keys and string values, as the body is parsed. */
export function wellFormedTextReviver(this: unknown, key: string, value: unknown): unknown {
  if (hasLoneSurrogate(key) || (typeof value === 'string' && hasLoneSurrogate(value)))
    throw new SyntaxError(LONE_SURROGATE_MESSAGE);
  return value;
}
