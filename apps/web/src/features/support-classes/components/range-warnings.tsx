import { makeStyles, MessageBar, MessageBarBody, MessageBarTitle, tokens } from '@fluentui/react-components';
import type { RangeWarning } from '@/api/contract';

const kindLabels: Record<RangeWarning['kind'], string> = {
  overlap: 'Ranges overlap',
  gap: 'Gap between ranges',
  order: 'Out of order',
};

const useStyles = makeStyles({
  list: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
    marginBottom: tokens.spacingVerticalL,
  },
});

/** The API's checks of the active classes' ranges, above the table where nobody misses them. */
export function RangeWarnings({ warnings }: { warnings: RangeWarning[] }) {
  const styles = useStyles();
  if (warnings.length === 0) return null;
  return (
    <section className={styles.list} aria-label="Range warnings">
      {warnings.map((w) => (
        <MessageBar key={`${w.kind}-${w.system}-${w.classes.join('-')}`} intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>{`${kindLabels[w.kind]} (${w.system}${w.classes.length > 0 ? `: ${w.classes.join(', ')}` : ''})`}</MessageBarTitle>
            {w.message}
          </MessageBarBody>
        </MessageBar>
      ))}
    </section>
  );
}
