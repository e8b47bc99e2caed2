import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { alignmentErrors } from '@roundbook/domain';
import { DataSource, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { definedOnly } from '../../common/dto/defined-only.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { ROUNDS_READ, type RoundsReadPort } from '../../common/ports/rounds-read.port.js';
import { auditDiff, auditSnapshot } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import type { CreateHeadingDto, HeadingDto, UpdateHeadingDto } from './dto/heading.dto.js';
import { Heading } from './heading.entity.js';
import { HEADING_FIELDS, toHeadingDto } from './headings.mapper.js';

/** Fields that change how a heading's rounds are judged against the drive and the profile. */
const GEOMETRY_FIELDS = [
  'driveTrend',
  'gradientPercent',
  'profileShape',
  'profileWidth',
  'profileHeight',
  'axisHeight',
  'chainageSense',
  'initialBearing',
  'alignmentSegments',
  'benchHeight',
] as const;
const GEOMETRY_WORDS: Record<(typeof GEOMETRY_FIELDS)[number], string> = {
  driveTrend: 'drive direction',
  gradientPercent: 'gradient',
  profileShape: 'profile shape',
  profileWidth: 'width',
  profileHeight: 'height',
  axisHeight: 'axis height',
  chainageSense: 'chainage sense',
  initialBearing: 'initial bearing',
  alignmentSegments: 'alignment',
  benchHeight: 'bench line',
};

/** Checks that involve more than one field; messages land on the field they concern. */
function crossFieldErrors(
  h: Pick<Heading, 'profileShape' | 'profileWidth' | 'profileHeight' | 'axisHeight'> &
    Partial<Pick<Heading, 'alignmentSegments' | 'benchHeight' | 'stages'>>,
): Record<string, string> {
  const fields: Record<string, string> = { ...alignmentErrors(h) };
  if (h.benchHeight !== null && h.benchHeight !== undefined && h.benchHeight >= h.profileHeight)
    fields.benchHeight = `The bench line (${h.benchHeight} m) must lie below the crown (${h.profileHeight} m above the invert).`;
  if (h.axisHeight > h.profileHeight)
    fields.axisHeight = `The axis (${h.axisHeight} m) must lie within the height (${h.profileHeight} m).`;
  if (h.profileShape === 'circular' && Math.abs(h.profileWidth - h.profileHeight) > 0.005) {
    fields.profileHeight = 'A circular profile has equal width and height.';
  }
  return fields;
}

@Injectable()
export class HeadingsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(ROUNDS_READ) private readonly rounds: RoundsReadPort,
  ) {}

  async list(access: ProjectAccess): Promise<HeadingDto[]> {
    const headings = await this.dataSource
      .getRepository(Heading)
      .find({ where: { projectId: access.projectId }, order: { code: 'ASC' } });
    return headings.map(toHeadingDto);
  }

  /** The heading entity for another module (rounds), optionally locked in the caller's transaction. */
  async findForProject(
    projectId: string,
    headingId: string,
    manager: EntityManager = this.dataSource.manager,
    lock = false,
  ): Promise<Heading | null> {
    return manager.findOne(Heading, {
      where: { id: headingId, projectId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
  }

  async get(access: ProjectAccess, headingId: string): Promise<HeadingDto> {
    return toHeadingDto(await this.find(this.dataSource.manager, access, headingId));
  }

  async create(caller: AuthUser, access: ProjectAccess, dto: CreateHeadingDto): Promise<HeadingDto> {
    const draft = {
      chainageStyle: 'km+m' as const,
      chainageDecimals: 1,
      startEasting: null,
      startNorthing: null,
      startElevation: null,
      chainageSense: 'increasing' as const,
      initialBearing: null,
      alignmentSegments: [],
      benchHeight: null,
      ...definedOnly(dto),
    } as CreateHeadingDto & Required<Pick<Heading, 'chainageStyle' | 'chainageDecimals'>>;
    const errors = crossFieldErrors(draft);
    if (Object.keys(errors).length)
      throw new DomainException(ErrorCode.ValidationFailed, Object.values(errors)[0], errors);
    return this.dataSource.transaction(async (manager) => {
      await this.assertCodeFree(manager, access.projectId, dto.code);
      const heading = await manager.save(manager.create(Heading, { ...draft, projectId: access.projectId }));
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'heading',
        entityId: heading.id,
        action: 'create',
        after: auditSnapshot(heading, HEADING_FIELDS),
      });
      return toHeadingDto(heading);
    });
  }

  async update(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: UpdateHeadingDto,
  ): Promise<HeadingDto> {
    return this.dataSource.transaction(async (manager) => {
      const heading = await this.find(manager, access, headingId, true);
      if (heading.version !== dto.version) {
        throw new DomainException(
          ErrorCode.StaleVersion,
          'Someone else changed this heading since you opened it. Review their version, then apply your change again.',
          undefined,
          { current: toHeadingDto(heading) },
        );
      }
      // Segments compared in one shape (a straight has radius and side null), so an unchanged list is unchanged.
      // (none stored and an empty list are the same straight alignment)
      const segments = (list: Heading['alignmentSegments'] | undefined) =>
        (list ?? []).map((x) => ({ length: x.length, radius: x.radius ?? null, side: x.side ?? null }));
      heading.alignmentSegments = segments(heading.alignmentSegments);
      const before = { ...heading };
      const { version: _v, confirmRecompute: _c, ...changes } = definedOnly(dto);
      Object.assign(heading, changes);
      if (changes.alignmentSegments !== undefined)
        heading.alignmentSegments = segments(changes.alignmentSegments);
      const errors = crossFieldErrors(heading);
      if (Object.keys(errors).length)
        throw new DomainException(ErrorCode.ValidationFailed, Object.values(errors)[0], errors);
      if (changes.code && changes.code !== before.code)
        await this.assertCodeFree(manager, access.projectId, changes.code);
      const diff = auditDiff(before, heading, HEADING_FIELDS);
      if (!diff) return toHeadingDto(before);
      const geometry = GEOMETRY_FIELDS.filter((f) => f in diff.after);
      if (geometry.length && !dto.confirmRecompute) {
        const rounds = await this.rounds.countForHeading(headingId);
        if (rounds > 0) {
          throw new DomainException(
            ErrorCode.NeedsConfirmation,
            `${rounds} round(s) are recorded on ${before.code}. Changing its ${geometry.map((f) => GEOMETRY_WORDS[f]).join(', ')} changes how ` +
              'their joints are judged against the drive (orientation assessment, kinematic screens, look-ahead crossings), which are ' +
              'worked out again from the new values. Ratings already entered are not changed. Confirm to apply.',
            undefined,
            { rounds, fields: geometry },
          );
        }
      }
      const saved = await manager.save(heading);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'heading',
        entityId: heading.id,
        action: 'update',
        ...diff,
      });
      return toHeadingDto(saved);
    });
  }

  private async find(
    manager: EntityManager,
    access: ProjectAccess,
    headingId: string,
    lock = false,
  ): Promise<Heading> {
    const heading = await manager.findOne(Heading, {
      where: { id: headingId, projectId: access.projectId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!heading) throw DomainException.notFound('The heading');
    return heading;
  }

  private async assertCodeFree(manager: EntityManager, projectId: string, code: string): Promise<void> {
    if (await manager.exists(Heading, { where: { projectId, code } })) {
      throw new DomainException(
        ErrorCode.Conflict,
        `A heading with code ${code} already exists in this project.`,
        {
          code: 'This code is already used by another heading.',
        },
      );
    }
  }
}
