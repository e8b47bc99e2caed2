import { Button, Card, makeStyles, Spinner, Text, tokens } from '@fluentui/react-components';
import { stageLabels } from '@roundbook/domain';
import { EmptyState, PageHeader, TOUCH_TARGET_PX, TriggerLevelBadge } from '@roundbook/ui';
import { Link } from 'react-router-dom';
import type { ReviewQueueItem } from '@/features/review/api/review';
import { useReviewQueue } from '@/features/review/api/review';
import { ReviewCaution } from '@/features/review/components/review-caution';
import { RuleClockLine } from '@/features/review/components/rule-clock';
import { formatMinutes } from '@/features/review/utils/format';

export interface ReviewQueueProps {
  /** Only this heading's rounds (from the Board's count), or every heading's. */
  headingId: string | null;
  /** Where "show every heading" leads. */
  allHref: string;
}

const useStyles = makeStyles({
  list: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '12px',
  },
  card: { padding: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS },
  top: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  title: {
    fontSize: tokens.fontSizeBase500,
    fontWeight: tokens.fontWeightSemibold,
    color: tokens.colorBrandForeground1,
    minHeight: `${TOUCH_TARGET_PX}px`,
    display: 'inline-flex',
    alignItems: 'center',
  },
  facts: { color: tokens.colorNeutralForeground2 },
  rules: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '6px',
  },
  filter: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, marginBottom: '12px' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  caution: { marginBottom: '12px' },
});

function QueueItem({ item }: { item: ReviewQueueItem }) {
  const styles = useStyles();
  return (
    <li data-testid="queue-item">
      <Card className={styles.card}>
        <div className={styles.top}>
          <TriggerLevelBadge level={item.triggerLevel} size="large" noneLabel="Not assessed" />
          <Link className={styles.title} to={`/projects/${item.projectId}/rounds/${item.roundId}`}>
            {`${item.headingCode} round ${item.roundNumber} · ${stageLabels[item.stage]} · ${item.chainageText}`}
          </Link>
        </div>
        <Text className={styles.facts}>
          {`${item.projectName} · mapped by ${item.geologistName} · waiting ${formatMinutes(item.minutesWaiting)}` +
            ` · recommended ${item.recommendedClassCode ?? '—'} · revision ${item.revision}`}
        </Text>
        {item.rules.length > 0 ? (
          <ul className={styles.rules} aria-label="Rules that fired">
            {item.rules.map((rule) => (
              <RuleClockLine key={rule.ruleId} rule={rule} />
            ))}
          </ul>
        ) : (
          <Text className={styles.facts}>No trigger rule fired.</Text>
        )}
      </Card>
    </li>
  );
}

/** To confirm: submitted rounds of the engineer's projects, red first, then the oldest. */
export function ReviewQueue({ headingId, allHref }: ReviewQueueProps) {
  const styles = useStyles();
  const { data, isPending, error } = useReviewQueue(headingId);
  const heading = headingId && data?.items[0] ? data.items[0].headingCode : null;
  return (
    <>
      <PageHeader title="To confirm" subtitle="Submitted rounds: red first, then the oldest." />
      {headingId ? (
        <div className={styles.filter}>
          <Text>{heading ? `Heading ${heading} only.` : 'One heading only.'}</Text>
          <Link to={allHref}>
            <Button className={styles.button} appearance="secondary" size="large">
              Show every heading
            </Button>
          </Link>
        </div>
      ) : null}
      {data ? (
        <div className={styles.caution}>
          <ReviewCaution text={data.caution} />
        </div>
      ) : null}
      {isPending ? (
        <Spinner label="Reading the rounds waiting for you…" />
      ) : error ? (
        <EmptyState title="The queue could not be read" message={error.message} />
      ) : data.items.length === 0 ? (
        <EmptyState
          title="Nothing waiting for you"
          message="Rounds the geologists submit on projects where you are an engineer come here."
        />
      ) : (
        <ul className={styles.list} aria-label="Rounds to confirm">
          {data.items.map((item) => (
            <QueueItem key={item.roundId} item={item} />
          ))}
        </ul>
      )}
    </>
  );
}
