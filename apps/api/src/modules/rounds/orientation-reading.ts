import { parsePlane, type PlaneNotation } from '@roundbook/geomath';

const message = (e: unknown): string => (e instanceof Error ? e.message : String(e));

/** The canonical dip direction / dip of a typed orientation (to 0.01°), or why it cannot be read. */
export function readOrientation(
  text: string,
  notation: PlaneNotation,
): { dipDirection: number; dip: number } | { error: string } {
  if (!text.trim()) return { error: 'No orientation entered yet.' };
  try {
    const plane = parsePlane(text, { notation });
    return {
      dipDirection: Math.round(plane.dipDirection * 100) / 100,
      dip: Math.round(plane.dip * 100) / 100,
    };
  } catch (e) {
    return { error: message(e) };
  }
}
