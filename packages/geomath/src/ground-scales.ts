/**
 * Field grades for describing rock at the face: weathering and strength, on the ISRM scale (ISRM 1981,
 * Suggested Methods, "Rock characterization, testing and monitoring") or the ISO 14689 scale (ISO 14689:2017,
 * Geotechnical investigation and testing — Identification, description and classification of rock).
 * Both use the same strength bands in MPa; they differ in grade codes. One scale per project, no mixing.
 * Descriptions are short words of our own; bands [from memory] of the two documents.
 */
export type GroundScale = 'isrm' | 'iso-14689';

export interface GradeRow {
  code: string;
  term: string;
  /** Field hint in our own words */
  hint: string;
  /** UCS band for strength grades, MPa: lower bound inclusive, upper exclusive */
  ucsMPa?: readonly [number, number];
}

const WEATHERING_TERMS = [
  ['fresh', 'no visible sign of weathering'],
  ['slightly weathered', 'discoloured on joint surfaces'],
  ['moderately weathered', 'less than half decomposed to soil'],
  ['highly weathered', 'more than half decomposed to soil'],
  ['completely weathered', 'all decomposed to soil, fabric still visible'],
  ['residual soil', 'all converted to soil, fabric gone'],
] as const;

const STRENGTH_TERMS = [
  ['extremely weak', 'indented by thumbnail', [0.25, 1]],
  ['very weak', 'crumbles under firm hammer blows', [1, 5]],
  ['weak', 'shallow pits under firm hammer blows', [5, 25]],
  ['medium strong', 'cannot be scraped with a knife', [25, 50]],
  ['strong', 'needs more than one hammer blow to break', [50, 100]],
  ['very strong', 'needs many hammer blows to break', [100, 250]],
  ['extremely strong', 'only chipped by the hammer', [250, Infinity]],
] as const;

const ROMAN = ['I', 'II', 'III', 'IV', 'V', 'VI'];

export const WEATHERING_GRADES: Record<GroundScale, readonly GradeRow[]> = {
  isrm: WEATHERING_TERMS.map(([term, hint], i) => ({ code: `W${ROMAN[i]}`, term, hint })),
  'iso-14689': WEATHERING_TERMS.map(([term, hint], i) => ({ code: `${i}`, term, hint })),
};

export const STRENGTH_GRADES: Record<GroundScale, readonly GradeRow[]> = {
  isrm: STRENGTH_TERMS.map(([term, hint, ucs], i) => ({ code: `R${i}`, term, hint, ucsMPa: ucs })),
  'iso-14689': STRENGTH_TERMS.map(([term, hint, ucs]) => ({ code: term, term, hint, ucsMPa: ucs })),
};

/** True when `code` is a grade of the given scale and kind. */
export function isGrade(scale: GroundScale, kind: 'weathering' | 'strength', code: string): boolean {
  const rows = kind === 'weathering' ? WEATHERING_GRADES[scale] : STRENGTH_GRADES[scale];
  return rows.some((r) => r.code === code);
}
