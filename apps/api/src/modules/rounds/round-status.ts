// The only place a round's status changes. Every transition of the round's life is listed here, with the
// statuses it may start from; anything else is refused with a clear 409.
import type { RoundStatus } from '@roundbook/domain';
import { statusLabels } from '@roundbook/domain';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';

export const ROUND_EVENTS = ['submit', 'confirm', 'return', 'correct'] as const;
export type RoundEvent = (typeof ROUND_EVENTS)[number];

/** From which statuses each event may happen, where it leads, and whether it opens a new revision. */
export const ROUND_TRANSITIONS: Record<
  RoundEvent,
  { from: readonly RoundStatus[]; to: RoundStatus; newRevision: boolean }
> = {
  /** The geologist hands the round in for review. */
  submit: { from: ['draft', 'returned'], to: 'submitted', newRevision: false },
  /** The engineer confirms it; it is locked from then on. */
  confirm: { from: ['submitted'], to: 'confirmed', newRevision: false },
  /** The engineer sends it back: a draft of a new revision for the geologist. */
  return: { from: ['submitted'], to: 'returned', newRevision: true },
  /** A correction after confirmation: a new revision that goes through review again. */
  correct: { from: ['confirmed'], to: 'draft', newRevision: true },
};

/** Statuses in which the geologist may edit the record. */
export const EDITABLE_STATUSES: readonly RoundStatus[] = ['draft', 'returned'];

export const isEditable = (status: RoundStatus): boolean => EDITABLE_STATUSES.includes(status);

export function canTransition(status: RoundStatus, event: RoundEvent): boolean {
  return ROUND_TRANSITIONS[event].from.includes(status);
}

/** Applies the event to the round (status and revision), or refuses it. */
export function applyTransition(
  round: { status: RoundStatus; revision: number },
  event: RoundEvent,
): { from: RoundStatus; to: RoundStatus; revision: number } {
  const t = ROUND_TRANSITIONS[event];
  if (!t.from.includes(round.status)) {
    const message =
      event === 'submit'
        ? `This round is already ${round.status}.`
        : `A ${statusLabels[round.status].toLowerCase()} round cannot be ${pastTense[event]}.`;
    throw new DomainException(ErrorCode.Conflict, message);
  }
  const from = round.status;
  round.status = t.to;
  if (t.newRevision) round.revision += 1;
  return { from, to: t.to, revision: round.revision };
}

const pastTense: Record<RoundEvent, string> = {
  submit: 'submitted',
  confirm: 'confirmed',
  return: 'returned',
  correct: 'corrected',
};

/** The refusal for an edit of a round that is not editable. */
export function assertEditable(status: RoundStatus): void {
  if (!isEditable(status))
    throw new DomainException(
      ErrorCode.Conflict,
      `This round is ${status}; it can no longer be edited here.`,
    );
}
