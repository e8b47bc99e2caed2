import type { ProjectRole } from '../../common/auth/auth-user.js';
import type { HeadingProgress } from '../../common/ports/heading-progress.port.js';
import type { Heading } from '../headings/heading.entity.js';
import type { HeadingSummaryDto, ProjectSummaryDto } from './dto/project.dto.js';
import type { Project } from './project.entity.js';

export type { HeadingProgress };

const NO_PROGRESS: HeadingProgress = {
  faceChainage: null,
  draftFaceChainage: null,
  lastRoundAt: null,
  roundsToConfirm: 0,
  triggerLevel: null,
};

export function toHeadingSummary(h: Heading, progress: HeadingProgress = NO_PROGRESS): HeadingSummaryDto {
  return {
    id: h.id,
    code: h.code,
    name: h.name,
    driveTrend: h.driveTrend,
    gradientPercent: h.gradientPercent,
    startChainage: h.startChainage,
    chainageStyle: h.chainageStyle,
    chainageDecimals: h.chainageDecimals,
    stages: h.stages,
    profileShape: h.profileShape,
    profileWidth: h.profileWidth,
    profileHeight: h.profileHeight,
    plannedRoundLength: h.plannedRoundLength,
    ...progress,
    lastHandover: progress.lastHandover ?? null,
    confirmedClass: progress.confirmedClass ?? null,
    supportOutstanding: progress.supportOutstanding ?? false,
  };
}

export function toProjectSummary(
  p: Project,
  role: ProjectRole,
  progress: ReadonlyMap<string, HeadingProgress> = new Map(),
): ProjectSummaryDto {
  return {
    id: p.id,
    code: p.code,
    name: p.name,
    client: p.client,
    timeZone: p.timeZone,
    qTableEdition: p.qTableEdition,
    defaultNotation: p.defaultNotation,
    groundScale: p.groundScale,
    distributionList: p.distributionList ?? [],
    coordinateGrid: p.coordinateGrid,
    handoverAckMinutes: p.handoverAckMinutes,
    separationOfDuties: p.separationOfDuties,
    role,
    version: p.version,
    headings: [...(p.headings ?? [])]
      .sort((a, b) => a.code.localeCompare(b.code))
      .map((h) => toHeadingSummary(h, progress.get(h.id))),
  };
}
