import { Badge } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import { levelLabels, type TriggerLevel } from '@roundbook/domain';

/** How each trigger level is named on screen (packages/domain): always with its colour, never colour alone. */
export const triggerLevelLabels: Record<TriggerLevel, string> = levelLabels;
export type { TriggerLevel };

const levelColours: Record<TriggerLevel, BadgeProps['color']> = {
  green: 'success',
  amber: 'warning',
  red: 'danger',
};

/** A shape that tells the levels apart without colour (for colour-blind eyes and grey screens). */
function LevelMark({ level }: { level: TriggerLevel }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 12 12" width="1em" height="1em">
      {level === 'green' && <circle cx="6" cy="6" r="5" fill="currentColor" />}
      {level === 'amber' && <path d="M6 1 11 11 1 11Z" fill="currentColor" />}
      {level === 'red' && <rect x="1.5" y="1.5" width="9" height="9" fill="currentColor" />}
    </svg>
  );
}

export interface TriggerLevelBadgeProps {
  /** The level, or null when there is none (no rules, or nothing worked out yet). */
  level: TriggerLevel | null;
  /** Words shown when there is no level. */
  noneLabel?: string;
  /** Put in front of the level's word, e.g. "Trigger: ". */
  prefix?: string;
  size?: BadgeProps['size'];
}

/** A trigger level as colour, mark and word together. */
export function TriggerLevelBadge({
  level,
  noneLabel = 'No level',
  prefix = '',
  size = 'large',
}: TriggerLevelBadgeProps) {
  if (level === null) {
    return (
      <Badge appearance="outline" color="informative" shape="rounded" size={size} data-level="none">
        {noneLabel}
      </Badge>
    );
  }
  return (
    <Badge
      appearance="filled"
      color={levelColours[level]}
      shape="rounded"
      size={size}
      data-level={level}
      icon={<LevelMark level={level} />}
    >
      {`${prefix}${triggerLevelLabels[level]}`}
    </Badge>
  );
}
