// The ground description at the face: grades of the project's scale, unit shares, and the point-load check.
import { isGrade, STRENGTH_GRADES, WEATHERING_GRADES, type GroundScale } from '@roundbook/geomath';

export interface GroundUnitRecord {
  name: string;
  sharePercent: number;
  weatheringGrade: string | null;
  strengthGrade: string | null;
}

/** Unit shares are whole faces: they must sum to 100 % within this tolerance (rounding of typed shares). */
export const SHARE_TOLERANCE = 0.5;

const codes = (rows: ReadonlyArray<{ code: string }>): string => rows.map((r) => r.code).join(', ');

/**
 * Field errors of a ground description (refusals): grades that are not codes of the project's scale, and
 * unit shares that do not sum to 100 %. Keys are field paths such as `ground.units.0.weatheringGrade`.
 */
export function groundErrors(
  ground: { units: GroundUnitRecord[] },
  scale: GroundScale = 'isrm',
): Record<string, string> {
  const fields: Record<string, string> = {};
  ground.units.forEach((u, i) => {
    if (
      u.weatheringGrade !== null &&
      u.weatheringGrade !== '' &&
      !isGrade(scale, 'weathering', u.weatheringGrade)
    )
      fields[`ground.units.${i}.weatheringGrade`] =
        `“${u.weatheringGrade}” is not a weathering grade of the project's scale: use one of ${codes(WEATHERING_GRADES[scale])}.`;
    if (u.strengthGrade !== null && u.strengthGrade !== '' && !isGrade(scale, 'strength', u.strengthGrade))
      fields[`ground.units.${i}.strengthGrade`] =
        `“${u.strengthGrade}” is not a strength grade of the project's scale: use one of ${codes(STRENGTH_GRADES[scale])}.`;
  });
  if (ground.units.length > 0) {
    const total = ground.units.reduce((s, u) => s + u.sharePercent, 0);
    if (Math.abs(total - 100) > SHARE_TOLERANCE)
      fields['ground.units'] =
        `The shares of the face add up to ${Math.round(total * 10) / 10} %; they must make 100 %.`;
  }
  return fields;
}

/**
 * A warning when the strength estimated from the point load (UCS ≈ factor × Is50; Broch & Franklin 1972,
 * factor about 20–25 — from memory) falls outside the UCS band of every graded unit's strength grade.
 */
export function pointLoadWarning(
  ground: { units: GroundUnitRecord[]; pointLoadIs50: number | null; pointLoadFactor: number | null },
  scale: GroundScale = 'isrm',
): string | null {
  if (ground.pointLoadIs50 === null || ground.pointLoadFactor === null) return null;
  const ucs = ground.pointLoadIs50 * ground.pointLoadFactor;
  const graded = ground.units
    .map((u) => STRENGTH_GRADES[scale].find((r) => r.code === u.strengthGrade))
    .filter((r): r is NonNullable<typeof r> => r !== undefined && r.ucsMPa !== undefined);
  if (graded.length === 0) return null;
  const fits = graded.some((r) => ucs >= r.ucsMPa![0] && ucs < r.ucsMPa![1]);
  if (fits) return null;
  const shown = Math.round(ucs * 10) / 10;
  const bands = graded
    .map((r) => `${r.code} (${r.ucsMPa![0]}–${r.ucsMPa![1] === Infinity ? '' : r.ucsMPa![1]} MPa)`)
    .join(', ');
  return `The point load gives UCS ≈ ${ground.pointLoadFactor} × ${ground.pointLoadIs50} = ${shown} MPa, outside the strength grade recorded: ${bands}. Check the grade, Is50 or the factor.`;
}
