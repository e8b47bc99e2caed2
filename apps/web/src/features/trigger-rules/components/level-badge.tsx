import { Badge } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import { CheckmarkCircleRegular, ErrorCircleRegular, WarningRegular } from '@fluentui/react-icons';
import type { TriggerLevel } from '@/api/contract';
import { levelLabels } from '@/features/trigger-rules/utils/watch';

const colours: Record<TriggerLevel, BadgeProps['color']> = {
  green: 'success',
  amber: 'warning',
  red: 'danger',
};
const icons: Record<TriggerLevel, BadgeProps['icon']> = {
  green: <CheckmarkCircleRegular />,
  amber: <WarningRegular />,
  red: <ErrorCircleRegular />,
};

/** A trigger level as colour, icon and word together (never colour alone). */
export function LevelBadge({ level }: { level: TriggerLevel }) {
  return (
    <Badge appearance="filled" shape="rounded" size="large" color={colours[level]} icon={icons[level]}>
      {levelLabels[level]}
    </Badge>
  );
}
