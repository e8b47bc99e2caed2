import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { LEVEL_RANK, ROUND_STATUSES, type RoundStatus } from '@roundbook/domain';
import { DataSource } from 'typeorm';
import type { HeadingProgress, HeadingProgressPort } from '../../common/ports/heading-progress.port.js';
import { STAGES } from '../headings/heading.entity.js';
import { SupportRecordsService } from '../support-records/support-records.service.js';

type Sense = 'increasing' | 'decreasing';

/** Statuses of a round handed in by the geologist (every status but draft). */
const HANDED_IN = ROUND_STATUSES.filter((s) => s !== 'draft');

/** The chainage furthest along the drive among `values` (nulls skipped): the lowest when driven against it. */
function furthest(sense: Sense, values: Array<string | null>): number | null {
  const known = values.filter((v): v is string => v !== null).map(Number);
  if (known.length === 0) return null;
  return sense === 'decreasing' ? Math.min(...known) : Math.max(...known);
}

/** A draft's face, when it lies beyond the handed-in face along the drive (or there is none handed in). */
function beyond(sense: Sense, draft: number | null, face: number | null): number | null {
  if (draft === null || face === null) return draft;
  const ahead = sense === 'decreasing' ? draft < face : draft > face;
  return ahead ? draft : null;
}

/**
 * The Board's read model: per-heading progress from the rounds, in a fixed number of queries for any number of
 * headings, each figure an index seek (none reads the heading's rounds one by one).
 */
@Injectable()
export class BoardService implements HeadingProgressPort {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(SupportRecordsService) private readonly supportRecords: SupportRecordsService,
  ) {}

  async progress(headingIds: string[], now = new Date()): Promise<Map<string, HeadingProgress>> {
    if (headingIds.length === 0) return new Map();
    // One row per heading, every figure a MIN/MAX or count on an index prefix given as constants, so MariaDB
    // answers each from the index without reading rounds (`npm run load`, 30,000 rounds: the former correlated
    // `status <> 'draft' ORDER BY face_chainage LIMIT 1` walked IDX_rounds_heading_chainage across every
    // heading and read each round's row for its status; 7 s per Board request with one connection).
    // The face furthest along the drive (the lowest chainage on a heading driven against the chainage) among
    // rounds handed in is taken in JS from the per-status extremes; a draft's face apart, so a typo in a draft
    // does not move the heading's face.
    const extremes = (status: RoundStatus) =>
      `(SELECT MIN(r.face_chainage) FROM rounds r WHERE r.heading_id = ? AND r.status = '${status}') AS \`min_${status}\`,
       (SELECT MAX(r.face_chainage) FROM rounds r WHERE r.heading_id = ? AND r.status = '${status}') AS \`max_${status}\``;
    const rows = await this.dataSource.query<
      Array<
        {
          headingId: string;
          chainageSense: Sense;
          lastRoundAt: Date | string | null;
          toConfirm: string;
        } & Record<`${'min' | 'max'}_${RoundStatus}`, string | null>
      >
    >(
      headingIds
        .map(
          () =>
            `SELECT h.id AS headingId, h.chainage_sense AS chainageSense,
                    ${ROUND_STATUSES.map(extremes).join(',\n')},
                    (SELECT MAX(r.mapped_at) FROM rounds r WHERE r.heading_id = ?) AS lastRoundAt,
                    (SELECT COUNT(*) FROM rounds r WHERE r.heading_id = ? AND r.status = 'submitted') AS toConfirm
               FROM headings h WHERE h.id = ?`,
        )
        .join(' UNION ALL '),
      // The heading's id for each placeholder: two per status, then the last round, the count and the heading.
      headingIds.flatMap((id) => Array<string>(ROUND_STATUSES.length * 2 + 3).fill(id)),
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
      rows
        .filter((r) => r.lastRoundAt !== null)
        .map((r) => {
          const face = furthest(
            r.chainageSense,
            HANDED_IN.flatMap((st) => [r[`min_${st}`], r[`max_${st}`]]),
          );
          const draft = furthest(r.chainageSense, [r.min_draft, r.max_draft]);
          return [
            r.headingId,
            {
              faceChainage: face,
              draftFaceChainage: beyond(r.chainageSense, draft, face),
              lastRoundAt: new Date(r.lastRoundAt!).toISOString(),
              roundsToConfirm: Number(r.toConfirm),
              triggerLevel: levelOf.get(r.headingId) ?? null,
            },
          ];
        }),
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
      // One seek per heading down IDX_rounds_heading_status_confirmed (the former `confirmed_at = (SELECT MAX…)`
      // read the row of every round built to a class: most of the table at 30,000 rounds).
      `SELECT t.headingId, c.code AS code, t.roundNumber, t.stage, t.confirmedAt FROM (
         ${headingIds
           .map(
             () =>
               `(SELECT r.heading_id AS headingId, r.confirmed_class_id AS classId, r.round_number AS roundNumber,
                        r.stage AS stage, r.confirmed_at AS confirmedAt
                   FROM rounds r WHERE r.heading_id = ? AND r.status = 'confirmed' AND r.confirmed_at IS NOT NULL
                  ORDER BY r.confirmed_at DESC, r.id DESC LIMIT 1)`,
           )
           .join(' UNION ALL ')}) t
       JOIN support_classes c ON c.id = t.classId`,
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
