import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { LEVEL_RANK } from '@roundbook/domain';
import { DataSource } from 'typeorm';
import type { HeadingProgress, HeadingProgressPort } from '../../common/ports/heading-progress.port.js';
import { STAGES } from '../headings/heading.entity.js';
import { SupportRecordsService } from '../support-records/support-records.service.js';

const num = (v: string | null): number | null => (v === null ? null : Number(v));

/** A draft's face, when it lies beyond the handed-in face along the drive (or there is none handed in). */
function beyond(r: {
  faceChainage: string | null;
  draftFaceChainage: string | null;
  chainageSense: 'increasing' | 'decreasing';
}): number | null {
  const face = num(r.faceChainage);
  const draft = num(r.draftFaceChainage);
  if (draft === null || face === null) return draft;
  const ahead = r.chainageSense === 'decreasing' ? draft < face : draft > face;
  return ahead ? draft : null;
}

/** The Board's read model: per-heading progress from the rounds, in two queries for any number of headings. */
@Injectable()
export class BoardService implements HeadingProgressPort {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(SupportRecordsService) private readonly supportRecords: SupportRecordsService,
  ) {}

  async progress(headingIds: string[], now = new Date()): Promise<Map<string, HeadingProgress>> {
    if (headingIds.length === 0) return new Map();
    // One row per heading that has rounds, each figure read by an index seek (at 30,000 rounds the former
    // GROUP BY read every round of the heading at every Board request; `npm run load`).
    // The face furthest along the drive (the lowest chainage on a heading driven against the chainage),
    // among rounds handed in; a draft's face apart, so a typo in a draft does not move the heading's face.
    const face = (op: '<>' | '=', dir: 'ASC' | 'DESC') =>
      `(SELECT r.face_chainage FROM rounds r WHERE r.heading_id = h.id AND r.status ${op} 'draft' ORDER BY r.face_chainage ${dir} LIMIT 1)`;
    const rows = await this.dataSource.query<
      Array<{
        headingId: string;
        faceChainage: string | null;
        draftFaceChainage: string | null;
        chainageSense: 'increasing' | 'decreasing';
        lastRoundAt: Date | string | null;
        toConfirm: string;
      }>
    >(
      `SELECT p.* FROM (
         SELECT h.id AS headingId, h.chainage_sense AS chainageSense,
                IF(h.chainage_sense = 'decreasing', ${face('<>', 'ASC')}, ${face('<>', 'DESC')}) AS faceChainage,
                IF(h.chainage_sense = 'decreasing', ${face('=', 'ASC')}, ${face('=', 'DESC')}) AS draftFaceChainage,
                (SELECT MAX(r.mapped_at) FROM rounds r WHERE r.heading_id = h.id) AS lastRoundAt,
                (SELECT COUNT(*) FROM rounds r WHERE r.heading_id = h.id AND r.status = 'submitted') AS toConfirm
           FROM headings h WHERE h.id IN (?)) p
        WHERE p.lastRoundAt IS NOT NULL`,
      [headingIds],
    );
    // The heading's level is the worst among the latest evaluated round of each stage (top heading and bench
    // advance apart); a round whose rules still lack their data has no level and does not count as green.
    // One seek per heading and stage: the unique (heading, stage, number) index read backwards.
    const levels = await this.dataSource.query<
      Array<{ headingId: string; triggerLevel: HeadingProgress['triggerLevel'] }>
    >(
      headingIds
        .flatMap(() =>
          STAGES.map(
            () =>
              `(SELECT r.heading_id AS headingId, r.trigger_level AS triggerLevel FROM rounds r
                 WHERE r.heading_id = ? AND r.stage = ? AND r.trigger_level IS NOT NULL
                 ORDER BY r.round_number DESC LIMIT 1)`,
          ),
        )
        .join(' UNION ALL '),
      headingIds.flatMap((id) => STAGES.flatMap((stage) => [id, stage])),
    );
    const levelOf = new Map<string, HeadingProgress['triggerLevel']>();
    for (const l of levels) {
      const current = levelOf.get(l.headingId) ?? null;
      if (l.triggerLevel && (current === null || LEVEL_RANK[l.triggerLevel] > LEVEL_RANK[current]))
        levelOf.set(l.headingId, l.triggerLevel);
      else if (!levelOf.has(l.headingId)) levelOf.set(l.headingId, current);
    }
    // Each heading's latest handover (handovers.e2e-spec.ts), read from the handovers' own tables.
    const handovers = await this.dataSource.query<
      Array<{ headingId: string; sentAt: Date; acknowledgedAt: Date | null; ackDueAt: Date }>
    >(
      `SELECT hh.heading_id AS headingId, h.sent_at AS sentAt, h.acknowledged_at AS acknowledgedAt,
              h.ack_due_at AS ackDueAt
         FROM handover_headings hh JOIN handovers h ON h.id = hh.handover_id
        WHERE hh.heading_id IN (${headingIds.map(() => '?').join(', ')})
          AND h.sent_at = (SELECT MAX(x.sent_at) FROM handovers x JOIN handover_headings xh
                            ON xh.handover_id = x.id WHERE xh.heading_id = hh.heading_id)`,
      headingIds,
    );
    const out = new Map<string, HeadingProgress>(
      rows.map((r) => [
        r.headingId,
        {
          faceChainage: num(r.faceChainage),
          draftFaceChainage: beyond(r),
          lastRoundAt: new Date(r.lastRoundAt!).toISOString(),
          roundsToConfirm: Number(r.toConfirm),
          triggerLevel: levelOf.get(r.headingId) ?? null,
        },
      ]),
    );
    for (const h of handovers) {
      const entry = out.get(h.headingId) ?? {
        faceChainage: null,
        draftFaceChainage: null,
        lastRoundAt: null,
        roundsToConfirm: 0,
        triggerLevel: null,
      };
      entry.lastHandover = {
        sentAt: new Date(h.sentAt).toISOString(),
        acknowledgedAt: h.acknowledgedAt ? new Date(h.acknowledgedAt).toISOString() : null,
        ackDueAt: new Date(h.ackDueAt).toISOString(),
        overdue: !h.acknowledgedAt && new Date(h.ackDueAt).getTime() <= now.getTime(),
      };
      out.set(h.headingId, entry);
    }
    // The class being built: the one confirmed on the heading's most recently confirmed round.
    const confirmed = await this.dataSource.query<
      Array<{ headingId: string; code: string; roundNumber: number; stage: string; confirmedAt: Date }>
    >(
      `SELECT r.heading_id AS headingId, c.code AS code, r.round_number AS roundNumber, r.stage AS stage,
              r.confirmed_at AS confirmedAt
         FROM rounds r JOIN support_classes c ON c.id = r.confirmed_class_id
        WHERE r.heading_id IN (${headingIds.map(() => '?').join(', ')}) AND r.status = 'confirmed'
          AND r.confirmed_at = (SELECT MAX(x.confirmed_at) FROM rounds x
                                 WHERE x.heading_id = r.heading_id AND x.status = 'confirmed')`,
      headingIds,
    );
    for (const c of confirmed) {
      const entry = out.get(c.headingId);
      if (entry)
        entry.confirmedClass = {
          code: c.code,
          roundNumber: Number(c.roundNumber),
          stage: c.stage,
          confirmedAt: new Date(c.confirmedAt).toISOString(),
        };
    }
    // Support as built: the latest confirmed round of a stage with items outstanding (support-records).
    const outstanding = await this.supportRecords.outstandingHeadings(headingIds);
    for (const [headingId, entry] of out) entry.supportOutstanding = outstanding.has(headingId);
    return out;
  }
}
