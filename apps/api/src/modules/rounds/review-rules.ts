// Pure rules of the review: what a confirmation needs, how the engineer's queue is ordered, and how much
// time each fired rule has left. No queries here (unit-tested in review-rules.spec.ts).
import { LEVEL_RANK, type TriggerFiring, type TriggerLevel } from '@roundbook/domain';
import { REVIEW_EMAIL_CAUTION } from '../../infrastructure/mail/templates/review.email.js';

/** The caution shown on every review and confirmation screen and e-mail (product.md "Cautions"). */
export const REVIEW_CAUTION = REVIEW_EMAIL_CAUTION;

/** A reason must say something: this many characters at least (after trimming). */
export const MIN_REASON_LENGTH = 5;

export interface ConfirmChoice {
  classId: string;
  roundLength: number;
  reason: string;
}

/**
 * What a confirmation still lacks, by field: a class other than the recommended one, or a round longer
 * than the chosen class allows, needs the engineer's reason.
 */
export function confirmationErrors(
  choice: ConfirmChoice,
  recommendedClassId: string | null,
  chosenClass: { code: string; maxRoundLength: number; retired: boolean },
): Record<string, string> {
  const fields: Record<string, string> = {};
  const needs: string[] = [];
  if (chosenClass.retired) fields.classId = `${chosenClass.code} is retired; choose an active class.`;
  if (choice.classId !== recommendedClassId) needs.push(`${chosenClass.code} is not the recommended class`);
  if (choice.roundLength > chosenClass.maxRoundLength)
    needs.push(`${chosenClass.code} allows rounds of up to ${chosenClass.maxRoundLength} m`);
  if (needs.length && choice.reason.trim().length < MIN_REASON_LENGTH)
    fields.reason = `${needs.join('; ')}: say why.`;
  return fields;
}

/** Whether the reason is needed for this choice (the screen asks for it only then). */
export function reasonNeeded(
  classId: string,
  roundLength: number | null,
  recommendedClassId: string | null,
  maxRoundLength: number,
): boolean {
  return classId !== recommendedClassId || (roundLength !== null && roundLength > maxRoundLength);
}

export interface RuleClock {
  ruleId: string;
  level: TriggerLevel;
  summary: string;
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
  /** When the owner's timeframe ends: the time the round was submitted plus the rule's allowed time. */
  dueAt: string;
  /** Minutes left (negative once overdue). */
  minutesLeft: number;
  /** Past its time without an acknowledgement by its owner. */
  overdue: boolean;
  /** When its owner acknowledged it (null: not yet). */
  acknowledgedAt: string | null;
}

/**
 * Each fired rule's clock, counted from the submit (when the rule's owner could first see it). A rule its
 * owner has acknowledged is never overdue.
 */
export function ruleClocks(
  firings: TriggerFiring[],
  submittedAt: Date,
  now: Date,
  acknowledged: ReadonlyMap<string, Date> = new Map(),
): RuleClock[] {
  return firings.map((f) => {
    const due = new Date(submittedAt.getTime() + f.timeAllowedHours * 3_600_000);
    const minutesLeft = Math.floor((due.getTime() - now.getTime()) / 60_000);
    const ack = acknowledged.get(f.ruleId) ?? null;
    return {
      ruleId: f.ruleId,
      level: f.level,
      summary: f.summary,
      action: f.action,
      ownerRole: f.ownerRole,
      timeAllowedHours: f.timeAllowedHours,
      dueAt: due.toISOString(),
      minutesLeft,
      overdue: ack === null && due.getTime() <= now.getTime(),
      acknowledgedAt: ack?.toISOString() ?? null,
    };
  });
}

/** The queue's order: red first, then amber, green and not assessed; within a level the oldest first. */
export function byQueueOrder(
  a: { triggerLevel: TriggerLevel | null; submittedAt: string; id: string },
  b: { triggerLevel: TriggerLevel | null; submittedAt: string; id: string },
): number {
  const rank = (l: TriggerLevel | null) => (l === null ? -1 : LEVEL_RANK[l]);
  return (
    rank(b.triggerLevel) - rank(a.triggerLevel) ||
    a.submittedAt.localeCompare(b.submittedAt) ||
    a.id.localeCompare(b.id)
  );
}

/**
 * The class the next round's class-change rule compares with: the previous round's confirmed class once
 * the engineer has confirmed it, otherwise the class the geologist recommended.
 */
export const classOfRound = (r: {
  confirmedClassId: string | null;
  recommendedClassId: string | null;
}): string | null => r.confirmedClassId ?? r.recommendedClassId;
