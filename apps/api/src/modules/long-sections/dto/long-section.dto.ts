import { ApiProperty } from '@nestjs/swagger';
import type {
  HazardKind,
  HazardStatus,
  JointKind,
  RoundStatus,
  Stage,
  TriggerLevel,
} from '@roundbook/domain';
import { HAZARD_KINDS, HAZARD_LEVELS, HAZARD_STATUSES } from '../../hazards/hazard.entity.js';
import { STAGES } from '../../headings/heading.entity.js';
import { JOINT_KINDS } from '../../rounds/joint.entity.js';
import { ROUND_STATUSES } from '../../rounds/round.entity.js';

/** One round as a slice of the long section: where it lies along the tunnel and what was found there. */
export class LongSectionRoundDto {
  id: string;
  roundNumber: number;
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: Stage;
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus' })
  status: RoundStatus;
  /** The chainage the round started from (the previous face), m */
  fromChainage: number;
  /** The round's face, m */
  faceChainage: number;
  /** The unit with the largest share of the face */
  @ApiProperty({ type: String, nullable: true })
  rockUnit: string | null;
  @ApiProperty({ type: Number, nullable: true })
  q: number | null;
  @ApiProperty({ type: Number, nullable: true })
  rmr: number | null;
  @ApiProperty({ type: Number, nullable: true })
  gsi: number | null;
  /** Support class codes: the geologist's recommendation, the engineer's confirmation, what was installed */
  @ApiProperty({ type: String, nullable: true })
  recommendedClass: string | null;
  @ApiProperty({ type: String, nullable: true })
  confirmedClass: string | null;
  @ApiProperty({ type: String, nullable: true })
  installedClass: string | null;
  @ApiProperty({ enum: HAZARD_LEVELS, enumName: 'TriggerLevel', nullable: true })
  triggerLevel: TriggerLevel | null;
  /** Water inflow scaled to 10 m of tunnel, l/min (the inflow over the length it was measured on) */
  @ApiProperty({ type: Number, nullable: true })
  inflowLpmPer10m: number | null;
  /** Overbreak per metre of the round, m³/m */
  @ApiProperty({ type: Number, nullable: true })
  overbreakM3PerM: number | null;
}

/** A hazard's range on the long section. */
export class LongSectionHazardDto {
  id: string;
  @ApiProperty({ enum: HAZARD_KINDS, enumName: 'HazardKind' })
  kind: HazardKind;
  @ApiProperty({ enum: HAZARD_LEVELS, enumName: 'TriggerLevel' })
  level: TriggerLevel;
  @ApiProperty({ enum: HAZARD_STATUSES, enumName: 'HazardStatus' })
  status: HazardStatus;
  fromChainage: number;
  toChainage: number;
  description: string;
}

/**
 * A mapped fault or shear zone as its trace on the vertical section through the axis: the straight line
 * from where the plane meets the crown to where it meets the invert (geomath planeCrossings).
 */
export class LongSectionTraceDto {
  jointId: string;
  /** The feature across rounds (its first observation's id); each feature is drawn once, from its latest round */
  featureKey: string;
  roundId: string;
  roundNumber: number;
  @ApiProperty({ enum: JOINT_KINDS, enumName: 'JointKind' })
  kind: JointKind;
  label: string;
  dipDirection: number;
  dip: number;
  /** Where the plane meets the crown and the invert, m; null where it runs along the tunnel */
  @ApiProperty({ type: Number, nullable: true })
  crownChainage: number | null;
  @ApiProperty({ type: Number, nullable: true })
  invertChainage: number | null;
  /** Along the drive from today's face, m (negative: behind it) */
  @ApiProperty({ type: Number, nullable: true })
  crownAhead: number | null;
  @ApiProperty({ type: Number, nullable: true })
  invertAhead: number | null;
  /** The upcoming round (1 = the next) that reaches the crossing; null when it is behind the face */
  @ApiProperty({ type: Number, nullable: true })
  crownRoundsAhead: number | null;
  @ApiProperty({ type: Number, nullable: true })
  invertRoundsAhead: number | null;
  /** Whether the trace's position on the face was recorded (else the face centre was used) */
  traceKnown: boolean;
}

/** A heading's long section: per-round ground along chainage, hazards and the traces of mapped planes. */
export class LongSectionDto {
  headingId: string;
  @ApiProperty({ enum: ['increasing', 'decreasing'] as const, enumName: 'LongSectionSense' })
  chainageSense: 'increasing' | 'decreasing';
  /** Today's face: the furthest handed-in round (else the furthest draft), m; null without rounds */
  @ApiProperty({ type: Number, nullable: true })
  faceChainage: number | null;
  /** The number of the round at today's face */
  @ApiProperty({ type: Number, nullable: true })
  faceRoundNumber: number | null;
  /** The length of the coming rounds: the last confirmed round's next round length, else the planned, m */
  lookAheadRoundLength: number;
  /** Heights of the full profile relative to the axis, m: the crown above and the invert below */
  crownHeight: number;
  invertDepth: number;
  @ApiProperty({ type: [LongSectionRoundDto] })
  rounds: LongSectionRoundDto[];
  @ApiProperty({ type: [LongSectionHazardDto] })
  hazards: LongSectionHazardDto[];
  @ApiProperty({ type: [LongSectionTraceDto] })
  traces: LongSectionTraceDto[];
}
