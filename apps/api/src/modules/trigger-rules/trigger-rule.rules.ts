import type { Comparison, TriggerRule, Watched } from './trigger-rule.entity.js';

/** How each watched quantity is judged. */
export const WATCH_KIND: Record<
  Watched,
  { kind: 'numeric' | 'distance' | 'flag'; label: string; unit: string }
> = {
  q: { kind: 'numeric', label: 'Q', unit: '' },
  rmr89: { kind: 'numeric', label: 'RMR89', unit: '' },
  'inflow-per-10m': { kind: 'numeric', label: 'Water inflow per 10 m', unit: 'l/min' },
  overbreak: { kind: 'numeric', label: 'Overbreak', unit: 'm³' },
  'adverse-orientation': { kind: 'flag', label: 'A set or feature adverse to the drive', unit: '' },
  'crown-crossing-within': {
    kind: 'distance',
    label: 'A mapped plane reaches the crown within',
    unit: 'm ahead',
  },
  'support-class-change': { kind: 'flag', label: 'Support class differs from the last round', unit: '' },
  'open-red-hazard': { kind: 'flag', label: 'Any open red hazard on the heading', unit: '' },
};

/** Field errors for a rule whose comparison and threshold do not suit what it watches. */
export function triggerRuleErrors(
  r: Pick<TriggerRule, 'watch' | 'comparison' | 'threshold'>,
): Record<string, string> {
  const kind = WATCH_KIND[r.watch].kind;
  const fields: Record<string, string> = {};
  if (kind === 'numeric') {
    if (!r.comparison) fields.comparison = 'Choose how the value is compared with the threshold.';
    if (r.threshold === null || r.threshold === undefined) fields.threshold = 'Give the threshold.';
    if (r.watch === 'q' && r.threshold != null && (r.threshold < 0.001 || r.threshold > 1000))
      fields.threshold = 'Q runs from 0.001 to 1000.';
    if (r.watch === 'rmr89' && r.threshold != null && (r.threshold < 0 || r.threshold > 100))
      fields.threshold = 'RMR89 runs from 0 to 100.';
    if ((r.watch === 'inflow-per-10m' || r.watch === 'overbreak') && r.threshold != null && r.threshold < 0) {
      fields.threshold = 'The threshold cannot be negative.';
    }
  } else if (kind === 'distance') {
    if (r.threshold === null || r.threshold === undefined || r.threshold <= 0)
      fields.threshold = 'Give the distance ahead of the face, in metres.';
    if (r.comparison)
      fields.comparison =
        'This rule has no comparison: it fires when a plane reaches the crown within the distance.';
  } else {
    if (r.comparison) fields.comparison = 'This rule watches a yes/no condition and has no comparison.';
    if (r.threshold !== null && r.threshold !== undefined)
      fields.threshold = 'This rule watches a yes/no condition and has no threshold.';
  }
  return fields;
}

const symbol: Record<Comparison, string> = { '<': '<', '<=': '≤', '>': '>', '>=': '≥', '=': '=' };

export function triggerRuleSummary(
  r: Pick<TriggerRule, 'watch' | 'comparison' | 'threshold' | 'level'>,
): string {
  const w = WATCH_KIND[r.watch];
  const condition =
    w.kind === 'numeric'
      ? `${w.label} ${symbol[r.comparison ?? '=']} ${r.threshold ?? '?'}${w.unit ? ` ${w.unit}` : ''}`
      : w.kind === 'distance'
        ? `${w.label} ${r.threshold ?? '?'} ${w.unit}`
        : w.label;
  return `${condition} → ${r.level}`;
}
