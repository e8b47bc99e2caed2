/**
 * Warnings about the support-class library's rating ranges: overlaps, gaps and order. Q ranges are read as
 * [qMin, qMax) over Q 0.001–1000 (the Q-system's range); RMR89 ranges as whole numbers [rmrMin, rmrMax]
 * over 0–100. A null bound is open; a class with both bounds null has no range in that system. Retired
 * classes are left out. The library is ordered best ground first, so ranges should fall as the order rises.
 */
export interface CoverageClass {
  code: string;
  sortOrder: number;
  qMin: number | null;
  qMax: number | null;
  rmrMin: number | null;
  rmrMax: number | null;
  retired?: boolean;
}

export interface RangeWarning {
  kind: 'overlap' | 'gap' | 'order';
  system: 'Q' | 'RMR89';
  classes: string[];
  message: string;
}

const Q_LOW = 0.001;
const Q_HIGH = 1000;

interface Span {
  code: string;
  order: number;
  lo: number;
  hi: number;
}

const fmtQ = (q: number): string =>
  q >= 1 ? String(Number(q.toPrecision(4))) : String(Number(q.toPrecision(2)));

function sweep(
  spans: Span[],
  low: number,
  high: number,
  system: 'Q' | 'RMR89',
  fmt: (v: number) => string,
  step: number,
): RangeWarning[] {
  const warnings: RangeWarning[] = [];
  const sorted = [...spans].sort((a, b) => a.lo - b.lo || a.hi - b.hi);
  let covered = low;
  let coveredBy: Span | null = null;
  for (const s of sorted) {
    if (s.lo > covered + step / 2) {
      const gapHi = step === 0 ? s.lo : s.lo - step;
      warnings.push({
        kind: 'gap',
        system,
        classes: coveredBy ? [coveredBy.code, s.code] : [s.code],
        message: `No class covers ${system} ${step === 0 ? `from ${fmt(covered)} to ${fmt(gapHi)}` : covered === gapHi ? fmt(covered) : `${fmt(covered)}–${fmt(gapHi)}`}.`,
      });
    } else if (coveredBy && s.lo < covered - step / 2) {
      const overlapHi = Math.min(covered, s.hi + step) - step;
      warnings.push({
        kind: 'overlap',
        system,
        classes: [coveredBy.code, s.code],
        message: `${coveredBy.code} and ${s.code} both cover ${system} ${step === 0 ? `${fmt(s.lo)} to ${fmt(Math.min(covered, s.hi))}` : s.lo === overlapHi ? fmt(s.lo) : `${fmt(s.lo)}–${fmt(overlapHi)}`}.`,
      });
    }
    const end = s.hi + step;
    if (end > covered) {
      covered = end;
      coveredBy = s;
    }
  }
  if (sorted.length > 0 && covered < high + step / 2) {
    warnings.push({
      kind: 'gap',
      system,
      classes: coveredBy ? [coveredBy.code] : [],
      message: `No class covers ${system} ${step === 0 ? `from ${fmt(covered)} to ${fmt(high)}` : covered === high ? fmt(high) : `${fmt(covered)}–${fmt(high)}`}.`,
    });
  }
  // Order: best ground first, so a class later in the list should not reach higher than an earlier one.
  const byOrder = [...spans].sort((a, b) => a.order - b.order);
  for (let i = 1; i < byOrder.length; i++) {
    const prev = byOrder[i - 1];
    const cur = byOrder[i];
    if (cur.lo > prev.lo && cur.hi > prev.hi) {
      warnings.push({
        kind: 'order',
        system,
        classes: [prev.code, cur.code],
        message: `${cur.code} covers better ground (${system}) than ${prev.code}, which comes before it; the list runs from best ground to worst.`,
      });
    }
  }
  return warnings;
}

export function supportClassWarnings(classes: CoverageClass[]): RangeWarning[] {
  const active = classes.filter((c) => !c.retired);
  const q: Span[] = active
    .filter((c) => c.qMin !== null || c.qMax !== null)
    .map((c) => ({
      code: c.code,
      order: c.sortOrder,
      lo: Math.max(c.qMin ?? Q_LOW, Q_LOW),
      hi: Math.min(c.qMax ?? Q_HIGH, Q_HIGH),
    }));
  const rmr: Span[] = active
    .filter((c) => c.rmrMin !== null || c.rmrMax !== null)
    .map((c) => ({ code: c.code, order: c.sortOrder, lo: c.rmrMin ?? 0, hi: c.rmrMax ?? 100 }));
  return [...sweep(q, Q_LOW, Q_HIGH, 'Q', fmtQ, 0), ...sweep(rmr, 0, 100, 'RMR89', String, 1)];
}
