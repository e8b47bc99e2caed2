import { Readable } from 'node:stream';
import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { jointKindLabels, shiftLabels } from '@roundbook/domain';
import Papa from 'papaparse';
import { DataSource, In } from 'typeorm';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import type { Heading } from '../headings/heading.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { User } from '../users/user.entity.js';
import { Joint } from './joint.entity.js';
import { Round } from './round.entity.js';
import { RoundsQueries } from './rounds.queries.js';

/** One column of an export: its header (with the unit) and how a row gives its value. */
interface Column<T> {
  header: string;
  value: (row: T) => string | number | null;
}

interface RoundRow {
  round: Round;
  mappedByName: string;
  classCode: (id: string | null) => string;
}

interface JointRow {
  joint: Joint;
  round: Round;
}

/** A number kept to `digits` significant figures (stored doubles carry float noise a spreadsheet shows). */
const sig = (v: number | null | undefined, digits = 4): number | null =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toPrecision(digits));
const iso = (d: Date | null): string | null => (d === null ? null : d.toISOString());

/**
 * The columns of the rounds export, in order. The README lists them; units are in the headers. Numbers are
 * plain numbers (a point for decimals, metres for chainage) so a spreadsheet or a script reads them as such.
 */
export const ROUND_COLUMNS: Column<RoundRow>[] = [
  { header: 'stage', value: (r) => r.round.stage },
  { header: 'round number', value: (r) => r.round.roundNumber },
  { header: 'revision', value: (r) => r.round.revision },
  { header: 'status', value: (r) => r.round.status },
  { header: 'face chainage (m)', value: (r) => Number(r.round.faceChainage) },
  {
    header: 'previous face chainage (m)',
    value: (r) => (r.round.previousChainage === null ? null : Number(r.round.previousChainage)),
  },
  { header: 'round length (m)', value: (r) => r.round.roundLength },
  { header: 'shift date', value: (r) => r.round.shiftDate },
  { header: 'shift', value: (r) => shiftLabels[r.round.shift] },
  { header: 'mapped at (UTC, ISO 8601)', value: (r) => iso(r.round.mappedAt) },
  { header: 'mapped by', value: (r) => r.mappedByName },
  { header: 'Q', value: (r) => sig(r.round.q, 3) },
  { header: 'RMR89', value: (r) => r.round.rmr },
  { header: 'GSI', value: (r) => r.round.gsi },
  { header: 'inflow (l/min)', value: (r) => r.round.ground.inflowLpm },
  { header: 'inflow length (m)', value: (r) => r.round.ground.inflowLengthM },
  {
    header: 'inflow per 10 m (l/min)',
    value: (r) => {
      const { inflowLpm: q, inflowLengthM: l } = r.round.ground;
      return q === null || l === null || l <= 0 ? null : sig((q * 10) / l, 3);
    },
  },
  { header: 'overbreak (m³)', value: (r) => r.round.ground.overbreakM3 },
  {
    header: 'rock units',
    value: (r) => r.round.ground.units.map((u) => `${u.name} ${u.sharePercent}%`).join('; '),
  },
  { header: 'recommended class', value: (r) => r.classCode(r.round.recommendedClassId) },
  { header: 'next round length recommended (m)', value: (r) => r.round.nextRoundLength },
  { header: 'confirmed class', value: (r) => r.classCode(r.round.confirmedClassId) },
  { header: 'next round length confirmed (m)', value: (r) => r.round.confirmedRoundLength },
  { header: 'confirmed at (UTC, ISO 8601)', value: (r) => iso(r.round.confirmedAt) },
  { header: 'trigger level', value: (r) => r.round.triggerLevel ?? 'none' },
  {
    header: 'rules fired',
    value: (r) => (r.round.triggerFirings ?? []).map((f) => f.summary).join('; '),
  },
  { header: 'round id', value: (r) => r.round.id },
];

/** The columns of the joints export, in order (README). Orientations in degrees, dip direction/dip. */
export const JOINT_COLUMNS: Column<JointRow>[] = [
  { header: 'stage', value: (j) => j.round.stage },
  { header: 'round number', value: (j) => j.round.roundNumber },
  { header: 'face chainage (m)', value: (j) => Number(j.joint.faceChainage) },
  { header: 'joint number', value: (j) => j.joint.seq }, // seq is 1-based (rounds.commands.ts, the seed)
  { header: 'kind', value: (j) => jointKindLabels[j.joint.kind] },
  { header: 'dip direction (°)', value: (j) => j.joint.dipDirection },
  { header: 'dip (°)', value: (j) => j.joint.dip },
  { header: 'as entered', value: (j) => j.joint.orientationText },
  { header: 'notation', value: (j) => j.joint.notation },
  { header: 'not readable because', value: (j) => j.joint.orientationError ?? '' },
  { header: 'set', value: (j) => j.joint.setLabel ?? '' },
  { header: 'set chosen by the geologist', value: (j) => (j.joint.setOverride ? 'yes' : 'no') },
  { header: 'spacing (m)', value: (j) => j.joint.spacingM },
  { header: 'persistence (m)', value: (j) => j.joint.persistenceM },
  { header: 'aperture (mm)', value: (j) => j.joint.apertureMm },
  { header: 'thickness (m)', value: (j) => j.joint.thicknessM },
  { header: 'Jr', value: (j) => j.joint.jr },
  { header: 'JRC', value: (j) => j.joint.jrc },
  { header: 'JRC method', value: (j) => j.joint.jrcMethod ?? '' },
  { header: 'Ja', value: (j) => j.joint.ja },
  { header: 'infill', value: (j) => j.joint.infill },
  { header: 'water', value: (j) => j.joint.water ?? '' },
  { header: 'position right of the axis (m)', value: (j) => j.joint.faceOffset?.right ?? null },
  { header: 'position above the axis (m)', value: (j) => j.joint.faceOffset?.up ?? null },
  { header: 'same feature as joint id', value: (j) => j.joint.sameAsJointId ?? '' },
  { header: 'notes', value: (j) => j.joint.notes },
  { header: 'joint id', value: (j) => j.joint.id },
  { header: 'round id', value: (j) => j.round.id },
];

/** Rounds read per query while streaming: bounded memory however long the heading is. */
const BATCH = 500;

/**
 * CSV exports of a heading's rounds and joints (issue 16 item 3): streamed in batches by (stage, round
 * number) on the heading's unique key, written with papaparse. Text that a spreadsheet would run as a formula
 * (starting with =, +, -, @) is quoted and prefixed with an apostrophe (papaparse escapeFormulae).
 */
@Injectable()
export class RoundsExport {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(RoundsQueries) private readonly queries: RoundsQueries,
  ) {}

  /** The heading (404 when it is not the project's), checked before the response starts. */
  heading(access: ProjectAccess, headingId: string): Promise<Heading> {
    return this.queries.heading(access, headingId);
  }

  rounds(heading: Heading): Readable {
    return Readable.from(this.lines(heading, 'rounds'), { objectMode: false });
  }

  joints(heading: Heading): Readable {
    return Readable.from(this.lines(heading, 'joints'), { objectMode: false });
  }

  private async *lines(heading: Heading, what: 'rounds' | 'joints'): AsyncGenerator<string> {
    const classes = new Map(
      (
        await this.dataSource
          .getRepository(SupportClass)
          .find({ where: { projectId: heading.projectId }, select: { id: true, code: true } })
      ).map((c) => [c.id, c.code]),
    );
    const classCode = (id: string | null) => (id === null ? '' : (classes.get(id) ?? ''));
    const columns = what === 'rounds' ? ROUND_COLUMNS : JOINT_COLUMNS;
    // A byte-order mark, so a spreadsheet opens the degree sign and the names as UTF-8.
    yield '\ufeff' + Papa.unparse([columns.map((c) => c.header)], { newline: '\r\n' }) + '\r\n';
    let after: { stage: string; roundNumber: number } | null = null;
    for (;;) {
      const qb = this.dataSource
        .getRepository(Round)
        .createQueryBuilder('r')
        .where('r.heading_id = :headingId', { headingId: heading.id })
        .orderBy('r.stage', 'ASC')
        .addOrderBy('r.round_number', 'ASC')
        .limit(BATCH);
      if (after !== null)
        qb.andWhere('(r.stage, r.round_number) > (:stage, :roundNumber)', {
          stage: after.stage,
          roundNumber: after.roundNumber,
        });
      const rounds = await qb.getMany();
      if (rounds.length === 0) return;
      after = { stage: rounds[rounds.length - 1].stage, roundNumber: rounds[rounds.length - 1].roundNumber };
      let rows: Array<Array<string | number | null>>;
      if (what === 'rounds') {
        const ids = [...new Set(rounds.map((r) => r.mappedBy))];
        const names = new Map(
          (
            await this.dataSource
              .getRepository(User)
              .find({ where: { id: In(ids) }, select: { id: true, name: true } })
          ).map((u) => [u.id, u.name]),
        );
        rows = rounds.map((round) => {
          const row = { round, mappedByName: names.get(round.mappedBy) ?? '', classCode };
          return ROUND_COLUMNS.map((c) => c.value(row));
        });
      } else {
        const byId = new Map(rounds.map((r) => [r.id, r]));
        const joints = await this.dataSource
          .getRepository(Joint)
          .createQueryBuilder('j')
          .where('j.round_id IN (:...ids)', { ids: rounds.map((r) => r.id) })
          .getMany();
        // In the rounds' order, then the joints' order on the face.
        const order = new Map(rounds.map((r, i) => [r.id, i]));
        joints.sort((a, b) => order.get(a.roundId)! - order.get(b.roundId)! || a.seq - b.seq);
        rows = joints.map((joint) => {
          const row = { joint, round: byId.get(joint.roundId)! };
          return JOINT_COLUMNS.map((c) => c.value(row));
        });
      }
      if (rows.length > 0) yield Papa.unparse(rows, { newline: '\r\n', escapeFormulae: true }) + '\r\n';
      if (rounds.length < BATCH) return;
    }
  }
}
