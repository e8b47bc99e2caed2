import { Badge } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import { CheckmarkCircleFilled, ClockRegular, WarningFilled } from '@fluentui/react-icons';
import { formatProjectTime, formatProjectTimeNear } from '@roundbook/domain';
import type { ReactElement } from 'react';
import type { Handover } from '@/features/handovers/api/handovers';

export type HandoverStateKind = 'overdue' | 'waiting' | 'acknowledged';

/** Where a handover stands for acknowledgement, in words, colour and mark (never colour alone). */
export function handoverState(
  h: Pick<Handover, 'status' | 'overdue' | 'ackDueAt' | 'acknowledgedAt' | 'acknowledgedBy' | 'timeZone'>,
  now: Date = new Date(),
): { kind: HandoverStateKind; label: string } {
  if (h.status === 'acknowledged') {
    const at = h.acknowledgedAt ? ` ${formatProjectTime(h.acknowledgedAt, h.timeZone)}` : '';
    const by = h.acknowledgedBy ? ` by ${h.acknowledgedBy.name}` : '';
    return { kind: 'acknowledged', label: `Acknowledged${at}${by}` };
  }
  const due = formatProjectTimeNear(h.ackDueAt, h.timeZone, now);
  if (h.overdue) return { kind: 'overdue', label: `Overdue — was due by ${due}` };
  return { kind: 'waiting', label: `Waiting — due by ${due}` };
}

/** Overdue first, then waiting, then acknowledged; newest first within each (the list's order is kept). */
export function overdueFirst(list: Handover[]): Handover[] {
  const rank: Record<HandoverStateKind, number> = { overdue: 0, waiting: 1, acknowledged: 2 };
  return list
    .map((h, i) => ({ h, i, r: rank[handoverState(h).kind] }))
    .sort((a, b) => a.r - b.r || a.i - b.i)
    .map((x) => x.h);
}

const looks: Record<HandoverStateKind, { color: BadgeProps['color']; icon: ReactElement }> = {
  overdue: { color: 'danger', icon: <WarningFilled /> },
  waiting: { color: 'warning', icon: <ClockRegular /> },
  acknowledged: { color: 'success', icon: <CheckmarkCircleFilled /> },
};

export const emailWords: Record<Handover['emailStatus'], string> = {
  queued: 'E-mail waiting to be sent',
  sent: 'E-mail sent',
  failed: 'E-mail could not be sent',
};

/** The handover's acknowledgement state as one badge: mark, colour and words together. */
export function HandoverStateBadge({ handover }: { handover: Handover }) {
  const state = handoverState(handover);
  const look = looks[state.kind];
  return (
    <Badge
      size="extra-large"
      shape="rounded"
      appearance="filled"
      color={look.color}
      icon={look.icon}
      data-state={state.kind}
    >
      {state.label}
    </Badge>
  );
}
