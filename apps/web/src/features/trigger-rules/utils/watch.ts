import {
  CHANGE_UNIT,
  CHANGE_WATCHES as DOMAIN_CHANGE_WATCHES,
  COMPARISONS as DOMAIN_COMPARISONS,
  comparisonLabels,
  levelLabels,
  TRIGGER_LEVELS,
  WATCH_KIND,
  WATCHED as DOMAIN_WATCHED,
} from '@roundbook/domain';
import type { Comparison, TriggerLevel, WatchedQuantity } from '@/api/contract';

// What a trigger rule watches and its words: packages/domain's (the rules the API evaluates).
export type WatchKind = (typeof WATCH_KIND)[keyof typeof WATCH_KIND]['kind'];

/** How each watched quantity is judged (the same split the API checks). */
export const watchInfo: Record<WatchedQuantity, { kind: WatchKind; label: string; unit: string }> =
  WATCH_KIND;
export const WATCHED: WatchedQuantity[] = [...DOMAIN_WATCHED];
export { comparisonLabels, levelLabels };
export const COMPARISONS: Comparison[] = [...DOMAIN_COMPARISONS];
export const LEVELS: TriggerLevel[] = [...TRIGGER_LEVELS];

/** The watches a rule may fire on a change from the last round (packages/domain CHANGE_WATCHES). */
export const CHANGE_WATCHES: WatchedQuantity[] = [...DOMAIN_CHANGE_WATCHES];
export const hasChangeForm = (watch: WatchedQuantity): boolean => CHANGE_WATCHES.includes(watch);

/** The unit of a numeric change: percent of the last Q, the watch's own unit for the others. */
export const changeUnit = (watch: WatchedQuantity): string =>
  (CHANGE_UNIT[watch as keyof typeof CHANGE_UNIT] ?? '').trim();

/** How a change rule's comparison reads in the form: a fall or a rise, more than or at least. */
export const changeComparisonLabels: Partial<Record<Comparison, string>> = {
  '<': 'a fall of more than',
  '<=': 'a fall of at least',
  '>': 'a rise of more than',
  '>=': 'a rise of at least',
};
export const CHANGE_COMPARISONS: Comparison[] = ['<', '<=', '>', '>='];
