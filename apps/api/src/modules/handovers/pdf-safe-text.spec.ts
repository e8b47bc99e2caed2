import { glyphCheckOf, MISSING_GLYPH, pdfSafeText } from './pdf-safe-text';

const FONTS = [
  require.resolve('@expo-google-fonts/open-sans/400Regular/OpenSans_400Regular.ttf'),
  require.resolve('@expo-google-fonts/open-sans/700Bold/OpenSans_700Bold.ttf'),
];

describe('pdfSafeText (characters the embedded font cannot draw)', () => {
  const sut = (s: string) => pdfSafeText(s, glyphCheckOf(...FONTS));

  it('spells out the arrow of a trigger rule summary, which Open Sans lacks', () => {
    expect(sut('Q < 20 → amber')).toBe('Q < 20 -> amber');
    expect(sut('left ← right ↔ both')).toBe('left <- right <-> both');
  });

  it('keeps what Open Sans has: degrees, dashes, curly quotes, ≥, ², accented letters', () => {
    const kept = '055/70° — 1+004.0 – 1+006.0 ‘wedge’ ≥ 3 m² č ł ő';
    expect(sut(kept)).toBe(kept);
  });

  it('keeps line breaks and tabs, and marks a character with no glyph and no fallback', () => {
    expect(sut('a\nb\tc')).toBe('a\nb\tc');
    expect(sut('water 💧 here')).toBe(`water ${MISSING_GLYPH} here`);
    expect(sut('✓ done ⚠')).toBe('yes done !');
  });

  it('uses the fallback only where the font lacks the glyph (a font without ≥ gets ">=")', () => {
    const noGe = (cp: number) => cp !== 0x2265 && cp < 0x2000;
    expect(pdfSafeText('RMR ≥ 40', noGe)).toBe('RMR >= 40');
    // A compatibility character decomposes to letters the font has (ﬁ ligature → "fi").
    expect(pdfSafeText('ﬁssure', noGe)).toBe('fissure');
  });
});
