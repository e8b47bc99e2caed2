import { gsiFromRmr89, parsePlane, qValue, rmr89, type PlaneNotation } from '@roundbook/geomath';
import type { SupportClass } from '../support-classes/support-class.entity.js';
import type { RatingOutcomeDto, RoundRatingsDto } from './dto/round.dto.js';
import type { QRecord, RmrRecord } from './round.entity.js';

/** Every number here comes from packages/geomath; this file only adapts records to its inputs. */

const message = (e: unknown): string => (e instanceof Error ? e.message : String(e));
const empty = (): RatingOutcomeDto => ({ value: null, label: null, error: null, parts: {} });

export function readOrientation(
  text: string,
  notation: PlaneNotation,
): { dipDirection: number; dip: number } | { error: string } {
  if (!text.trim()) return { error: 'No orientation entered yet.' };
  try {
    const plane = parsePlane(text, { notation });
    return {
      dipDirection: Math.round(plane.dipDirection * 100) / 100,
      dip: Math.round(plane.dip * 100) / 100,
    };
  } catch (e) {
    return { error: message(e) };
  }
}

export function computeRatings(input: {
  qInput: QRecord | null;
  rmrInput: RmrRecord | null;
  gsiObserved: number | null;
}): RoundRatingsDto {
  const q = empty();
  if (input.qInput) {
    try {
      const r = qValue(input.qInput);
      q.value = r.q;
      q.label = r.rockClass;
      q.parts = {
        rqdUsed: r.rqdUsed,
        jnUsed: r.jnUsed,
        jrUsed: r.jrUsed,
        ja: input.qInput.ja,
        jw: input.qInput.jw,
        srf: input.qInput.srf,
      };
    } catch (e) {
      q.error = message(e);
    }
  }
  const rmr = empty();
  const gsi = empty();
  if (input.rmrInput) {
    try {
      const r = rmr89(input.rmrInput);
      rmr.value = r.total;
      rmr.label = `class ${r.rockClass} (${r.meaning.description})`;
      rmr.parts = { ...r.ratings, basic: r.basic, dryUnadjusted: r.dryUnadjusted };
      if (input.gsiObserved === null) {
        try {
          gsi.value = gsiFromRmr89(r.dryUnadjusted);
          gsi.label = 'from RMR89 (dry, no orientation adjustment)';
          gsi.parts = { rmr89Dry: r.dryUnadjusted };
        } catch (e) {
          gsi.error = message(e);
        }
      }
    } catch (e) {
      rmr.error = message(e);
    }
  }
  if (input.gsiObserved !== null) {
    gsi.value = input.gsiObserved;
    gsi.label = 'read from the GSI chart at the face';
  }
  return { q, rmr, gsi };
}

/**
 * Support classes whose ranges fit the ratings: every range a class defines for which the round has a value
 * must contain it (Q [qMin, qMax), RMR89 [rmrMin, rmrMax]), and at least one range must be checked.
 * Retired classes are never suggested.
 */
export function suggestClasses(classes: SupportClass[], q: number | null, rmr: number | null): string[] {
  return classes
    .filter((c) => !c.retired)
    .filter((c) => {
      const hasQ = c.qMin !== null || c.qMax !== null;
      const hasRmr = c.rmrMin !== null || c.rmrMax !== null;
      const checks: boolean[] = [];
      if (hasQ && q !== null) checks.push(q >= (c.qMin ?? 0) && q < (c.qMax ?? Infinity));
      if (hasRmr && rmr !== null) checks.push(rmr >= (c.rmrMin ?? 0) && rmr <= (c.rmrMax ?? 100));
      return checks.length > 0 && checks.every(Boolean);
    })
    .sort((a, b) => a.sortOrder - b.sortOrder)
    .map((c) => c.id);
}

/** Inflow per 10 m of tunnel from the inflow and the length it comes from (l/min per 10 m). */
export function inflowPer10m(inflowLpm: number | null, lengthM: number | null): number | null {
  if (inflowLpm === null || lengthM === null || lengthM <= 0) return null;
  return (inflowLpm * 10) / lengthM;
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

export function roundWarnings(
  r: { roundLength: number | null; faceChainage: number; previousChainage: number | null },
  plannedRoundLength: number,
  maxRoundLength: number | null,
): string[] {
  const w: string[] = [];
  if (r.roundLength !== null) {
    if (r.roundLength < 0)
      w.push(`The round length is negative (${r.roundLength} m): check the face and previous chainages.`);
    else if (r.roundLength === 0) w.push('The round length is zero: check the face and previous chainages.');
    else if (r.roundLength > plannedRoundLength)
      w.push(`The round length ${r.roundLength} m is over the planned ${plannedRoundLength} m.`);
    if (maxRoundLength !== null && r.roundLength > maxRoundLength) {
      w.push(
        `The round length ${r.roundLength} m is over the ${maxRoundLength} m allowed by the support class of the last round.`,
      );
    }
  }
  return w;
}
