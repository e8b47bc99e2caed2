import { formatChainage as formatKmChainage, normalizeAzimuth } from '@roundbook/geomath';
import type { ExcavationStage, HandoverSummary } from '@/api/contract';

/** Chainage in the trade's kilometre+metre form with one decimal: 1250 → "1+250.0" (from geomath). */
export function formatChainage(metres: number): string {
  return formatKmChainage(metres, { style: 'km+m', decimals: 1 });
}

/** Azimuth as three digits and a degree sign: 47.4 → "047°". */
export function formatAzimuth(degrees: number): string {
  const whole = normalizeAzimuth(Math.round(degrees));
  return `${String(whole).padStart(3, '0')}°`;
}

/** Gradient with its sign, as the drive sees it: +0.5 % rises, −0.5 % falls. */
export function formatGradient(percent: number): string {
  if (percent === 0) return 'level (0 %)';
  const value = Math.abs(percent).toFixed(Math.abs(percent) < 1 ? 2 : 1);
  return percent > 0 ? `rising +${value} %` : `falling −${value} %`;
}

export const stageLabels: Record<ExcavationStage, string> = {
  'full-face': 'Full face',
  'top-heading': 'Top heading',
  bench: 'Bench',
  invert: 'Invert',
};

/** Date and time in the project's own time zone, e.g. "1 Dec 2026, 14:05". */
export function formatProjectTime(iso: string, timeZone: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const options: Intl.DateTimeFormatOptions = {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  };
  try {
    return new Intl.DateTimeFormat('en-GB', { ...options, timeZone }).format(date);
  } catch {
    return new Intl.DateTimeFormat('en-GB', options).format(date);
  }
}

export type HandoverState = 'none' | 'waiting' | 'acknowledged';

export function handoverState(handover: HandoverSummary | null): HandoverState {
  if (handover === null) return 'none';
  return handover.acknowledgedAt === null ? 'waiting' : 'acknowledged';
}
