import type { DataSource } from 'typeorm';
import { Heading } from '../modules/headings/heading.entity.js';

/**
 * An invented straight heading of the demo project for a benchmark's own rounds: east-bound from 1+000, level,
 * a 5 m circular profile, full face only, 3 m rounds. `prefix` keeps each run's code apart from the others.
 */
export function benchHeading(
  ds: DataSource,
  projectId: string,
  prefix: string,
  name: string,
): Promise<Heading> {
  return ds.getRepository(Heading).save({
    projectId,
    code: `${prefix}${Date.now() % 1e6}`,
    name,
    startChainage: 1000,
    chainageStyle: 'km+m',
    chainageDecimals: 1,
    driveTrend: 90,
    gradientPercent: 0,
    profileShape: 'circular',
    profileWidth: 5,
    profileHeight: 5,
    axisHeight: 2.5,
    stages: ['full-face'],
    plannedRoundLength: 3,
    startEasting: null,
    startNorthing: null,
    startElevation: null,
  });
}
