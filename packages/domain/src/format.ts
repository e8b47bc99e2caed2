// Formatters shared by every screen, e-mail and report (one implementation each).
import { formatChainage as geomathChainage, normalizeAzimuth } from '@roundbook/geomath';
import type { ChainageStyle } from '@roundbook/geomath';
import { levelLabels, type TriggerLevel } from './vocabulary.js';

/** Azimuth as three digits and a degree sign: 47.4 → "047°"; with decimals: 132.5 → "132.5°". */
export function formatAzimuth(degrees: number, decimals = 0): string {
  const factor = 10 ** decimals;
  const value = normalizeAzimuth(Math.round(degrees * factor) / factor);
  const [whole, frac] = value.toFixed(decimals).split('.');
  const padded = whole.padStart(3, '0');
  return `${frac !== undefined && Number(frac) !== 0 ? `${padded}.${frac}` : padded}°`;
}

/** A plane as dip direction / dip, e.g. "047/62". */
export function formatDipDirectionDip(plane: { dipDirection: number; dip: number }): string {
  const dd = String(normalizeAzimuth(Math.round(plane.dipDirection))).padStart(3, '0');
  const dip = String(Math.round(plane.dip)).padStart(2, '0');
  return `${dd}/${dip}`;
}

export interface ChainageStyleOf {
  chainageStyle: ChainageStyle;
  chainageDecimals?: number;
}

/** Chainage in the heading's own style (km+m or metres, with its decimals). */
export function formatChainageFor(metres: number, heading: ChainageStyleOf): string {
  return geomathChainage(metres, { style: heading.chainageStyle, decimals: heading.chainageDecimals ?? 1 });
}

/** Chainage in the trade's km+m form with one decimal: 1250 → "1+250.0". */
export function formatChainage(metres: number): string {
  return geomathChainage(metres, { style: 'km+m', decimals: 1 });
}

/**
 * Q with sensible figures (two significant figures below 10, whole numbers above 10, as Q is read from
 * tables of rough steps): 0.0412 → "0.041", 0.25 → "0.25", 4.17 → "4.2", 33.3 → "33" [common practice].
 */
export function formatQ(q: number): string {
  if (!Number.isFinite(q)) return '—';
  if (q >= 10) return String(Math.round(q));
  return String(Number(q.toPrecision(2)));
}

/**
 * A number rounded as it is printed, so that a comparison and its text agree (never "Q 0.1 < 0.1").
 * Q is compared at the figures formatQ prints; other values at three significant figures.
 */
export function roundedAsPrinted(value: number, what: 'q' | 'other' = 'other'): number {
  return what === 'q' ? Number(formatQ(value)) : Number(value.toPrecision(3));
}

/**
 * A round's trigger level in words (issue 10, item 8): the level when it has one; "not evaluated (n rules)"
 * while n enabled rules still lack their data, so a round without data never reads as green or as having no
 * rules; "no rules" only when no rule applies.
 */
export function triggerLevelText(level: TriggerLevel | null, notEvaluated: number): string {
  if (level !== null) return levelLabels[level];
  if (notEvaluated > 0) return `not evaluated (${notEvaluated} ${notEvaluated === 1 ? 'rule' : 'rules'})`;
  return 'no rules';
}

/** The Q-system's range and its message (Barton et al. 1974: Q from 0.001 to 1000). */
export const Q_RANGE = { min: 0.001, max: 1000, message: 'Q runs from 0.001 to 1000.' } as const;
/** RMR89's range (Bieniawski 1989: the ratings add up to 0–100). */
export const RMR_RANGE = { min: 0, max: 100, message: 'RMR89 runs from 0 to 100.' } as const;
/** GSI's range (Hoek & Marinos 2000 chart: 0–100). */
export const GSI_RANGE = { min: 0, max: 100, message: 'GSI runs from 0 to 100.' } as const;

const dateTimeOptions: Intl.DateTimeFormatOptions = {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
};

/** Date and time in the project's own time zone, e.g. "1 Dec 2026, 14:05". */
export function formatProjectTime(iso: string | Date, timeZone: string): string {
  const date = typeof iso === 'string' ? new Date(iso) : iso;
  if (Number.isNaN(date.getTime())) return String(iso);
  try {
    return new Intl.DateTimeFormat('en-GB', { ...dateTimeOptions, timeZone }).format(date);
  } catch {
    return new Intl.DateTimeFormat('en-GB', dateTimeOptions).format(date);
  }
}

/**
 * A moment near `now` in the project's time zone: the clock time alone ("14:30") on the same calendar day,
 * otherwise the date and time ("2 Dec 2026, 14:30"), so a time read on site is never a day out.
 */
export function formatProjectTimeNear(iso: string | Date, timeZone: string, now: Date = new Date()): string {
  const date = typeof iso === 'string' ? new Date(iso) : iso;
  if (Number.isNaN(date.getTime())) return String(iso);
  const day = (d: Date, zone: string | undefined) =>
    new Intl.DateTimeFormat('en-CA', {
      timeZone: zone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
    }).format(d);
  let zone: string | undefined = timeZone;
  try {
    day(date, zone);
  } catch {
    zone = undefined;
  }
  if (day(date, zone) !== day(now, zone)) return formatProjectTime(date, timeZone);
  return new Intl.DateTimeFormat('en-GB', {
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZone: zone,
  }).format(date);
}

/**
 * A calendar date (YYYY-MM-DD, no time zone) as "2 Dec 2026", or "Wed 2 Dec 2026" with the weekday, the same
 * whatever the browser's language.
 */
export function formatCalendarDate(isoDate: string, options: { weekday?: boolean } = {}): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) return isoDate;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), 12));
  return new Intl.DateTimeFormat('en-GB', {
    weekday: options.weekday ? 'short' : undefined,
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  })
    .format(date)
    .replace(',', '');
}

/** A calendar date moved by whole days: ("2026-12-01", -1) → "2026-11-30"; anything unreadable unchanged. */
export function addCalendarDays(isoDate: string, days: number): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) return isoDate;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]) + days));
  return date.toISOString().slice(0, 10);
}

/**
 * The shift a moment falls in, in the project's time zone: 06:00–18:00 is the day shift of that date;
 * 18:00–06:00 the night shift of the date it began (so 02:00 on the 2nd belongs to the night of the 1st).
 */
export function shiftOf(at: Date, timeZone: string): { shiftDate: string; shift: 'day' | 'night' } {
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-CA', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      hourCycle: 'h23',
    })
      .formatToParts(at)
      .map((p) => [p.type, p.value]),
  ) as Record<string, string>;
  const hour = Number(parts.hour);
  const date = `${parts.year}-${parts.month}-${parts.day}`;
  if (hour >= 6 && hour < 18) return { shiftDate: date, shift: 'day' };
  if (hour >= 18) return { shiftDate: date, shift: 'night' };
  const d = new Date(`${date}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() - 1);
  return { shiftDate: d.toISOString().slice(0, 10), shift: 'night' };
}
