import type { HeadingGeometry, Stage } from '@roundbook/domain';
import type { Heading } from './heading.entity.js';

/** What the trigger rules and the assessment read of a heading, for one stage of its profile. */
export function headingGeometry(
  heading: Heading,
  _stage: Stage,
): HeadingGeometry & { plannedRoundLength: number } {
  return {
    driveTrend: heading.driveTrend,
    gradientPercent: heading.gradientPercent,
    profileHeight: heading.profileHeight,
    profileWidth: heading.profileWidth,
    axisHeight: heading.axisHeight,
    plannedRoundLength: heading.plannedRoundLength,
  };
}
