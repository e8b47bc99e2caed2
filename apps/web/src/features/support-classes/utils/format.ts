import { qBandText } from '@roundbook/domain';
import type { SupportClass } from '@/api/contract';

const n = (v: number) => String(Number(v.toFixed(3)));

/** Q range as it is applied, [from, below): "0.1 ≤ Q < 1", "Q ≥ 10", "Q < 0.01" (the domain's wording). */
export function qRangeText(c: Pick<SupportClass, 'qMin' | 'qMax'>): string {
  return qBandText(c) ?? '—';
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
