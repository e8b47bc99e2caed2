import { openSync } from 'fontkit';

/**
 * Words for characters a font may lack (common practice: spell the symbol out rather than drop it). Open
 * Sans 1.10 has no arrows or check marks, so "Q < 20 → amber" would print as "Q < 20  amber" (stack-notes §9).
 */
export const GLYPH_FALLBACKS: Readonly<Record<string, string>> = {
  '→': '->',
  '←': '<-',
  '↔': '<->',
  '⇒': '=>',
  '↑': 'up',
  '↓': 'down',
  '≥': '>=',
  '≤': '<=',
  '≠': '!=',
  '≈': '~',
  '±': '+/-',
  '×': 'x',
  '−': '-',
  '–': '-',
  '—': '-',
  '‘': "'",
  '’': "'",
  '“': '"',
  '”': '"',
  '•': '-',
  '…': '...',
  '✓': 'yes',
  '✔': 'yes',
  '✗': 'no',
  '⚠': '!',
  '°': ' deg',
  '²': '^2',
  '³': '^3',
  '·': '.',
};

/** What stands for a character that neither the font nor the fallbacks can draw. */
export const MISSING_GLYPH = '?';

/**
 * Text the font can draw: each character it has is kept; one it lacks becomes its fallback words (when the
 * font has those), else its compatibility decomposition without marks (NFKD), else MISSING_GLYPH. Line
 * breaks and tabs are kept as they are (pdfkit lays them out itself).
 */
export function pdfSafeText(text: string, hasGlyph: (codePoint: number) => boolean): string {
  const drawable = (s: string) => [...s].every((c) => c === ' ' || hasGlyph(c.codePointAt(0)!));
  let out = '';
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (ch === '\n' || ch === '\r' || ch === '\t' || hasGlyph(cp)) {
      out += ch;
      continue;
    }
    const words = GLYPH_FALLBACKS[ch];
    if (words !== undefined && drawable(words)) {
      out += words;
      continue;
    }
    const plain = ch.normalize('NFKD').replace(/\p{M}/gu, '');
    out += plain && plain !== ch && drawable(plain) ? plain : MISSING_GLYPH;
  }
  return out;
}

/** A glyph check for the given TTF files together: a character is drawable when every one of them has it. */
export function glyphCheckOf(...fontFiles: string[]): (codePoint: number) => boolean {
  const fonts = fontFiles.map((f) => openSync(f));
  const known = new Map<number, boolean>();
  return (cp) => {
    let has = known.get(cp);
    if (has === undefined) {
      has = fonts.every((f) => f.hasGlyphForCodePoint(cp));
      known.set(cp, has);
    }
    return has;
  };
}
