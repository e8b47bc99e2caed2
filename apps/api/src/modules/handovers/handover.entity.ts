import type {
  CycleStage,
  HandoverStatus,
  HazardKind,
  LookAheadItem,
  Shift,
  TriggerLevel,
} from '@roundbook/domain';
import { Column, Entity, Index, PrimaryColumn } from 'typeorm';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import type { Stage } from '../headings/heading.entity.js';

/** One alert of a heading as it stood when the handover was sent (a fired trigger rule of its last round). */
export interface HandoverAlert {
  level: TriggerLevel;
  summary: string;
  action: string;
  ownerRole: string;
}

/** One open hazard of a heading as it stood when the handover was sent (from its register). */
export interface HandoverHazard {
  id: string;
  kind: HazardKind;
  /** The range's start-side end and far end, m */
  fromChainage: number;
  toChainage: number;
  level: TriggerLevel;
  description: string;
}

/** A mapped fault or shear zone whose crown or invert crossing lies ahead of the face, as the domain gives it. */
export type HandoverLookAhead = LookAheadItem;

/** What the PDF draws for a heading (object keys and plot data, frozen when sent; bytes read by the PDF job). */
export interface HandoverPictures {
  /** The latest handed-in round's sketch render (PNG), if it was sketched */
  sketch: { roundNumber: number; key: string } | null;
  /** The latest handed-in round (whose sketch was looked for); null before the first */
  sketchRound: number | null;
  /** Up to six photos of the recent rounds, newest round first; key null while the thumbnail is not made */
  photos: Array<{ roundNumber: number; caption: string; key: string | null }>;
  /** Poles of the recent rounds' joints by set, the latest round's set means and the drive; null: none mapped */
  stereonet: {
    rounds: number[];
    driveTrend: number;
    poles: Array<{ dipDirection: number; dip: number; set: string | null }>;
    sets: Array<{ label: string; dipDirection: number; dip: number; count: number }>;
  } | null;
}

/** What was handed over for one heading, frozen when sent (figures from the data, words from the supervisor). */
export interface HandoverHeadingSnapshot {
  headingId: string;
  code: string;
  name: string;
  chainageStyle: 'km+m' | 'metres';
  chainageDecimals: number;
  /** Face of the last round handed in (submitted or later), metres; null before the first */
  faceChainage: number | null;
  stage: Stage | null;
  lastRoundNumber: number | null;
  lastConfirmed: {
    roundId: string;
    roundNumber: number;
    stage: Stage;
    faceChainage: number;
    classId: string | null;
    classCode: string | null;
    className: string | null;
    /** The next round length the engineer confirmed, m */
    nextRoundLength: number | null;
    confirmedAt: string | null;
  } | null;
  /** Trigger level of the last round handed in, and its fired rules */
  triggerLevel: TriggerLevel | null;
  alerts: HandoverAlert[];
  /** The heading's open hazards, red first (absent on handovers sent before hazards were carried) */
  hazards?: HandoverHazard[];
  /** Support as built still outstanding on the heading's confirmed rounds, one line per item (absent before) */
  supportOutstanding?: string[];
  /** Features reaching the crown or invert ahead of the face, nearest first (absent before look-ahead was carried) */
  lookAhead?: HandoverLookAhead[];
  /** The round length the coming rounds were counted in, m (the last confirmed round's next, else planned) */
  lookAheadRoundLength?: number | null;
  /** What the PDF draws (absent before pictures were carried, and in the composer's draft) */
  pictures?: HandoverPictures;
  cycleStage: CycleStage | null;
  notes: string;
}

export interface HandoverSnapshot {
  projectName: string;
  timeZone: string;
  outgoing: { userId: string; name: string; email: string };
  incoming: { userId: string; name: string; email: string };
  headings: HandoverHeadingSnapshot[];
  generalNotes: string;
  extraRecipients: string[];
}

/** A shift handover: the frozen snapshot, who handed over to whom, and its acknowledgement. */
@Entity('handovers')
@Index('IDX_handovers_incoming', ['incomingId', 'status', 'sentAt'])
@Index('IDX_handovers_project', ['projectId', 'sentAt'])
export class Handover {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'outgoing_id', type: 'uuid' })
  outgoingId: string;

  @Column({ name: 'incoming_id', type: 'uuid' })
  incomingId: string;

  @Column({ name: 'shift_date', type: 'date' })
  shiftDate: string;

  @Column({ type: 'enum', enum: ['day', 'night'] })
  shift: Shift;

  @Column({ type: 'enum', enum: ['sent', 'acknowledged'], default: 'sent' })
  status: HandoverStatus;

  @Column({ type: 'json' })
  snapshot: HandoverSnapshot;

  /** Every address the e-mail goes to (the incoming supervisor first) */
  @Column({ type: 'json' })
  recipients: string[];

  /** The e-mail in the outbox, once the PDF is made */
  @Column({ name: 'notice_id', type: 'uuid', nullable: true })
  noticeId: string | null;

  @Column({ name: 'pdf_key', type: 'varchar', length: 255, nullable: true })
  pdfKey: string | null;

  @Column({ name: 'sent_at', type: 'datetime', precision: 3 })
  sentAt: Date;

  /** By when the incoming supervisor should acknowledge (sent + the project's minutes, frozen when sent) */
  @Column({ name: 'ack_due_at', type: 'datetime', precision: 3 })
  ackDueAt: Date;

  /** The notice that told the outgoing supervisor and the engineers it ran overdue (sent once) */
  @Column({ name: 'overdue_notice_id', type: 'uuid', nullable: true })
  overdueNoticeId: string | null;

  @Column({ name: 'acknowledged_at', type: 'datetime', precision: 3, nullable: true })
  acknowledgedAt: Date | null;

  @Column({ name: 'acknowledged_by', type: 'uuid', nullable: true })
  acknowledgedBy: string | null;

  @Column({ name: 'acknowledge_comment', type: 'text', nullable: true })
  acknowledgeComment: string | null;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}

/** The headings of a handover, in the order handed over (each heading's history reads from here). */
@Entity('handover_headings')
@Index('IDX_handover_headings_heading', ['headingId'])
export class HandoverHeading {
  @PrimaryColumn({ name: 'handover_id', type: 'uuid' })
  handoverId: string;

  @PrimaryColumn({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @Column({ type: 'int' })
  position: number;
}
