import type { HandoverSummary } from '@/api/contract';

// Chainage, azimuth, stage and time words are packages/domain's (one implementation for every screen,
// e-mail and report); what is only the Board's lives here.
export { formatAzimuth, formatChainage, formatProjectTime, stageLabels } from '@roundbook/domain';

/** Gradient with its sign, as the drive sees it: +0.5 % rises, −0.5 % falls. */
export function formatGradient(percent: number): string {
  if (percent === 0) return 'level (0 %)';
  const value = Math.abs(percent).toFixed(Math.abs(percent) < 1 ? 2 : 1);
  return percent > 0 ? `rising +${value} %` : `falling −${value} %`;
}

export type HandoverState = 'none' | 'waiting' | 'overdue' | 'acknowledged';

export function handoverState(handover: HandoverSummary | null): HandoverState {
  if (handover === null) return 'none';
  if (handover.acknowledgedAt !== null) return 'acknowledged';
  return handover.overdue ? 'overdue' : 'waiting';
}
