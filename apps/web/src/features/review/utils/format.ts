import type { ReviewSection } from '@/features/review/api/review';

/** A span of minutes as people on shift say it: "45 min", "3 h 20 min", "2 d 4 h". */
export function formatMinutes(minutes: number): string {
  const m = Math.max(0, Math.round(minutes));
  if (m < 60) return `${m} min`;
  const hours = Math.floor(m / 60);
  if (hours < 48) return m % 60 === 0 ? `${hours} h` : `${hours} h ${m % 60} min`;
  const days = Math.floor(hours / 24);
  return hours % 24 === 0 ? `${days} d` : `${days} d ${hours % 24} h`;
}

/** The time left against a rule's timeframe, or how long it is overdue. */
export function formatTimeLeft(minutesLeft: number, overdue: boolean): string {
  return overdue ? `Overdue by ${formatMinutes(-minutesLeft)}` : `${formatMinutes(minutesLeft)} left`;
}

/** The sections a return comment may concern, in the order of the round screen. */
export const sectionLabels: Record<ReviewSection, string> = {
  position: 'Position',
  ground: 'Ground',
  joints: 'Joints',
  ratings: 'Ratings',
  support: 'Support',
  triggers: 'Triggers',
  general: 'General',
};
export const SECTIONS = Object.keys(sectionLabels) as ReviewSection[];

/** Whether the engineer's choice needs a reason: another class than recommended, or a longer round. */
export function needsReason(
  classId: string,
  roundLength: number | null,
  recommendedClassId: string | null,
  maxRoundLength: number | undefined,
): boolean {
  if (classId !== '' && classId !== recommendedClassId) return true;
  return roundLength !== null && maxRoundLength !== undefined && roundLength > maxRoundLength;
}
