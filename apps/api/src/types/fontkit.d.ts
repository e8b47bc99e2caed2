// The little of fontkit 2 (pdfkit's own font engine) that the PDF code uses; the package ships no types.
declare module 'fontkit' {
  export interface Font {
    hasGlyphForCodePoint(codePoint: number): boolean;
  }
  export function openSync(filename: string): Font;
}
