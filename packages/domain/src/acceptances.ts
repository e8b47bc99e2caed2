// Accepted standing conditions (issue 11, item 3). An engineer who has assessed a fired rule's condition
// (for example a known set striking along the drive, already covered by the support class) accepts it for a
// chainage range or until a date, with a reason. While the acceptance holds, the rule is listed as accepted
// and does not raise the round's level; it is raised again when the face leaves the range, the date passes,
// or the condition changes (a new adverse set, a steeper dip, a lower value, another class). The acceptance
// keeps a snapshot of what fired, and each later round's condition is compared with it here.
import { angleBetweenPlanes } from '@roundbook/geomath';
import { formatChainage, formatDipDirectionDip, formatQ, roundedAsPrinted } from './format.js';
import {
  adverseItems,
  evaluateRuleOutcome,
  nearestCrownReach,
  WATCH_KIND,
  type HeadingGeometry,
  type RoundFacts,
  type TriggerAssessment,
  type TriggerFiring,
  type TriggerRuleInput,
  type Watched,
} from './triggers.js';
import { LEVEL_RANK, type TriggerLevel } from './vocabulary.js';

/**
 * Roundbook's tolerances for "the same condition" (our own choices, not published values): an adverse
 * plane within 15° of an accepted one is the same set or feature, unless it dips more than 5° steeper;
 * a crown crossing within 1 m of the accepted one is the same plane.
 */
export const ACCEPTANCE_TOLERANCE = { sameSetDeg: 15, steeperDeg: 5, crownChainageM: 1 } as const;

/** The shortest reason an acceptance of a red rule takes (a written reason, not a word). */
export const RED_ACCEPTANCE_REASON_MIN = 20;

/** What fired when the condition was accepted, with the values it fired on. */
export interface ConditionSnapshot {
  watch: Watched;
  level: TriggerLevel;
  /**
   * Numeric rules: the value that fired, as printed. The crown rule: the chainage where the nearest plane
   * reaches the crown. The hazard rule: how many open red hazards. Adverse orientation and class change: null.
   */
  value: number | null;
  /** Adverse orientation: the adverse sets and features with their mean planes. */
  adverse: Array<{ label: string; kind: 'set' | 'feature'; dipDirection: number; dip: number }>;
  /** The open red hazards (ids) when accepted. */
  hazardIds: string[];
  /** The support class recommended when accepted: another class raises the rule again. */
  classId: string | null;
  /** The rule's words when it fired. */
  detail: string;
  /**
   * Set when the rule fired on a change from the last round. A numeric change rule then keeps in `value`
   * the round's own value the change reached (as printed), and the change itself here.
   */
  fires?: 'change';
  change?: number | null;
}

/** One acceptance as the evaluation reads it. */
export interface TriggerAcceptanceInput {
  id: string;
  ruleId: string;
  /** The chainage range it holds for (either end open when null). */
  fromChainage: number | null;
  toChainage: number | null;
  /** It holds until this time (ISO 8601), when given. */
  until: string | null;
  reason: string;
  acceptedByName: string;
  acceptedAt: string;
  snapshot: ConditionSnapshot;
}

/** A fired rule that an active acceptance holds: listed, but it does not raise the level. */
export interface AcceptedFiring extends TriggerFiring {
  acceptanceId: string;
  reason: string;
  acceptedByName: string;
  acceptedAt: string;
  fromChainage: number | null;
  toChainage: number | null;
  until: string | null;
}

/** A fired rule whose acceptance no longer holds, and why: it raises the level again. */
export interface LapsedAcceptance {
  ruleId: string;
  acceptanceId: string;
  why: string;
}

/** The trigger assessment with the acceptances applied. */
export interface AcceptedTriggerAssessment extends TriggerAssessment {
  accepted: AcceptedFiring[];
  lapsed: LapsedAcceptance[];
}

type RuleShape = Pick<TriggerRuleInput, 'watch' | 'comparison' | 'threshold' | 'level' | 'fires'>;

const NUMERIC_VALUE = {
  q: 'q',
  rmr89: 'rmr',
  'inflow-per-10m': 'inflowPer10m',
  overbreak: 'overbreakM3',
} as const;

const printed = (watch: Watched, v: number): number => roundedAsPrinted(v, watch === 'q' ? 'q' : 'other');

/** The condition of a rule on a round, when it fires there; null when it does not fire. */
export function conditionSnapshot(
  rule: RuleShape,
  round: RoundFacts,
  heading: HeadingGeometry,
): ConditionSnapshot | null {
  const o = evaluateRuleOutcome(rule, round, heading);
  if (o.state !== 'fired') return null;
  const base: ConditionSnapshot = {
    watch: rule.watch,
    level: rule.level,
    value: null,
    adverse: [],
    hazardIds: [],
    classId: round.recommendedClassId,
    detail: o.detail,
  };
  switch (rule.watch) {
    case 'q':
    case 'rmr89':
    case 'inflow-per-10m':
    case 'overbreak': {
      if (rule.fires === 'change') {
        // What was accepted is the ground the fall (or rise) reached, not the size of one step.
        const reached = round[NUMERIC_VALUE[rule.watch]];
        return {
          ...base,
          fires: 'change',
          change: o.value,
          value: reached === null ? null : printed(rule.watch, reached),
        };
      }
      return { ...base, value: o.value === null ? null : printed(rule.watch, o.value) };
    }
    case 'crown-crossing-within': {
      const hit = nearestCrownReach(round, heading);
      return { ...base, value: hit ? Math.round(hit.chainage * 100) / 100 : null };
    }
    case 'adverse-orientation':
      return {
        ...base,
        ...(rule.fires === 'change' ? { fires: 'change' as const } : {}),
        adverse: adverseItems(round, heading).map((a) => ({
          label: a.label,
          kind: a.kind,
          dipDirection: Math.round(a.plane.dipDirection * 10) / 10,
          dip: Math.round(a.plane.dip * 10) / 10,
        })),
      };
    case 'open-red-hazard': {
      const red = (round.openHazards ?? []).filter((h) => h.level === 'red');
      return {
        ...base,
        ...(rule.fires === 'change' ? { fires: 'change' as const } : {}),
        value: red.length,
        hazardIds: red.map((h) => h.id).sort(),
      };
    }
    case 'support-class-change':
      return base;
    case 'round-over-class-length':
      return { ...base, ...(rule.fires === 'change' ? { fires: 'change' as const } : {}), value: o.value };
  }
}

const valueText = (watch: Watched, v: number): string => (watch === 'q' ? formatQ(v) : String(v));

/**
 * Why the condition now differs from the accepted one, or null when it is the same (or milder). A rule of
 * "below" is worse at a lower value, "above" at a higher one, "equal" at any other value. A change rule
 * that fires again is held while the ground it reaches is no worse than the accepted: for Q, RMR89,
 * inflow and overbreak the round's own value (a fall rule is worse below the value the accepted fall
 * reached, a rise rule above it); for a yes/no condition that newly appears again, the condition itself
 * as for a rule of the value.
 */
export function conditionChange(
  rule: Pick<TriggerRuleInput, 'watch' | 'comparison' | 'fires'>,
  accepted: ConditionSnapshot,
  now: ConditionSnapshot,
): string | null {
  if ((accepted.fires ?? 'value') !== (rule.fires ?? 'value'))
    return rule.fires === 'change'
      ? 'the rule fires on a change from the last round now, not on the value as accepted'
      : 'the rule fires on the value now, not on a change from the last round as accepted';
  if (accepted.classId !== null && now.classId !== accepted.classId)
    return 'the recommended support class is not the one the condition was accepted with';
  const label = WATCH_KIND[rule.watch].label;
  switch (rule.watch) {
    case 'q':
    case 'rmr89':
    case 'inflow-per-10m':
    case 'overbreak': {
      if (accepted.value === null || now.value === null) return null;
      const a = accepted.value;
      const b = now.value;
      const worse =
        rule.comparison === '<' || rule.comparison === '<='
          ? b < a
          : rule.comparison === '>' || rule.comparison === '>='
            ? b > a
            : b !== a;
      if (!worse) return null;
      return rule.fires === 'change'
        ? `${label} is ${valueText(rule.watch, b)} now, beyond the ${valueText(rule.watch, a)} the accepted change reached`
        : `${label} is ${valueText(rule.watch, b)} now, against ${valueText(rule.watch, a)} when accepted`;
    }
    case 'crown-crossing-within': {
      if (accepted.value === null || now.value === null) return null;
      return Math.abs(now.value - accepted.value) > ACCEPTANCE_TOLERANCE.crownChainageM
        ? `a plane now reaches the crown at ${formatChainage(now.value)}, not at ${formatChainage(accepted.value)} as accepted`
        : null;
    }
    case 'adverse-orientation': {
      for (const item of now.adverse) {
        const plane = { dipDirection: item.dipDirection, dip: item.dip };
        const near = accepted.adverse.filter(
          (a) =>
            a.kind === item.kind &&
            angleBetweenPlanes(plane, { dipDirection: a.dipDirection, dip: a.dip }) <=
              ACCEPTANCE_TOLERANCE.sameSetDeg,
        );
        const shown = formatDipDirectionDip({
          dipDirection: Math.round(item.dipDirection),
          dip: Math.round(item.dip),
        });
        if (near.length === 0)
          return `a new adverse ${item.kind === 'set' ? 'set' : 'feature'}: ${item.label} (${shown})`;
        if (near.every((a) => item.dip > a.dip + ACCEPTANCE_TOLERANCE.steeperDeg)) {
          const was = Math.max(...near.map((a) => a.dip));
          return `${item.label} dips steeper: ${Math.round(item.dip)}° against ${Math.round(was)}° when accepted`;
        }
      }
      return null;
    }
    case 'open-red-hazard': {
      const added = now.hazardIds.filter((id) => !accepted.hazardIds.includes(id));
      return added.length
        ? `${added.length === 1 ? 'a new open red hazard' : `${added.length} new open red hazards`} since the acceptance`
        : null;
    }
    case 'support-class-change':
      return null; // the class itself is compared above
    case 'round-over-class-length':
      if (accepted.value === null || now.value === null) return null;
      return now.value > accepted.value
        ? `the round is longer: ${now.value} m against ${accepted.value} m when accepted`
        : null;
  }
}

/** Why an acceptance no longer holds at this face and time (range ended, date passed), or null. */
export function acceptanceLapse(
  acceptance: Pick<TriggerAcceptanceInput, 'fromChainage' | 'toChainage' | 'until'>,
  faceChainage: number,
  at: Date,
): string | null {
  if (acceptance.until !== null && at.getTime() > new Date(acceptance.until).getTime())
    return `the acceptance ran until ${acceptance.until.slice(0, 10)}`;
  const { fromChainage: a, toChainage: b } = acceptance;
  const low = a === null ? b : b === null ? a : Math.min(a, b);
  const high = a === null ? b : b === null ? a : Math.max(a, b);
  if (a !== null && b !== null) {
    if (faceChainage < low! || faceChainage > high!)
      return `the face at ${formatChainage(faceChainage)} is outside the accepted range ${formatChainage(low!)}–${formatChainage(high!)}`;
  } else if (a !== null && faceChainage < a) {
    return `the face at ${formatChainage(faceChainage)} is before the accepted range from ${formatChainage(a)}`;
  } else if (b !== null && faceChainage > b) {
    return `the face at ${formatChainage(faceChainage)} is past the accepted range to ${formatChainage(b)}`;
  }
  return null;
}

/** Field errors for an acceptance: a range or a date, and a reason (a red rule needs a written one). */
export function acceptanceErrors(
  level: TriggerLevel,
  input: { fromChainage: number | null; toChainage: number | null; until: string | null; reason: string },
  now: Date,
): Record<string, string> {
  const fields: Record<string, string> = {};
  if (input.fromChainage === null && input.toChainage === null && input.until === null)
    fields.toChainage = 'Give the chainage range or the date the acceptance holds until.';
  if (input.until !== null) {
    const t = new Date(input.until).getTime();
    if (Number.isNaN(t)) fields.until = 'Give the date as 2026-12-31.';
    else if (t <= now.getTime()) fields.until = 'The date has passed: choose a later one.';
  }
  const reason = input.reason.trim();
  if (level === 'red' && reason.length < RED_ACCEPTANCE_REASON_MIN)
    fields.reason = `A red rule is accepted only with your written reason (at least ${RED_ACCEPTANCE_REASON_MIN} characters).`;
  else if (reason.length < 3) fields.reason = 'Say why the condition is accepted.';
  return fields;
}

/**
 * Applies the active acceptances to a trigger assessment: a fired rule whose acceptance holds (inside its
 * range, before its date, the same condition) moves to `accepted` and does not raise the level; one whose
 * acceptance lapsed stays fired, with why in `lapsed`. The level is worked out again as assessTriggers does.
 */
export function applyAcceptances(
  triggers: TriggerAssessment,
  rules: Array<Pick<TriggerRuleInput, 'id' | 'watch' | 'comparison' | 'threshold' | 'level' | 'fires'>>,
  round: RoundFacts,
  heading: HeadingGeometry,
  acceptances: TriggerAcceptanceInput[],
  at: Date,
): AcceptedTriggerAssessment {
  const accepted: AcceptedFiring[] = [];
  const lapsed: LapsedAcceptance[] = [];
  const firings: TriggerFiring[] = [];
  for (const firing of triggers.firings) {
    const rule = rules.find((r) => r.id === firing.ruleId);
    const mine = acceptances
      .filter((a) => a.ruleId === firing.ruleId)
      .sort((a, b) => b.acceptedAt.localeCompare(a.acceptedAt));
    if (!rule || mine.length === 0) {
      firings.push(firing);
      continue;
    }
    const now = conditionSnapshot(rule, round, heading);
    let holding: TriggerAcceptanceInput | null = null;
    let why: { id: string; text: string } | null = null;
    for (const a of mine) {
      const lapse =
        acceptanceLapse(a, round.faceChainage, at) ??
        (a.snapshot.level !== rule.level
          ? `the rule's level is ${rule.level} now, not ${a.snapshot.level} as accepted`
          : now === null
            ? null
            : conditionChange(rule, a.snapshot, now));
      if (lapse === null) {
        holding = a;
        break;
      }
      why ??= { id: a.id, text: lapse };
    }
    if (holding) {
      accepted.push({
        ...firing,
        acceptanceId: holding.id,
        reason: holding.reason,
        acceptedByName: holding.acceptedByName,
        acceptedAt: holding.acceptedAt,
        fromChainage: holding.fromChainage,
        toChainage: holding.toChainage,
        until: holding.until,
      });
    } else {
      firings.push(firing);
      if (why) lapsed.push({ ruleId: firing.ruleId, acceptanceId: why.id, why: why.text });
    }
  }
  firings.sort((a, b) => LEVEL_RANK[b.level] - LEVEL_RANK[a.level]);
  const level: TriggerLevel | null =
    firings[0]?.level ?? (triggers.evaluated > 0 && triggers.notEvaluated.length === 0 ? 'green' : null);
  return { ...triggers, level, firings, accepted, lapsed };
}
