import { randomUUID } from 'node:crypto';
import { assessRound, computeRatings, DEFAULT_SET_PARAMETERS, suggestClasses } from '@roundbook/domain';
import {
  driveOf,
  formatPlane,
  rmrOrientationInTunnel,
  type Plane,
  type PlaneNotation,
  type RmrOrientationAssessment,
} from '@roundbook/geomath';
import type { EntityManager } from 'typeorm';
import { headingGeometry } from '../../modules/headings/heading-geometry.js';
import type { Heading, Stage } from '../../modules/headings/heading.entity.js';
import { Joint, type JointKind } from '../../modules/rounds/joint.entity.js';
import { readOrientation } from '../../modules/rounds/orientation-reading.js';
import { RoundRevision } from '../../modules/rounds/round-revision.entity.js';
import { Round, type QRecord, type RmrRecord } from '../../modules/rounds/round.entity.js';
import { recordOf } from '../../modules/rounds/rounds.mapper.js';
import type { SupportClass } from '../../modules/support-classes/support-class.entity.js';
import { TriggerRule } from '../../modules/trigger-rules/trigger-rule.entity.js';

/** The invented rounds of the demo: a few weeks of a heading's advance, a fault zone approaching. */
export interface DemoRoundsPlan {
  heading: string;
  stage: Stage;
  count: number;
  roundLength: number;
  /** The last round's shift date is this many days before the day the demo is seeded. */
  endsDaysAgo: number;
  sets: Array<{ label: string; dipDirection: number; dip: number }>;
  fault: {
    label: string;
    dipDirection: number;
    dip: number;
    fromRound: number;
    thicknessM: number;
    infill: string;
  } | null;
  rockUnit: string;
  lastDraft: boolean;
}

/** A small deterministic generator, so the demo is the same on every machine (mulberry32). */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const ORDER: Record<RmrOrientationAssessment, number> = {
  'very favourable': 0,
  favourable: 1,
  fair: 2,
  unfavourable: 3,
  'very unfavourable': 4,
};
const round5 = (x: number): number => Math.max(0, Math.min(100, Math.round(x / 5) * 5));

export async function seedDemoRounds(
  manager: EntityManager,
  plan: DemoRoundsPlan,
  heading: Heading,
  classes: SupportClass[],
  mappedBy: string,
): Promise<void> {
  const random = rng(plan.heading.split('').reduce((s, c) => s * 31 + c.charCodeAt(0), 7));
  const drive = driveOf(heading);
  const rules = await manager.find(TriggerRule, { where: { projectId: heading.projectId } });
  const earlier: Array<{
    id: string;
    roundId: string;
    faceChainage: number;
    dipDirection: number;
    dip: number;
  }> = [];
  let previousClassId: string | null | undefined = undefined;
  for (let i = 1; i <= plan.count; i++) {
    const t = (i - 1) / Math.max(1, plan.count - 1);
    const faultHere = plan.fault !== null && i >= plan.fault.fromRound;
    const face = heading.startChainage + i * plan.roundLength;
    const day = Math.floor((i - 1) / 2);
    const shiftDate = new Date(`${new Date().toISOString().slice(0, 10)}T12:00:00Z`);
    shiftDate.setUTCDate(shiftDate.getUTCDate() - plan.endsDaysAgo - Math.floor((plan.count - 1) / 2) + day);
    const shift = i % 2 === 1 ? 'day' : 'night';
    const mappedAt = new Date(shiftDate.getTime() + (shift === 'day' ? 2 : 14) * 3600_000);

    const jitter = (p: Plane, spread: number): Plane => ({
      dipDirection: (p.dipDirection + (random() - 0.5) * 2 * spread + 360) % 360,
      dip: Math.min(89.5, Math.max(2, p.dip + (random() - 0.5) * spread)),
    });
    const entries: Array<{
      kind: JointKind;
      plane: Plane;
      notation: PlaneNotation | 'quadrant';
      label: string;
      fault?: boolean;
    }> = [];
    for (const [k, s] of plan.sets.entries()) {
      const n = 2 + Math.floor(random() * 2);
      for (let j = 0; j < n; j++) {
        entries.push({
          kind: k === 1 && plan.sets.length > 2 ? 'bedding' : 'joint',
          plane: jitter(s, 8),
          notation: k === 1 ? 'quadrant' : 'dip-direction/dip',
          label: s.label,
        });
      }
    }
    if (faultHere && plan.fault) {
      entries.push({
        kind: 'fault',
        plane: jitter(plan.fault, 3),
        notation: 'dip-direction/dip',
        label: plan.fault.label,
        fault: true,
      });
    }

    const worst = plan.sets
      .map((s) => rmrOrientationInTunnel(s, drive).assessment)
      .reduce((a, b) => (ORDER[b] > ORDER[a] ? b : a), 'very favourable' as RmrOrientationAssessment);
    const qInput: QRecord = {
      rqd: round5(92 - 55 * t - random() * 6),
      jn: (faultHere ? 3 : 0) + (plan.sets.length >= 3 ? 9 : 4),
      jr: t < 0.5 ? 2 : 1.5,
      ja: faultHere ? 4 : t < 0.6 ? 1 : 2,
      jw: t < 0.7 ? 1 : 0.66,
      srf: faultHere ? 2.5 : 1,
    };
    const rmrInput: RmrRecord = {
      strength: { kind: 'point-load', is50: Math.round((6.5 - 3.5 * t) * 10) / 10 },
      rqd: qInput.rqd,
      spacingM: Math.round((0.7 - 0.45 * t) * 100) / 100,
      condition: {
        kind: 'simple',
        condition: faultHere
          ? 'slickensided-or-thin-gouge'
          : t < 0.5
            ? 'slightly-rough-slightly-weathered'
            : 'slightly-rough-highly-weathered',
      },
      groundwater: { kind: 'inflow', litresPerMinutePer10m: Math.round(4 + 40 * t) },
      orientation: { kind: 'assessment', assessment: worst },
    };
    const ratings = computeRatings({ qInput, rmrInput, gsiObserved: null });
    const suggested = suggestClasses(classes, ratings.q.value, ratings.rmr.value);
    const recommended =
      classes.find((c) => c.id === suggested[0]) ??
      classes.find((c) => !c.retired && c.qMin !== null && (ratings.q.value ?? 0) >= c.qMin);
    const status =
      i === plan.count && plan.lastDraft ? 'draft' : i >= plan.count - 1 ? 'submitted' : 'confirmed';
    const saved = manager.create(Round, {
      id: randomUUID(),
      projectId: heading.projectId,
      headingId: heading.id,
      stage: plan.stage,
      roundNumber: i,
      faceChainage: face,
      previousChainage: face - plan.roundLength,
      roundLength: plan.roundLength,
      shiftDate: shiftDate.toISOString().slice(0, 10),
      shift,
      mappedBy,
      mappedAt,
      distantParts: i % 5 === 0 ? 'Upper left shoulder seen from the platform only' : '',
      ground: {
        units: [
          {
            name: plan.rockUnit,
            sharePercent: 100,
            weatheringGrade: t < 0.6 ? 'WII' : 'WIII',
            strengthGrade: t < 0.6 ? 'R4' : 'R3',
          },
        ],
        pointLoadIs50: rmrInput.strength.kind === 'point-load' ? rmrInput.strength.is50 : null,
        pointLoadFactor: 22,
        inflowLpm: Math.round((4 + 40 * t) * plan.roundLength) / 10,
        inflowLengthM: plan.roundLength,
        waterDescription:
          t < 0.4
            ? 'Damp patches'
            : t < 0.7
              ? 'Drips from the crown joints'
              : 'Steady drips, running along the fault trace',
        overbreakM3: Math.round((0.5 + 4 * t * random()) * 10) / 10,
        notes: faultHere ? 'Fault zone with clay gouge crossing the face; see the look-ahead.' : '',
      },
      qInput,
      rmrInput,
      gsiObserved: null,
      q: ratings.q.value,
      rmr: ratings.rmr.value,
      gsi: ratings.gsi.value,
      recommendedClassId: recommended?.id ?? null,
      nextRoundLength: recommended ? Math.min(recommended.maxRoundLength, plan.roundLength) : null,
      recommendationReason: suggested.length
        ? ''
        : 'No class fits both ratings; the Q recommendation is followed.',
      setParameters: DEFAULT_SET_PARAMETERS,
      status,
      revision: 1,
      submittedAt: status === 'draft' ? null : new Date(mappedAt.getTime() + 3600_000),
    });
    const jointRows = entries.map((e, seq) => {
      const text = formatPlane(e.plane, e.notation);
      const reading = readOrientation(text, 'dip-direction/dip');
      return manager.create(Joint, {
        id: randomUUID(),
        roundId: saved.id,
        headingId: heading.id,
        faceChainage: face,
        seq: seq + 1,
        kind: e.kind,
        orientationText: text,
        notation: 'dip-direction/dip',
        dipDirection: 'error' in reading ? null : reading.dipDirection,
        dip: 'error' in reading ? null : reading.dip,
        orientationError: 'error' in reading ? reading.error : null,
        setLabel: e.label,
        setOverride: false,
        spacingM: e.fault ? null : Math.round((0.7 - 0.45 * t) * 100) / 100,
        persistenceM: e.fault ? 20 : 3,
        apertureMm: e.fault ? 40 : 0.5,
        jr: e.fault ? 1 : qInput.jr,
        jrc: null,
        jrcMethod: null,
        infill: e.fault ? (plan.fault?.infill ?? '') : '',
        ja: e.fault ? 4 : qInput.ja,
        water: e.fault ? 'dripping' : 'damp',
        thicknessM: e.fault ? (plan.fault?.thicknessM ?? null) : null,
        notes: '',
      });
    });
    // The same assessment the API makes on save (packages/domain), frozen for rounds past draft.
    const assessment = assessRound(
      {
        faceChainage: face,
        roundLength: plan.roundLength,
        ground: saved.ground,
        joints: jointRows.map((j) => ({
          id: j.id,
          kind: j.kind,
          dipDirection: j.dipDirection,
          dip: j.dip,
          setLabel: j.setLabel,
          setOverride: false,
          spacingM: j.spacingM,
        })),
        qInput,
        rmrInput,
        gsiObserved: null,
        recommendedClassId: saved.recommendedClassId,
        setParameters: DEFAULT_SET_PARAMETERS,
      },
      {
        heading: headingGeometry(heading, plan.stage),
        supportClasses: classes,
        nearbyJoints: earlier.filter(
          (e) => Math.abs(e.faceChainage - face) <= DEFAULT_SET_PARAMETERS.windowM,
        ),
        previousRound: previousClassId === undefined ? null : { classId: previousClassId },
        rules,
      },
    );
    for (const j of jointRows)
      j.setLabel = assessment.sets.membership[j.id] || (j.kind === 'fault' ? j.setLabel : null);
    Object.assign(saved, {
      assessment,
      assessmentVersion: assessment.version,
      triggerLevel: assessment.triggers.level,
      triggerFirings: assessment.triggers.firings,
      triggersNotEvaluated: assessment.triggers.notEvaluated.length,
    });
    await manager.save(saved);
    await manager.insert(Joint, jointRows);
    if (status !== 'draft') {
      await manager.save(
        manager.create(RoundRevision, {
          id: randomUUID(),
          roundId: saved.id,
          revision: 1,
          event: 'submit',
          status: 'submitted',
          record: recordOf(saved, jointRows),
          assessment,
          assessmentVersion: assessment.version,
          createdBy: mappedBy,
        }),
      );
    }
    previousClassId = saved.recommendedClassId;
    for (const j of jointRows)
      if (j.dipDirection !== null && j.dip !== null && j.kind !== 'fault')
        earlier.push({
          id: j.id,
          roundId: saved.id,
          faceChainage: face,
          dipDirection: j.dipDirection,
          dip: j.dip,
        });
  }
}
