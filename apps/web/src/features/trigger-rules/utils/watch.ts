import {
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
