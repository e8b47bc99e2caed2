import { assessedHeading, type HeadingGeometry, type Stage } from '@roundbook/domain';
import type { Heading } from './heading.entity.js';

/**
 * What the trigger rules and the assessment read of a heading, for one stage of its profile and, when
 * given, at one face chainage — the domain's `assessedHeading`, the same one the browser runs.
 */
export function headingGeometry(
  heading: Heading,
  stage: Stage,
  faceChainage?: number,
): HeadingGeometry & { plannedRoundLength: number } {
  return assessedHeading(heading, stage, faceChainage);
}
