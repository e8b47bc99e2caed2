import type { SupportClass } from '@/api/contract';

const n = (v: number) => String(Number(v.toFixed(3)));

/** Q range as [from, below): "0.1 ≤ Q < 1", "Q ≥ 10", "Q < 0.01". */
export function qRangeText(c: Pick<SupportClass, 'qMin' | 'qMax'>): string {
  if (c.qMin === null && c.qMax === null) return '—';
  if (c.qMin === null) return `Q < ${n(c.qMax ?? 0)}`;
  if (c.qMax === null) return `Q ≥ ${n(c.qMin)}`;
  return `${n(c.qMin)} ≤ Q < ${n(c.qMax)}`;
}

/** RMR89 range, both ends included: "41–60", "≥ 81", "≤ 20". */
export function rmrRangeText(c: Pick<SupportClass, 'rmrMin' | 'rmrMax'>): string {
  if (c.rmrMin === null && c.rmrMax === null) return '—';
  if (c.rmrMin === null) return `≤ ${c.rmrMax}`;
  if (c.rmrMax === null) return `≥ ${c.rmrMin}`;
  return `${c.rmrMin}–${c.rmrMax}`;
}

/** The support in one short line: bolts, sprayed concrete, steel, probing. */
export function supportText(c: SupportClass): string {
  const parts: string[] = [];
  const bolts = [c.boltType, c.boltLength === null ? '' : `${n(c.boltLength)} m`, c.boltPattern]
    .filter((p) => p !== '')
    .join(' ');
  if (bolts !== '') parts.push(`Bolts: ${bolts}`);
  parts.push(c.shotcreteMm > 0 ? `Sprayed concrete ${c.shotcreteMm} mm` : 'No sprayed concrete');
  if (c.steelSupport !== '') parts.push(c.steelSupport);
  if (c.probingRequired) parts.push('Probe ahead');
  return parts.join(' · ');
}
