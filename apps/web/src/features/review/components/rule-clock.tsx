import { makeStyles, mergeClasses, Text, tokens } from '@fluentui/react-components';
import { CheckmarkCircleRegular, ClockRegular, ErrorCircleFilled } from '@fluentui/react-icons';
import { TriggerLevelBadge } from '@roundbook/ui';
import type { RuleClock } from '@/features/review/api/review';
import { formatTimeLeft } from '@/features/review/utils/format';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalS },
  clock: { display: 'inline-flex', alignItems: 'center', columnGap: tokens.spacingHorizontalXS },
  overdue: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
});

/** One fired rule with the time left against its timeframe; overdue is shown by colour, icon and word. */
export function RuleClockLine({ rule }: { rule: RuleClock }) {
  const styles = useStyles();
  return (
    <li className={styles.row} data-testid="rule-clock">
      <TriggerLevelBadge level={rule.level} />
      <Text>{rule.summary}</Text>
      <span
        className={mergeClasses(styles.clock, rule.overdue && styles.overdue)}
        data-overdue={rule.overdue ? 'true' : 'false'}
      >
        {rule.acknowledgedAt ? (
          <CheckmarkCircleRegular aria-hidden />
        ) : rule.overdue ? (
          <ErrorCircleFilled aria-hidden />
        ) : (
          <ClockRegular aria-hidden />
        )}
        {rule.acknowledgedAt
          ? `Acknowledged (${rule.ownerRole})`
          : `${formatTimeLeft(rule.minutesLeft, rule.overdue)} (${rule.ownerRole}, ${rule.timeAllowedHours} h)`}
      </span>
    </li>
  );
}
