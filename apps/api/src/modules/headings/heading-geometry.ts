import { driveTrendAt, senseSign, stageGeometry, type HeadingGeometry, type Stage } from '@roundbook/domain';
import type { Heading } from './heading.entity.js';

/**
 * What the trigger rules and the assessment read of a heading, for one stage of its profile and, when
 * given, at one face chainage: the drive there is the tangent of the alignment (straights and arcs), the
 * chainage sense says which way chainage runs, and the stage's own part of the profile (top heading above
 * the bench line, bench below it) gives the crown, invert and walls of the crown-reach rule.
 */
export function headingGeometry(
  heading: Heading,
  stage: Stage,
  faceChainage?: number,
): HeadingGeometry & { plannedRoundLength: number } {
  let driveTrend = heading.driveTrend;
  if (faceChainage !== undefined) {
    try {
      driveTrend = driveTrendAt(heading, faceChainage);
    } catch {
      driveTrend = heading.initialBearing ?? heading.driveTrend;
    }
  }
  const part = stageGeometry(heading, stage);
  return {
    driveTrend,
    gradientPercent: heading.gradientPercent,
    profileHeight: heading.profileHeight,
    profileWidth: heading.profileWidth,
    axisHeight: heading.axisHeight,
    chainageSense: senseSign(heading.chainageSense),
    ...(part
      ? {
          stageCrownHeight: part.crownHeight,
          stageInvertDepth: part.invertDepth,
          stageHalfWidth: part.halfWidth,
        }
      : {}),
    plannedRoundLength: heading.plannedRoundLength,
  };
}
