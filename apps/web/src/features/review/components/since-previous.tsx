import { Badge, makeStyles, Subtitle2, Text, tokens } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import type { components } from '@/api/generated/schema';

type SincePrevious = components['schemas']['SincePreviousDto'];
type ChangeTrend = components['schemas']['ChangeTrend'];

export interface SincePreviousProps {
  since: SincePrevious;
}

const useStyles = makeStyles({
  // Fluent's Text is inline: as a column the heading and the sentence under it no longer run together.
  root: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'flex-start',
    rowGap: tokens.spacingVerticalS,
  },
  table: { borderCollapse: 'collapse', width: '100%', maxWidth: '48rem' },
  cell: {
    textAlign: 'left',
    verticalAlign: 'top',
    paddingBlock: tokens.spacingVerticalXS,
    paddingInline: tokens.spacingHorizontalS,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  head: { color: tokens.colorNeutralForeground2, fontWeight: tokens.fontWeightRegular },
  muted: { color: tokens.colorNeutralForeground2 },
});

/** Each trend in a word and a colour (never colour alone). */
const trendBadge: Record<ChangeTrend, { word: string; color: BadgeProps['color'] }> = {
  worse: { word: 'worse', color: 'danger' },
  better: { word: 'better', color: 'success' },
  new: { word: 'new', color: 'warning' },
  gone: { word: 'not seen now', color: 'informative' },
  changed: { word: 'changed', color: 'warning' },
  same: { word: 'unchanged', color: 'subtle' },
  unknown: { word: 'not comparable', color: 'subtle' },
};

/** "Since round N": class, Q, RMR89, water, and any new set or feature, from the two frozen rounds. */
export function SincePreviousRound({ since }: SincePreviousProps) {
  const styles = useStyles();
  const title =
    since.previousRoundNumber === null
      ? 'Since the previous round'
      : `Since round ${since.previousRoundNumber}`;
  return (
    <section aria-label="Since the previous round" data-testid="since-previous" className={styles.root}>
      <Subtitle2 as="h3">{title}</Subtitle2>
      {since.changes.length === 0 ? (
        <Text as="p" className={styles.muted}>
          {since.note}
        </Text>
      ) : (
        <>
          <Text as="p" className={styles.muted}>
            {`Both rounds as frozen at their last submit or confirmation (round ${since.previousRoundNumber}, revision ${since.previousRevision}).`}
          </Text>
          <table className={styles.table}>
            <thead>
              <tr>
                <th className={`${styles.cell} ${styles.head}`} scope="col">
                  What
                </th>
                <th className={`${styles.cell} ${styles.head}`} scope="col">
                  Before
                </th>
                <th className={`${styles.cell} ${styles.head}`} scope="col">
                  Now
                </th>
                <th className={`${styles.cell} ${styles.head}`} scope="col">
                  Change
                </th>
              </tr>
            </thead>
            <tbody>
              {since.changes.map((c, i) => (
                <tr key={`${c.aspect}-${i}`} title={c.text}>
                  <th className={styles.cell} scope="row">
                    {c.label}
                  </th>
                  <td className={styles.cell}>{c.before}</td>
                  <td className={styles.cell}>{c.after}</td>
                  <td className={styles.cell}>
                    <Badge appearance="tint" color={trendBadge[c.trend].color}>
                      {trendBadge[c.trend].word}
                    </Badge>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </section>
  );
}
