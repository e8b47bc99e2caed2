import type { HeadingDto } from './dto/heading.dto.js';
import type { Heading } from './heading.entity.js';

export const HEADING_FIELDS = [
  'code',
  'name',
  'startChainage',
  'chainageStyle',
  'chainageDecimals',
  'driveTrend',
  'gradientPercent',
  'profileShape',
  'profileWidth',
  'profileHeight',
  'axisHeight',
  'stages',
  'plannedRoundLength',
  'startEasting',
  'startNorthing',
  'startElevation',
  'chainageSense',
  'initialBearing',
  'alignmentSegments',
  'benchHeight',
] as const satisfies ReadonlyArray<keyof Heading>;

export function toHeadingDto(h: Heading): HeadingDto {
  return {
    id: h.id,
    projectId: h.projectId,
    code: h.code,
    name: h.name,
    startChainage: h.startChainage,
    chainageStyle: h.chainageStyle,
    chainageDecimals: h.chainageDecimals,
    driveTrend: h.driveTrend,
    gradientPercent: h.gradientPercent,
    profileShape: h.profileShape,
    profileWidth: h.profileWidth,
    profileHeight: h.profileHeight,
    axisHeight: h.axisHeight,
    stages: h.stages,
    plannedRoundLength: h.plannedRoundLength,
    startEasting: h.startEasting,
    startNorthing: h.startNorthing,
    startElevation: h.startElevation,
    chainageSense: h.chainageSense ?? 'increasing',
    initialBearing: h.initialBearing ?? null,
    alignmentSegments: h.alignmentSegments ?? [],
    benchHeight: h.benchHeight ?? null,
    version: h.version,
  };
}
