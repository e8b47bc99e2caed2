// Trigger rules as pure functions over a round's facts (product.md "Trigger rule"). The API evaluates them
// on save and in the Setup try-out; the browser shows the same words.
import {
  driveOf,
  fisherStatistics,
  planarSlidingOut,
  planeOfPole,
  poleOf,
  rmrOrientationInTunnel,
  stageCrossings,
  surfaceFacing,
} from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';
import type { AcceptedFiring, LapsedAcceptance } from './acceptances.js';
import {
  formatChainage,
  formatDipDirectionDip,
  formatQ,
  Q_RANGE,
  RMR_RANGE,
  roundedAsPrinted,
} from './format.js';
import { compareHazards, hazardKindLabels, hazardPlaceFromFace, type HazardFact } from './hazards.js';
import { LEVEL_RANK, SINGLE_FEATURE_KINDS, type TriggerLevel } from './vocabulary.js';

export const WATCHED = [
  'q',
  'rmr89',
  'inflow-per-10m',
  'overbreak',
  'adverse-orientation',
  'crown-crossing-within',
  'support-class-change',
  'open-red-hazard',
  'round-over-class-length',
] as const;
export type Watched = (typeof WATCHED)[number];
export const COMPARISONS = ['<', '<=', '>', '>=', '='] as const;
export type Comparison = (typeof COMPARISONS)[number];

/** How each watched quantity is judged, and its words. */
export const WATCH_KIND: Record<
  Watched,
  { kind: 'numeric' | 'distance' | 'flag'; label: string; unit: string }
> = {
  q: { kind: 'numeric', label: 'Q', unit: '' },
  rmr89: { kind: 'numeric', label: 'RMR89', unit: '' },
  'inflow-per-10m': { kind: 'numeric', label: 'Water inflow per 10 m', unit: 'l/min' },
  overbreak: { kind: 'numeric', label: 'Overbreak', unit: 'm³' },
  'adverse-orientation': { kind: 'flag', label: 'A set or feature adverse to the drive', unit: '' },
  'crown-crossing-within': {
    kind: 'distance',
    label: 'A mapped plane reaches the crown within',
    unit: 'm ahead',
  },
  'support-class-change': { kind: 'flag', label: 'Support class differs from the last round', unit: '' },
  'open-red-hazard': { kind: 'flag', label: 'Any open red hazard on the heading', unit: '' },
  'round-over-class-length': {
    kind: 'flag',
    label: 'Round longer than the support class of the last round allows',
    unit: '',
  },
};

export const comparisonSymbols: Record<Comparison, string> = {
  '<': '<',
  '<=': '≤',
  '>': '>',
  '>=': '≥',
  '=': '=',
};
export const comparisonLabels: Record<Comparison, string> = {
  '<': 'below (<)',
  '<=': 'at or below (≤)',
  '>': 'above (>)',
  '>=': 'at or above (≥)',
  '=': 'equal to (=)',
};

/**
 * How a rule fires (issue 11 item 3): on the round's own standing value ('value', the default), or on the
 * change from the previous round of the same heading and stage ('change').
 */
export const FIRES = ['value', 'change'] as const;
export type Fires = (typeof FIRES)[number];
export const firesLabels: Record<Fires, string> = {
  value: 'on the round’s value',
  change: 'on a change from the last round',
};

/** The yes/no watches that may fire on a change: only when the condition newly appears. */
export const FLAG_CHANGE_WATCHES = [
  'adverse-orientation',
  'open-red-hazard',
  'round-over-class-length',
] as const;
export type FlagChangeWatch = (typeof FLAG_CHANGE_WATCHES)[number];

/** Watches with a change form: the numeric ones, and the yes/no conditions that can newly appear. */
export const CHANGE_WATCHES: readonly Watched[] = [
  'q',
  'rmr89',
  'inflow-per-10m',
  'overbreak',
  ...FLAG_CHANGE_WATCHES,
];

/**
 * How a change rule measures the change of a numeric watch. Q is logarithmic, so its change is a ratio,
 * given in percent of the last round's Q (a fall from 4 to 1 is −75 %; common practice compares Q by
 * ratio); RMR89, inflow and overbreak change by a difference in their own unit.
 */
export const CHANGE_UNIT: Record<'q' | 'rmr89' | 'inflow-per-10m' | 'overbreak', string> = {
  q: ' %',
  rmr89: ' points',
  'inflow-per-10m': ' l/min per 10 m',
  overbreak: ' m³',
};

/** A change rule's comparison in words: "falls by more than 50 %", "rises by 20 l/min per 10 m or more". */
export function changeWords(watch: Watched, comparison: Comparison | null, threshold: number | null): string {
  const unit = CHANGE_UNIT[watch as keyof typeof CHANGE_UNIT] ?? '';
  if (comparison === null || threshold === null) return 'changes by ?';
  const t = Math.abs(threshold);
  const falls = comparison === '<' || comparison === '<=';
  if (comparison === '=') return `changes by exactly ${threshold}${unit}`;
  if (threshold === 0)
    return comparison === '<'
      ? 'falls'
      : comparison === '<='
        ? 'falls or stays the same'
        : comparison === '>'
          ? 'rises'
          : 'rises or stays the same';
  if (falls !== threshold < 0) return `changes by ${comparisonSymbols[comparison]} ${threshold}${unit}`;
  const verb = falls ? 'falls' : 'rises';
  return comparison === '<' || comparison === '>'
    ? `${verb} by more than ${t}${unit}`
    : `${verb} by ${t}${unit} or more`;
}

/** Rules that cannot fire until a later feature records what they watch (none at present). */
export const WAITING_RULES: Partial<Record<Watched, string>> = {};

export interface TriggerRuleInput {
  id: string;
  watch: Watched;
  comparison: Comparison | null;
  threshold: number | null;
  level: TriggerLevel;
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
  enabled: boolean;
  /** How it fires; absent: 'value' (rules stored before the choice existed). */
  fires?: Fires;
}

/** Field errors for a rule whose comparison and threshold do not suit what it watches. */
export function triggerRuleErrors(
  r: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'fires'>,
): Record<string, string> {
  const kind = WATCH_KIND[r.watch].kind;
  const fields: Record<string, string> = {};
  const fires = r.fires ?? 'value';
  if (!FIRES.includes(fires)) {
    fields.fires = 'Choose whether the rule fires on the round’s value or on a change from the last round.';
  } else if (fires === 'change' && !CHANGE_WATCHES.includes(r.watch)) {
    fields.fires =
      r.watch === 'support-class-change'
        ? 'This rule already compares the class with the last round’s: it fires on the value only.'
        : 'A crown-reach rule reads the round’s own look-ahead: it fires on the value only.';
  } else if (fires === 'change' && kind === 'numeric') {
    if (!r.comparison) fields.comparison = 'Choose whether the rule fires on a fall or on a rise.';
    if (r.threshold === null || r.threshold === undefined)
      fields.threshold = 'Give the change that fires it.';
    const falls = r.comparison === '<' || r.comparison === '<=';
    if (r.comparison === '=')
      fields.comparison =
        'A change rule fires on a fall (below, with a change of 0 or less such as −50) or on a rise (above, with a change of 0 or more).';
    else if (r.comparison && r.threshold != null && (falls ? r.threshold > 0 : r.threshold < 0))
      fields.threshold = falls
        ? 'A fall is a change of 0 or less: give it with a minus sign, e.g. −50.'
        : 'A rise is a change of 0 or more: give it without a minus sign.';
    else if (r.watch === 'q' && r.threshold != null && r.threshold <= -100)
      fields.threshold = 'Q cannot fall by 100 % or more: give a fall between 0 and −99 %.';
    else if (r.watch === 'rmr89' && r.threshold != null && Math.abs(r.threshold) > 100)
      fields.threshold = 'RMR89 changes by at most 100 points.';
    return fields;
  }
  if (kind === 'numeric') {
    if (!r.comparison) fields.comparison = 'Choose how the value is compared with the threshold.';
    if (r.threshold === null || r.threshold === undefined) fields.threshold = 'Give the threshold.';
    if (r.watch === 'q' && r.threshold != null && (r.threshold < Q_RANGE.min || r.threshold > Q_RANGE.max))
      fields.threshold = Q_RANGE.message;
    if (
      r.watch === 'rmr89' &&
      r.threshold != null &&
      (r.threshold < RMR_RANGE.min || r.threshold > RMR_RANGE.max)
    )
      fields.threshold = RMR_RANGE.message;
    if ((r.watch === 'inflow-per-10m' || r.watch === 'overbreak') && r.threshold != null && r.threshold < 0) {
      fields.threshold = 'The threshold cannot be negative.';
    }
  } else if (kind === 'distance') {
    if (r.threshold === null || r.threshold === undefined || r.threshold <= 0)
      fields.threshold = 'Give the distance ahead of the face, in metres.';
    if (r.comparison)
      fields.comparison =
        'This rule has no comparison: it fires when a plane reaches the crown within the distance.';
  } else {
    if (r.comparison) fields.comparison = 'This rule watches a yes/no condition and has no comparison.';
    if (r.threshold !== null && r.threshold !== undefined)
      fields.threshold = 'This rule watches a yes/no condition and has no threshold.';
  }
  return fields;
}

/** The rule in words, e.g. "Q < 0.1 → red". */
export function triggerRuleSummary(
  r: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'level' | 'fires'>,
): string {
  const w = WATCH_KIND[r.watch];
  const change = r.fires === 'change';
  const condition =
    change && w.kind === 'numeric'
      ? `${w.label} ${changeWords(r.watch, r.comparison, r.threshold)} from the last round`
      : change
        ? `${w.label}, newly (not on the last round)`
        : w.kind === 'numeric'
          ? `${w.label} ${comparisonSymbols[r.comparison ?? '=']} ${r.threshold ?? '?'}${w.unit ? ` ${w.unit}` : ''}`
          : w.kind === 'distance'
            ? `${w.label} ${r.threshold ?? '?'} ${w.unit}`
            : w.label;
  return `${condition} → ${r.level}`;
}

/** A joint as the rules read it (canonical orientation, set label, kind, and where it was mapped on the face). */
export interface FactJoint {
  id?: string;
  kind: string;
  setLabel: string | null;
  dipDirection: number | null;
  dip: number | null;
  /** Where the feature's trace crosses the face, metres right of and above the axis (face centre if absent). */
  faceOffset?: { right: number; up: number } | null;
  /** "Same feature as": the first observation of this feature on an earlier round (features.ts). */
  sameAsJointId?: string | null;
}

export interface RoundFacts {
  q: number | null;
  rmr: number | null;
  inflowPer10m: number | null;
  overbreakM3: number | null;
  faceChainage: number;
  recommendedClassId: string | null;
  previousClassId: string | null | undefined; // undefined: no previous round of this heading and stage
  joints: FactJoint[];
  /** The round's sets as found by its assessment; when absent the sets are the joints' labels. */
  sets?: Array<{ label: string; plane: Plane; count: number }>;
  /**
   * The heading's open hazards when the round was assessed (the register, any stage); absent in facts
   * stored before hazards were recorded, so the open-red-hazard rule is then not evaluated.
   */
  openHazards?: HazardFact[];
  /**
   * The round's length (face − previous face along the drive, m) and the longest round the support class
   * of the last round of this stage allows (null: that round has no class). Absent in facts stored before
   * the over-length rule existed, which then leaves that rule not evaluated.
   */
  roundLength?: number | null;
  allowedRoundLength?: number | null;
  /**
   * What the previous round of this heading and stage read, for the rules that fire on a change: null when
   * there is none (the first round of the stage); absent in facts stored before change rules existed, which
   * then leaves such a rule not evaluated.
   */
  previous?: PreviousRoundValues | null;
}

/** The previous round's values and yes/no conditions, as its own stored facts read. */
export interface PreviousRoundValues {
  q: number | null;
  rmr: number | null;
  inflowPer10m: number | null;
  overbreakM3: number | null;
  /** Whether each yes/no condition held on the previous round; null: it could not be judged there. */
  conditions: Partial<Record<FlagChangeWatch, boolean | null>>;
}

export interface HeadingGeometry {
  driveTrend: number;
  gradientPercent: number;
  profileHeight: number;
  profileWidth: number;
  axisHeight: number;
  /** +1 when chainage increases in the drive direction (default), −1 when it decreases. */
  chainageSense?: 1 | -1;
  /** Crown height above the axis and invert depth below it for the round's stage (default: the full profile). */
  stageCrownHeight?: number;
  stageInvertDepth?: number;
  /** Largest half-width of the stage's part, to its walls (default: half the profile width). */
  stageHalfWidth?: number;
  /** Friction angle of the joints for the face-sliding screen, degrees (default 30, common practice). */
  frictionAngle?: number;
}

export type Firing = { value: number | null; detail: string } | null;
export type RuleOutcome =
  | { state: 'fired'; value: number | null; detail: string }
  | { state: 'clear'; detail?: string }
  | { state: 'not-evaluated'; detail: string }
  | { state: 'waiting'; detail: string };

const compare = (a: number, op: Comparison, b: number): boolean =>
  op === '<' ? a < b : op === '<=' ? a <= b : op === '>' ? a > b : op === '>=' ? a >= b : a === b;

/** Mean plane of each labelled set (Fisher mean of the poles, axial), from the round's readable joints. */
export function setMeans(joints: FactJoint[]): Array<{ label: string; plane: Plane; count: number }> {
  const groups = new Map<string, Plane[]>();
  for (const j of joints) {
    if (!j.setLabel || j.dipDirection === null || j.dip === null) continue;
    groups.set(j.setLabel, [...(groups.get(j.setLabel) ?? []), { dipDirection: j.dipDirection, dip: j.dip }]);
  }
  return [...groups].map(([label, planes]) => ({
    label,
    count: planes.length,
    plane:
      planes.length === 1
        ? planes[0]
        : planeOfPole(fisherStatistics(planes.map(poleOf), { axial: true }).mean),
  }));
}

const readable = (j: FactJoint): j is FactJoint & { dipDirection: number; dip: number } =>
  j.dipDirection !== null && j.dip !== null;

/** One set or significant single feature found adverse to the drive, with its plane and why. */
export interface AdverseItem {
  label: string;
  /** 'set' for a set of joints, 'feature' for a fault or shear zone judged on its own. */
  kind: 'set' | 'feature';
  plane: Plane;
  reasons: string[];
}

/** Adverse sets and significant single features, as data: RMR89 assessment against the drive, and sliding out of the face. */
export function adverseItems(round: RoundFacts, heading: HeadingGeometry): AdverseItem[] {
  const drive = driveOf(heading);
  const sets = round.sets ?? setMeans(round.joints);
  const features = round.joints
    .filter((j) => SINGLE_FEATURE_KINDS.includes(j.kind as never))
    .filter(readable)
    .map((j, i) => ({
      label: `${j.kind === 'fault' ? 'fault' : 'shear zone'} ${i + 1}`,
      kind: 'feature' as const,
      plane: { dipDirection: j.dipDirection, dip: j.dip },
    }));
  const out: AdverseItem[] = [];
  const face = { facing: surfaceFacing(drive, 'face'), inclination: 90 };
  const friction = heading.frictionAngle ?? 30;
  for (const item of [
    ...sets.map((s) => ({ label: s.label, kind: 'set' as const, plane: s.plane })),
    ...features,
  ]) {
    const r = rmrOrientationInTunnel(item.plane, drive);
    const reasons: string[] = [];
    if (r.assessment === 'unfavourable' || r.assessment === 'very unfavourable')
      reasons.push(`is ${r.assessment} for the drive`);
    const slide = planarSlidingOut(item.plane, face, friction, 20);
    if (slide.flagged) reasons.push(`dips out of the face and can slide (friction ${friction}°)`);
    if (reasons.length) out.push({ ...item, reasons });
  }
  return out;
}

/** Adverse sets and significant single features in words (the adverse-orientation rule's detail). */
export function adverseFindings(round: RoundFacts, heading: HeadingGeometry): string[] {
  return adverseItems(round, heading).map((item) => {
    const shown = { dipDirection: Math.round(item.plane.dipDirection), dip: Math.round(item.plane.dip) };
    return `${item.label} (${formatDipDirectionDip(shown)}) ${item.reasons.join(' and ')}`;
  });
}

/** Where a mapped fault or shear zone meets the stage's part of the profile ahead of (or behind) the face. */
export interface FeatureReach {
  jointId: string | null;
  /**
   * The feature across rounds: the id of its first observation (features.ts featureKeyOf); the
   * heading's look-ahead lists a linked feature once. Absent in assessments frozen before links existed.
   */
  featureKey?: string | null;
  label: string;
  /** Distances along the drive from the face, m (negative: behind the face); null where it runs along. */
  distance: {
    crown: number | null;
    invert: number | null;
    rightWall: number | null;
    leftWall: number | null;
  };
  /** The same places as chainages, following the heading's chainage sense. */
  chainage: {
    crown: number | null;
    invert: number | null;
    rightWall: number | null;
    leftWall: number | null;
  };
  /** Whether the trace position on the face was recorded (else the face centre was used). */
  traceKnown: boolean;
}

/**
 * The look-ahead of the round's significant single features: where each reaches the crown, the invert and
 * the walls of the stage's own part of the profile (geomath stageCrossings, methods.md §6), measured from
 * its trace on the face when recorded (faceOffset), else from the face centre.
 */
export function featureReaches(round: RoundFacts, heading: HeadingGeometry): FeatureReach[] {
  const drive = driveOf(heading);
  const sense = heading.chainageSense ?? 1;
  const part = {
    crownHeight: heading.stageCrownHeight ?? heading.profileHeight - heading.axisHeight,
    invertDepth: heading.stageInvertDepth ?? heading.axisHeight,
    halfWidth: heading.stageHalfWidth ?? heading.profileWidth / 2,
  };
  const out: FeatureReach[] = [];
  let n = 0;
  for (const j of round.joints) {
    if (!SINGLE_FEATURE_KINDS.includes(j.kind as never) || !readable(j)) continue;
    n++;
    let c;
    try {
      c = stageCrossings(
        {
          plane: { dipDirection: j.dipDirection, dip: j.dip },
          chainage: 0,
          offset: j.faceOffset ?? { right: 0, up: 0 },
          drive,
        },
        part,
      );
    } catch {
      continue;
    }
    const d = { crown: c.crown, invert: c.invert, rightWall: c.rightWall, leftWall: c.leftWall };
    const at = (v: number | null): number | null => (v === null ? null : round.faceChainage + sense * v);
    out.push({
      jointId: j.id ?? null,
      featureKey: j.sameAsJointId ?? j.id ?? null,
      label: `${j.kind === 'fault' ? 'fault' : 'shear zone'} ${n}`,
      distance: d,
      chainage: {
        crown: at(d.crown),
        invert: at(d.invert),
        rightWall: at(d.rightWall),
        leftWall: at(d.leftWall),
      },
      traceKnown: j.faceOffset != null,
    });
  }
  return out;
}

/** Nearest distance ahead of the face at which a mapped fault or shear zone reaches the crown, m; null if none. */
export function nearestCrownReach(
  round: RoundFacts,
  heading: HeadingGeometry,
): { distance: number; chainage: number; reach: FeatureReach } | null {
  let best: { distance: number; chainage: number; reach: FeatureReach } | null = null;
  for (const r of featureReaches(round, heading)) {
    const c = r.distance.crown;
    if (c === null || c <= 0) continue;
    if (best === null || c < best.distance) best = { distance: c, chainage: r.chainage.crown!, reach: r };
  }
  return best;
}

const ahead = (what: string, v: number | null): string | null =>
  v === null
    ? null
    : v > 0
      ? `${what} ${v.toFixed(1)} m ahead`
      : `${what} ${(-v).toFixed(1)} m behind the face`;

/** The previous round's values as a change rule reads them, from that round's own facts and heading. */
export function previousRoundValues(facts: RoundFacts, heading: HeadingGeometry): PreviousRoundValues {
  const conditions: PreviousRoundValues['conditions'] = {};
  for (const watch of FLAG_CHANGE_WATCHES) {
    const o = evaluateRuleOutcome({ watch, comparison: null, threshold: null }, facts, heading);
    conditions[watch] = o.state === 'fired' ? true : o.state === 'clear' ? false : null;
  }
  return {
    q: facts.q,
    rmr: facts.rmr,
    inflowPer10m: facts.inflowPer10m,
    overbreakM3: facts.overbreakM3,
    conditions,
  };
}

/** The change a numeric change rule compares: Q in percent of the last round's, the others in their unit. */
export function numericChange(
  watch: 'q' | 'rmr89' | 'inflow-per-10m' | 'overbreak',
  previous: number,
  now: number,
): number | null {
  // Both values as they are printed, so that the sentence never contradicts itself.
  const kind = watch === 'q' ? 'q' : 'other';
  const a = roundedAsPrinted(previous, kind);
  const b = roundedAsPrinted(now, kind);
  if (watch === 'q') {
    if (a <= 0) return null;
    // Whole percent, halves away from zero (a fall of 62.5 % reads 63 %); a fall that would read 100 %
    // takes the decimals it needs (Q 11 → 0.028 fell by 99.7 %), since Q never reaches 0.
    const percent = (b / a - 1) * 100;
    const at = (digits: number): number =>
      (Math.sign(percent) * Math.round(Math.abs(percent) * 10 ** digits)) / 10 ** digits || 0;
    let digits = 0;
    while (at(digits) <= -100 && digits < 6) digits++;
    return at(digits);
  }
  return Number((b - a).toPrecision(3));
}

const NUMERIC_FACT = {
  q: { fact: 'q', what: 'Q' },
  rmr89: { fact: 'rmr', what: 'RMR89' },
  'inflow-per-10m': { fact: 'inflowPer10m', what: 'Inflow' },
  overbreak: { fact: 'overbreakM3', what: 'Overbreak' },
} as const;

/** A change rule against one round: the change from the previous round of the heading and stage. */
function changeOutcome(
  rule: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold'>,
  round: RoundFacts,
  heading: HeadingGeometry,
): RuleOutcome {
  if (!CHANGE_WATCHES.includes(rule.watch))
    return { state: 'not-evaluated', detail: 'this rule has no change form' };
  if (round.previous === null || (round.previous === undefined && round.previousClassId === undefined))
    return { state: 'clear', detail: 'first round of this stage: nothing to compare with' };
  if (round.previous === undefined)
    return {
      state: 'not-evaluated',
      detail: 'the last round’s values were not kept with this round’s facts',
    };
  const previous = round.previous;
  if (rule.watch in NUMERIC_FACT) {
    const watch = rule.watch as keyof typeof NUMERIC_FACT;
    const { fact, what } = NUMERIC_FACT[watch];
    const now = round[fact];
    const before = previous[fact];
    if (now === null) return { state: 'not-evaluated', detail: `${what} is not recorded yet` };
    if (before === null)
      return { state: 'not-evaluated', detail: `${what} was not recorded on the last round` };
    if (!rule.comparison || rule.threshold === null)
      return { state: 'not-evaluated', detail: 'incomplete rule' };
    const change = numericChange(watch, before, now);
    if (change === null) return { state: 'not-evaluated', detail: `${what} of the last round is 0` };
    if (!compare(change, rule.comparison, rule.threshold)) return { state: 'clear' };
    const unit = CHANGE_UNIT[watch];
    const text = (v: number): string => (watch === 'q' ? formatQ(v) : String(roundedAsPrinted(v)));
    const valueUnit = watch === 'q' || watch === 'rmr89' ? '' : unit;
    const moved =
      change < 0 ? `fell by ${-change}${unit}` : change > 0 ? `rose by ${change}${unit}` : 'did not change';
    return {
      state: 'fired',
      value: change,
      detail: `${what} ${moved} from the last round (${text(before)} → ${text(now)}${valueUnit}); the rule fires when it ${changeWords(
        watch,
        rule.comparison,
        rule.threshold,
      )}`,
    };
  }
  const watch = rule.watch as FlagChangeWatch;
  const o = evaluateRuleOutcome({ watch, comparison: null, threshold: null }, round, heading);
  if (o.state !== 'fired') return o;
  const was = previous.conditions[watch];
  if (was === undefined || was === null)
    return {
      state: 'not-evaluated',
      detail:
        'whether the condition held on the last round is not known, so it cannot be told whether it is new',
    };
  if (was) return { state: 'clear', detail: 'the condition already held on the last round' };
  return { state: 'fired', value: o.value, detail: `New since the last round: ${o.detail}` };
}

/** One rule against one round: fired, clear, not evaluated (its input is missing) or waiting (cannot fire yet). */
export function evaluateRuleOutcome(
  rule: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'fires'>,
  round: RoundFacts,
  heading: HeadingGeometry,
): RuleOutcome {
  if (rule.fires === 'change') return changeOutcome(rule, round, heading);
  const numeric = (
    value: number | null,
    what: string,
    unit = '',
    kind: 'q' | 'other' = 'other',
  ): RuleOutcome => {
    if (value === null) return { state: 'not-evaluated', detail: `${what} is not recorded yet` };
    if (!rule.comparison || rule.threshold === null)
      return { state: 'not-evaluated', detail: 'incomplete rule' };
    // Compare the value as it is printed, so that the sentence never contradicts itself.
    const shown = roundedAsPrinted(value, kind);
    const text = kind === 'q' ? formatQ(value) : String(shown);
    return compare(shown, rule.comparison, rule.threshold)
      ? {
          state: 'fired',
          value,
          detail: `${what} ${text}${unit} ${rule.comparison} ${rule.threshold}${unit}`,
        }
      : { state: 'clear' };
  };
  const readableJoints = round.joints.filter(readable);
  switch (rule.watch) {
    case 'q':
      return numeric(round.q, 'Q', '', 'q');
    case 'rmr89':
      return numeric(round.rmr, 'RMR89');
    case 'inflow-per-10m':
      return numeric(round.inflowPer10m, 'Inflow', ' l/min per 10 m');
    case 'overbreak':
      return numeric(round.overbreakM3, 'Overbreak', ' m³');
    case 'support-class-change':
      if (round.recommendedClassId === null)
        return { state: 'not-evaluated', detail: 'no support class recommended yet' };
      if (round.previousClassId === undefined) return { state: 'clear', detail: 'first round of this stage' };
      return round.recommendedClassId !== round.previousClassId
        ? { state: 'fired', value: null, detail: 'The recommended class differs from the last round’s.' }
        : { state: 'clear' };
    case 'adverse-orientation': {
      if (readableJoints.length === 0 && (round.sets ?? []).length === 0)
        return { state: 'not-evaluated', detail: 'no readable joints recorded yet' };
      const found = adverseFindings(round, heading);
      return found.length ? { state: 'fired', value: null, detail: found.join('; ') } : { state: 'clear' };
    }
    case 'crown-crossing-within': {
      if (rule.threshold === null) return { state: 'not-evaluated', detail: 'incomplete rule' };
      if (readableJoints.length === 0)
        return { state: 'not-evaluated', detail: 'no readable joints recorded yet' };
      const hit = nearestCrownReach(round, heading);
      if (hit === null || hit.distance > rule.threshold) return { state: 'clear' };
      const d = hit.reach.distance;
      const others = [
        ahead('the invert', d.invert),
        ahead('the right wall', d.rightWall),
        ahead('the left wall', d.leftWall),
      ]
        .filter((x): x is string => x !== null)
        .join(', ');
      return {
        state: 'fired',
        value: hit.distance,
        detail: `The mapped ${hit.reach.label} reaches the crown ${hit.distance.toFixed(1)} m ahead of the face${
          hit.reach.traceKnown ? '' : ' (trace position not recorded: from the face centre)'
        }${others ? `; ${others}` : ''}`,
      };
    }
    case 'round-over-class-length': {
      // The round just excavated was built under the class of the last round (confirmed, or recommended
      // while not yet confirmed): a longer round than that class allows is a finding, not only a warning.
      if (round.roundLength === undefined)
        return { state: 'not-evaluated', detail: 'the round length was not kept with these facts' };
      if (round.previousClassId === undefined) return { state: 'clear', detail: 'first round of this stage' };
      if (round.roundLength === null) return { state: 'not-evaluated', detail: 'no round length yet' };
      if (round.allowedRoundLength === null || round.allowedRoundLength === undefined)
        return { state: 'not-evaluated', detail: 'the last round has no support class yet' };
      // Compared at the centimetres the screens print (3.50 m is not over 3.5 m).
      const length = Math.round(round.roundLength * 100) / 100;
      const allowed = Math.round(round.allowedRoundLength * 100) / 100;
      return length > allowed
        ? {
            state: 'fired',
            value: length,
            detail: `The round is ${length} m long; the support class of the last round allows ${allowed} m.`,
          }
        : { state: 'clear' };
    }
    case 'open-red-hazard': {
      // Any open red hazard on the heading fires, wherever its range lies: a red hazard behind the face is
      // still in the ground the crews pass and work under, and it stays red until someone closes it.
      if (round.openHazards === undefined)
        return { state: 'not-evaluated', detail: 'the heading’s open hazards were not read for this round' };
      const red = round.openHazards
        .filter((h) => h.level === 'red')
        .sort((a, b) => compareHazards(a, b, heading.chainageSense === -1 ? 'decreasing' : 'increasing'));
      if (red.length === 0) return { state: 'clear' };
      const place = (h: HazardFact): string => {
        const p = hazardPlaceFromFace(
          h,
          round.faceChainage,
          heading.chainageSense === -1 ? 'decreasing' : 'increasing',
        );
        return p.where === 'at-face'
          ? 'reaching this face'
          : `${p.distance.toFixed(1)} m ${p.where === 'behind' ? 'behind' : 'ahead of'} this face`;
      };
      const range = (h: HazardFact): string =>
        h.fromChainage === h.toChainage
          ? `at ${formatChainage(h.fromChainage)}`
          : `${formatChainage(h.fromChainage)}–${formatChainage(h.toChainage)}`;
      return {
        state: 'fired',
        value: red.length,
        detail: `${red.length === 1 ? 'Open red hazard' : `${red.length} open red hazards`}: ${red
          .map((h) => `${hazardKindLabels[h.kind].toLowerCase()} ${range(h)} (${place(h)})`)
          .join('; ')}`,
      };
    }
  }
}

/** One rule against one round: the firing, or null when it does not fire (for any reason). */
export function evaluateRule(
  rule: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'fires'>,
  round: RoundFacts,
  heading: HeadingGeometry,
): Firing {
  const o = evaluateRuleOutcome(rule, round, heading);
  return o.state === 'fired' ? { value: o.value, detail: o.detail } : null;
}

export interface TriggerFiring {
  ruleId: string;
  level: TriggerLevel;
  summary: string;
  detail: string;
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
}

export interface TriggerAssessment {
  /**
   * The highest level among the rules that fire; green only when every enabled rule could be evaluated and
   * none fires; null when the project has no enabled rule, or when none fires but some still lack their data.
   */
  level: TriggerLevel | null;
  firings: TriggerFiring[];
  /** Rules whose input is missing on this round, with why. */
  notEvaluated: Array<{ ruleId: string; summary: string; detail: string }>;
  /** Rules that cannot fire yet (what they watch is not recorded by Roundbook yet). */
  waiting: Array<{ ruleId: string; summary: string; detail: string }>;
  /** Enabled rules that were evaluated (fired or clear). */
  evaluated: number;
  /** Fired rules held by an engineer's acceptance of a standing condition (they do not raise the level). */
  accepted?: AcceptedFiring[];
  /** Fired rules whose acceptance no longer holds, and why. */
  lapsed?: LapsedAcceptance[];
}

/** The trigger level of a round from the project's enabled rules, firings red first. */
export function assessTriggers(
  rules: Array<
    Pick<
      TriggerRuleInput,
      | 'id'
      | 'watch'
      | 'comparison'
      | 'threshold'
      | 'level'
      | 'action'
      | 'ownerRole'
      | 'timeAllowedHours'
      | 'enabled'
      | 'fires'
    >
  >,
  round: RoundFacts,
  heading: HeadingGeometry,
  summaryOf: (
    rule: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'level' | 'fires'>,
  ) => string = triggerRuleSummary,
): TriggerAssessment {
  const active = rules.filter((r) => r.enabled);
  const firings: TriggerFiring[] = [];
  const notEvaluated: TriggerAssessment['notEvaluated'] = [];
  const waiting: TriggerAssessment['waiting'] = [];
  let evaluated = 0;
  for (const rule of active) {
    const o = evaluateRuleOutcome(rule, round, heading);
    if (o.state === 'waiting') waiting.push({ ruleId: rule.id, summary: summaryOf(rule), detail: o.detail });
    else if (o.state === 'not-evaluated')
      notEvaluated.push({ ruleId: rule.id, summary: summaryOf(rule), detail: o.detail });
    else {
      evaluated++;
      if (o.state === 'fired')
        firings.push({
          ruleId: rule.id,
          level: rule.level,
          summary: summaryOf(rule),
          detail: o.detail,
          action: rule.action,
          ownerRole: rule.ownerRole,
          timeAllowedHours: rule.timeAllowedHours,
        });
    }
  }
  firings.sort((a, b) => LEVEL_RANK[b.level] - LEVEL_RANK[a.level]);
  const level: TriggerLevel | null =
    firings[0]?.level ?? (evaluated > 0 && notEvaluated.length === 0 ? 'green' : null);
  return { level, firings, notEvaluated, waiting, evaluated };
}
