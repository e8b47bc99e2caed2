import { Inject, Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  faceFrameOf,
  formatChainageFor,
  restoreSketch,
  SketchError,
  sketchToSvg,
  traceColourBySet,
  type SketchDocument,
} from '@roundbook/domain';
import sharp from 'sharp';
import { DataSource, type EntityManager } from 'typeorm';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { JobHandlers, PermanentJobError } from '../../infrastructure/jobs/job-handlers.js';
import { JobsService } from '../../infrastructure/jobs/jobs.service.js';
import {
  StorageNotFoundError,
  StorageService,
  StorageUnavailableError,
} from '../../infrastructure/storage/storage.service.js';
import { Heading } from '../headings/heading.entity.js';
import { Photo } from '../photos/photo.entity.js';
import type { SketchRenderDto } from './dto/sketch-render.dto.js';
import { RoundRevision } from './round-revision.entity.js';
import { Round } from './round.entity.js';

export const SKETCH_RENDER_JOB = 'sketch.render';
/** Pixels per metre of the stored picture: a 10 m face comes out about 780 px wide. */
export const SKETCH_RENDER_PX_PER_M = 60;
const URL_TTL_SECONDS = 300;

/** Where the picture of a revision's sketch is kept. */
export const sketchRenderKey = (projectId: string, roundId: string, revision: number, ext: 'png' | 'svg') =>
  `projects/${projectId}/rounds/${roundId}/sketch/revision-${revision}.${ext}`;

const sketchOf = (record: Record<string, unknown>): SketchDocument | null => {
  if (record.sketch === null || record.sketch === undefined) return null;
  return restoreSketch(record.sketch);
};

/**
 * The sketch as a picture for reports, handovers and e-mail: at submit a job renders the frozen revision's
 * document to SVG (packages/domain sketchToSvg) and PNG (sharp) into object storage; members get signed
 * addresses of the last submitted one.
 */
@Injectable()
export class SketchRenders implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(JobsService) private readonly jobs: JobsService,
  ) {}

  onModuleInit(): void {
    this.handlers.register(SKETCH_RENDER_JOB, (payload) => this.render(String(payload.revisionId)));
  }

  /** Asks for the picture of a revision just frozen, inside the transaction that froze it. */
  async enqueue(manager: EntityManager, revisionId: string): Promise<void> {
    await this.jobs.enqueue(manager, {
      kind: SKETCH_RENDER_JOB,
      payload: { revisionId },
      dedupeKey: `${SKETCH_RENDER_JOB}:${revisionId}`,
    });
  }

  async render(revisionId: string): Promise<void> {
    const revision = await this.dataSource
      .getRepository(RoundRevision)
      .findOne({ where: { id: revisionId } });
    if (!revision) return;
    const round = await this.dataSource.getRepository(Round).findOne({ where: { id: revision.roundId } });
    if (!round) return;
    const heading = await this.dataSource.getRepository(Heading).findOne({ where: { id: round.headingId } });
    if (!heading) throw new PermanentJobError(`The heading of round ${round.id} is gone.`);
    let doc: SketchDocument | null;
    try {
      doc = sketchOf(revision.record);
    } catch (e) {
      if (e instanceof SketchError) throw new PermanentJobError(e.message);
      throw e;
    }
    if (doc === null) return;
    const stage = typeof revision.record.stage === 'string' ? revision.record.stage : round.stage;
    const frame = faceFrameOf(heading, stage as Round['stage']);
    if (frame === null) throw new PermanentJobError(`The profile of heading ${heading.id} cannot be drawn.`);
    const chainage = Number(revision.record.faceChainage ?? round.faceChainage);
    // The photos' pins as they are now (a photo keeps its own pin), numbered as in the gallery: every stored
    // photo of the round, oldest first (photos.service list).
    const photos = await this.dataSource.getRepository(Photo).find({
      where: { roundId: round.id, uploadState: 'stored' },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
    const pins = photos.flatMap((p, i) =>
      p.pinX !== null && p.pinY !== null ? [{ number: i + 1, at: [p.pinX, p.pinY] as [number, number] }] : [],
    );
    const svg = sketchToSvg(doc, frame, {
      pxPerMetre: SKETCH_RENDER_PX_PER_M,
      pins,
      traceColour: traceColourBySet(
        (revision.assessment?.sets?.sets ?? []).map((x) => x.label),
        Array.isArray(revision.record.joints)
          ? (revision.record.joints as { id: string; setLabel?: string | null }[])
          : [],
      ),
      title: `${heading.name} · face at ${formatChainageFor(chainage, heading)} · looking in the drive direction`,
    });
    const png = await sharp(Buffer.from(svg)).png().toBuffer();
    const key = (ext: 'png' | 'svg') => sketchRenderKey(round.projectId, round.id, revision.revision, ext);
    await this.storage.put(key('svg'), Buffer.from(svg), 'image/svg+xml');
    await this.storage.put(key('png'), png, 'image/png');
  }

  /** Signed addresses of the picture of the last submitted sketch; 404 when no submit had a sketch. */
  async url(access: ProjectAccess, roundId: string): Promise<SketchRenderDto> {
    const round = await this.dataSource
      .getRepository(Round)
      .findOne({ where: { id: roundId, projectId: access.projectId } });
    if (!round) throw DomainException.notFound('The round');
    const submits = await this.dataSource.getRepository(RoundRevision).find({
      where: { roundId, event: 'submit' },
      order: { revision: 'DESC' },
    });
    const last = submits.find((r) => (sketchOf(r.record)?.elements.length ?? 0) > 0);
    if (!last) throw DomainException.notFound('A submitted sketch of this round');
    const png = sketchRenderKey(round.projectId, roundId, last.revision, 'png');
    const svg = sketchRenderKey(round.projectId, roundId, last.revision, 'svg');
    try {
      await this.storage.stat(png);
      const [pngUrl, svgUrl] = await Promise.all([
        this.storage.signedGetUrl(png, URL_TTL_SECONDS),
        this.storage.signedGetUrl(svg, URL_TTL_SECONDS),
      ]);
      return {
        revision: last.revision,
        state: 'ready',
        pngUrl,
        svgUrl,
        expiresAt: new Date(Date.now() + URL_TTL_SECONDS * 1000).toISOString(),
      };
    } catch (e) {
      if (e instanceof StorageNotFoundError)
        return { revision: last.revision, state: 'rendering', pngUrl: null, svgUrl: null, expiresAt: null };
      if (e instanceof StorageUnavailableError)
        throw new DomainException(
          ErrorCode.ServiceUnavailable,
          'The sketch picture cannot be reached right now; try again in a minute.',
        );
      throw e;
    }
  }
}
