import { randomUUID } from 'node:crypto';
import {
  assessRound,
  computeRatings,
  DEFAULT_SET_PARAMETERS,
  driveTrendAt,
  nextFaceChainage,
  explainSuggestion,
  headingSetsOf,
  previousRoundValues,
  shiftOf,
  type PreviousRoundValues,
  type RoundSet,
} from '@roundbook/domain';
import {
  driveOf,
  formatPlane,
  jvFromSpacings,
  rqdFromJv,
  STRENGTH_GRADES,
  rmrOrientationInTunnel,
  type Plane,
  type PlaneNotation,
  type RmrOrientationAssessment,
} from '@roundbook/geomath';
import type { EntityManager } from 'typeorm';
import { headingGeometry } from '../../modules/headings/heading-geometry.js';
import type { Heading, Stage } from '../../modules/headings/heading.entity.js';
import { Project } from '../../modules/projects/project.entity.js';
import { Joint, type JointKind } from '../../modules/rounds/joint.entity.js';
import { readOrientation } from '../../modules/rounds/orientation-reading.js';
import { HEADING_SET_ROUNDS } from '../../modules/rounds/round-assessor.service.js';
import { RoundDecision } from '../../modules/rounds/round-review.entity.js';
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
  /** The last round was mapped this many days (and two hours) before the moment the demo is seeded. */
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
/** The ISRM strength grade whose UCS band holds a strength (ISRM 1981, from memory). */
const strengthGradeOf = (ucs: number): string =>
  STRENGTH_GRADES.isrm.find((r) => r.ucsMPa && ucs >= r.ucsMPa[0] && ucs < r.ucsMPa[1])?.code ?? 'R6';
/** Point-load factor of the demo: UCS ≈ 22 × Is50 (Broch & Franklin 1972 about 24; from memory). */
const POINT_LOAD_FACTOR = 22;
const SHIFT_MS = 12 * 3600_000;

export async function seedDemoRounds(
  manager: EntityManager,
  plan: DemoRoundsPlan,
  heading: Heading,
  classes: SupportClass[],
  mappedBy: string,
  /** The demo engineer, who signed the confirmations of the past rounds (invented history). */
  engineer?: { id: string; name: string },
): Promise<void> {
  const random = rng(plan.heading.split('').reduce((s, c) => s * 31 + c.charCodeAt(0), 7));
  const project = await manager.findOneByOrFail(Project, { id: heading.projectId });
  // No round is dated in the future: the last one was mapped two hours (plus endsDaysAgo days) before now,
  // each earlier one a shift (12 h) before the next; dates and shifts in the project's time zone.
  const lastMappedAt = Date.now() - 2 * 3600_000 - plan.endsDaysAgo * 24 * 3600_000;
  const rules = await manager.find(TriggerRule, { where: { projectId: heading.projectId } });
  const earlier: Array<{
    id: string;
    roundId: string;
    faceChainage: number;
    dipDirection: number;
    dip: number;
  }> = [];
  // The sets each round found, oldest first: the heading's sets the next round's are matched to (as the
  // API's headingSetsBefore reads them from the stored assessments).
  const roundSets: Array<{ chainage: number; sets: RoundSet[] }> = [];
  let previousClassId: string | null | undefined = undefined;
  // The last round's values and conditions, for rules that fire on a change (none in the demo plan).
  let previousValues: PreviousRoundValues | undefined = undefined;
  let previousFace = heading.startChainage;
  // Each round is as long as the last round's class allows (its next round length): in the fault zone the
  // heading advances by the short rounds its support class sets, not by the planned length.
  let roundLength = plan.roundLength;
  for (let i = 1; i <= plan.count; i++) {
    const t = (i - 1) / Math.max(1, plan.count - 1);
    const faultHere = plan.fault !== null && i >= plan.fault.fromRound;
    // Chainage follows the heading's sense: on a heading driven against the chainage it decreases.
    const face = nextFaceChainage(previousFace, roundLength, heading.chainageSense);
    const drive = driveOf({ ...heading, driveTrend: driveTrendAt(heading, face) });
    const mappedAt = new Date(lastMappedAt - (plan.count - i) * SHIFT_MS);
    const { shiftDate, shift } = shiftOf(mappedAt, project.timeZone);

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
      // Three or four joints of each set on a face: enough for the sets to stand out of the density.
      const n = 3 + Math.floor(random() * 2);
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
      // The crushed rock beside the fault carries random joints besides the sets (Jn: three sets and random).
      for (const plane of [
        { dipDirection: Math.round(random() * 3600) / 10, dip: 20 + Math.round(random() * 60) },
        { dipDirection: Math.round(random() * 3600) / 10, dip: 20 + Math.round(random() * 60) },
      ])
        entries.push({ kind: 'joint', plane, notation: 'dip-direction/dip', label: '' });
      entries.push({
        kind: 'fault',
        plane: jitter(plan.fault, 3),
        notation: 'dip-direction/dip',
        label: plan.fault.label,
        fault: true,
      });
    }

    // On the first faces a dozen joints are too few for the sets to stand out of the density by themselves:
    // the geologist says how many sets there are (as the Joints section asks); later faces pool their
    // neighbours within the default window and need no count.
    const setParameters =
      i <= 3 ? { ...DEFAULT_SET_PARAMETERS, count: plan.sets.length } : DEFAULT_SET_PARAMETERS;
    const worst = plan.sets
      .map((s) => rmrOrientationInTunnel(s, drive).assessment)
      .reduce((a, b) => (ORDER[b] > ORDER[a] ? b : a), 'very favourable' as RmrOrientationAssessment);
    // Joint spacing closes toward the fault; the rock around the fault is crushed (0.12 m).
    const spacingM = faultHere ? 0.12 : Math.round((0.9 - 0.5 * t) * 100) / 100;
    // RQD agrees with the spacing recorded: Jv = Σ 1/spacing over the sets, RQD = 115 − 3.3 Jv
    // (Palmström 1982, via geomath rqdFromJv).
    const rqd = Math.round(rqdFromJv(jvFromSpacings(plan.sets.map(() => spacingM)), 1982));
    // Jr and Ja of the fault rounds come from the fault, the weakest significant discontinuity: a clay-gouge
    // zone with no wall contact, Jr 1 and Ja 8 (crushed soft zone) then 13 (thick soft clay band) (Barton et
    // al. 1974; NGI 2015 tables). SRF 2.5: a single weakness zone with clay (NGI 2015, from memory).
    const thickClay = faultHere && plan.fault !== null && i >= plan.fault.fromRound + 2;
    const faultJa = thickClay ? 13 : 8;
    const qInput: QRecord = {
      rqd,
      jn: (faultHere ? 3 : 0) + (plan.sets.length >= 3 ? 9 : 4),
      jr: faultHere ? 1 : t < 0.5 ? 2 : 1.5,
      ja: faultHere ? faultJa : t < 0.6 ? 1 : 2,
      jw: faultHere ? 0.66 : 1,
      srf: faultHere ? 2.5 : 1,
      ...(faultHere ? { jrRowId: 'jr-clay-zone' } : {}),
    };
    const is50 = Math.round((6.5 - 3.5 * t) * 10) / 10;
    const inflowLpm = Math.round((faultHere ? 30 : Math.round(3 + 12 * t)) * roundLength) / 10;
    const inflowPer10m = (inflowLpm * 10) / roundLength;
    const rmrInput: RmrRecord = {
      strength: { kind: 'point-load', is50 },
      rqd,
      spacingM,
      condition: {
        kind: 'simple',
        condition: faultHere
          ? 'soft-gouge-or-wide-open'
          : t < 0.5
            ? 'slightly-rough-slightly-weathered'
            : 'slightly-rough-highly-weathered',
      },
      // Water once: the rating reads the inflow per 10 m of the Ground record below (l/min to 0.1 over the
      // round's length), so the value typed with the rating is that same number.
      groundwater: { kind: 'inflow', litresPerMinutePer10m: Math.round(inflowPer10m * 10) / 10 },
      orientation: { kind: 'assessment', assessment: worst },
    };
    const ratings = computeRatings({ qInput, rmrInput, gsiObserved: null });
    // When Q and RMR89 point to different classes, the more cautious one is suggested (and recommended here).
    const suggestion = explainSuggestion(classes, ratings.q.value, ratings.rmr.value);
    const recommended = classes.find((c) => c.id === suggestion.suggested);
    const reason = suggestion.fitting.length ? '' : suggestion.reason;
    const status =
      i === plan.count && plan.lastDraft ? 'draft' : i >= plan.count - 1 ? 'submitted' : 'confirmed';
    const saved = manager.create(Round, {
      id: randomUUID(),
      projectId: heading.projectId,
      headingId: heading.id,
      stage: plan.stage,
      roundNumber: i,
      faceChainage: face,
      previousChainage: previousFace,
      roundLength,
      shiftDate,
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
            // Is50 × factor agrees with the grade (ISRM 1981 strength bands, from memory).
            strengthGrade: strengthGradeOf(is50 * POINT_LOAD_FACTOR),
          },
        ],
        pointLoadIs50: is50,
        pointLoadFactor: POINT_LOAD_FACTOR,
        // Water once: the inflow over the round's length; RMR89 A5 and the trigger read it.
        inflowLpm,
        inflowLengthM: roundLength,
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
      recommendationReason: reason,
      setParameters,
      status,
      revision: 1,
      submittedAt: status === 'draft' ? null : new Date(Math.min(mappedAt.getTime() + 3600_000, Date.now())),
    });
    if (status === 'confirmed' && engineer) {
      // The past rounds of the scenario were confirmed by the demo engineer, as recommended.
      saved.confirmedClassId = saved.recommendedClassId;
      saved.confirmedRoundLength = saved.nextRoundLength;
      saved.confirmedAt = new Date(Math.min(mappedAt.getTime() + 2 * 3600_000, Date.now()));
    }
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
        spacingM: e.fault ? null : spacingM,
        persistenceM: e.fault ? 20 : 3,
        apertureMm: e.fault ? 40 : 0.5,
        jr: e.fault ? 1 : faultHere ? 1.5 : qInput.jr,
        jrc: null,
        jrcMethod: null,
        infill: e.fault ? (plan.fault?.infill ?? '') : '',
        ja: e.fault ? faultJa : faultHere ? 2 : qInput.ja,
        water: e.fault ? 'dripping' : 'damp',
        thicknessM: e.fault ? (plan.fault?.thicknessM ?? null) : null,
        notes: '',
        faceOffset: null,
      });
    });
    // The record keeps which discontinuity Jr and Ja came from: the fault where it crosses the face.
    const faultJoint = jointRows.find((j) => j.kind === 'fault');
    if (faultJoint) {
      qInput.governingJointId = faultJoint.id;
      saved.qInput = qInput;
    }
    // The same assessment the API makes on save (packages/domain), frozen for rounds past draft.
    const assessment = assessRound(
      {
        faceChainage: face,
        roundLength,
        ground: saved.ground,
        joints: jointRows.map((j) => ({
          id: j.id,
          kind: j.kind,
          dipDirection: j.dipDirection,
          dip: j.dip,
          setLabel: j.setLabel,
          setOverride: false,
          spacingM: j.spacingM,
          seq: j.seq,
          jr: j.jr,
          ja: j.ja,
          apertureMm: j.apertureMm,
          infill: j.infill,
          thicknessM: j.thicknessM,
        })),
        qInput,
        rmrInput,
        gsiObserved: null,
        recommendedClassId: saved.recommendedClassId,
        setParameters,
      },
      {
        heading: headingGeometry(heading, plan.stage, face),
        supportClasses: classes,
        nearbyJoints: earlier.filter(
          (e) => Math.abs(e.faceChainage - face) <= DEFAULT_SET_PARAMETERS.windowM,
        ),
        headingSets: headingSetsOf(roundSets.slice(-HEADING_SET_ROUNDS)),
        previousRound:
          previousClassId === undefined
            ? null
            : { classId: previousClassId, ...(previousValues ? { values: previousValues } : {}) },
        rules,
        qTableEdition: project.qTableEdition,
        groundScale: project.groundScale,
        // The demo's register holds no hazard while its rounds are mapped.
        openHazards: [],
      },
    );
    for (const j of jointRows)
      j.setLabel = assessment.sets.membership[j.id] || (j.kind === 'fault' ? j.setLabel : null);
    roundSets.push({ chainage: face, sets: assessment.sets.sets });
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
    if (status === 'confirmed' && engineer && saved.confirmedAt) {
      await manager.save(
        manager.create(RoundRevision, {
          id: randomUUID(),
          roundId: saved.id,
          revision: 1,
          event: 'confirm',
          status: 'confirmed',
          record: {
            ...recordOf(saved, jointRows),
            confirmedClassId: saved.confirmedClassId,
            confirmedRoundLength: saved.confirmedRoundLength,
          },
          assessment,
          assessmentVersion: assessment.version,
          createdBy: engineer.id,
        }),
      );
      await manager.save(
        manager.create(RoundDecision, {
          id: randomUUID(),
          roundId: saved.id,
          projectId: saved.projectId,
          revision: 1,
          decision: 'confirm',
          classId: saved.confirmedClassId,
          roundLength: saved.confirmedRoundLength,
          recommendedClassId: saved.recommendedClassId,
          reason: '',
          comments: '',
          signedBy: engineer.id,
          signedName: engineer.name,
          signedRole: 'engineer',
          signedAt: saved.confirmedAt,
        }),
      );
    }
    previousClassId = saved.recommendedClassId;
    previousValues = previousRoundValues(assessment.facts, headingGeometry(heading, plan.stage, face));
    previousFace = face;
    roundLength = saved.nextRoundLength ?? plan.roundLength;
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
