import type { Comparison, TriggerLevel, WatchedQuantity } from '@/api/contract';

export type WatchKind = 'numeric' | 'distance' | 'flag';

/** How each watched quantity is judged (the same split the API checks). */
export const watchInfo: Record<WatchedQuantity, { kind: WatchKind; label: string; unit: string }> = {
  q: { kind: 'numeric', label: 'Q', unit: '' },
  rmr89: { kind: 'numeric', label: 'RMR89', unit: '' },
  'inflow-per-10m': { kind: 'numeric', label: 'Water inflow per 10 m of tunnel', unit: 'l/min' },
  overbreak: { kind: 'numeric', label: 'Overbreak', unit: 'm³' },
  'adverse-orientation': { kind: 'flag', label: 'A set or feature adverse to the drive', unit: '' },
  'crown-crossing-within': { kind: 'distance', label: 'A mapped plane reaches the crown ahead', unit: 'm' },
  'support-class-change': { kind: 'flag', label: 'Support class differs from the last round', unit: '' },
  'open-red-hazard': { kind: 'flag', label: 'Any open red hazard on the heading', unit: '' },
};

export const WATCHED = Object.keys(watchInfo) as WatchedQuantity[];

export const comparisonLabels: Record<Comparison, string> = {
  '<': 'below (<)',
  '<=': 'at or below (≤)',
  '>': 'above (>)',
  '>=': 'at or above (≥)',
  '=': 'equal to (=)',
};

export const COMPARISONS = Object.keys(comparisonLabels) as Comparison[];

export const levelLabels: Record<TriggerLevel, string> = { green: 'Green', amber: 'Amber', red: 'Red' };
export const LEVELS: TriggerLevel[] = ['green', 'amber', 'red'];
