import { Button, makeStyles, Text, tokens } from '@fluentui/react-components';
import { CheckmarkCircleRegular, CommentRegular } from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { ReviewSection } from '@/features/review/api/review';
import { useReviewAction, useRoundReview } from '@/features/review/api/review';
import { sectionLabels } from '@/features/review/utils/format';

/** The round screen's sections (and 'round', above them) a return comment is shown in. */
export type CommentPlace = 'position' | 'ground' | 'joints' | 'sketch' | 'rating' | 'support' | 'round';

/** Where each review section's comments are shown on the round screen. */
const placeOf: Record<ReviewSection, CommentPlace> = {
  position: 'position',
  ground: 'ground',
  joints: 'joints',
  ratings: 'rating',
  support: 'support',
  triggers: 'round',
  general: 'round',
};

export interface SectionCommentsProps {
  projectId: string;
  roundId: string;
  /** The section of the round screen this callout sits at the top of. */
  place: CommentPlace;
}

const useStyles = makeStyles({
  callout: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    borderLeft: `6px solid ${tokens.colorPaletteMarigoldBorderActive}`,
    backgroundColor: tokens.colorPaletteMarigoldBackground1,
    borderRadius: tokens.borderRadiusMedium,
  },
  head: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
  list: { listStyle: 'none', margin: 0, padding: 0, display: 'flex', flexDirection: 'column', rowGap: '8px' },
  item: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
  },
  words: { display: 'flex', flexDirection: 'column', rowGap: '2px' },
  muted: { color: tokens.colorNeutralForeground2 },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/**
 * The engineer's open return comments on one section of the round, at the top of that section, each with
 * Resolve for the geologist. Above the sections ('round') it also lists where the other comments are.
 */
export function SectionComments({ projectId, roundId, place }: SectionCommentsProps) {
  const styles = useStyles();
  const { data: review } = useRoundReview(projectId, roundId);
  const action = useReviewAction(projectId, roundId);
  if (!review) return null;
  const open = review.openComments;
  const here = open.filter((c) => placeOf[c.section] === place);
  const elsewhere =
    place === 'round'
      ? [...new Set(open.filter((c) => placeOf[c.section] !== 'round').map((c) => sectionLabels[c.section]))]
      : [];
  if (here.length === 0 && elsewhere.length === 0) return null;
  const title =
    place === 'round'
      ? 'The engineer returned this round with comments'
      : `Return comment${here.length === 1 ? '' : 's'} on this section`;
  return (
    <section className={styles.callout} aria-label={title} data-testid={`section-comments-${place}`}>
      <div className={styles.head}>
        <CommentRegular aria-hidden />
        <Text weight="semibold">{title}</Text>
      </div>
      {here.length > 0 ? (
        <ul className={styles.list}>
          {here.map((c) => (
            <li key={c.id} className={styles.item} data-testid="section-comment">
              <span className={styles.words}>
                <Text>{place === 'round' ? `${sectionLabels[c.section]}: ${c.text}` : c.text}</Text>
                <Text size={200} className={styles.muted}>
                  {`${c.authorName}, on revision ${c.revision}`}
                </Text>
              </span>
              {review.canResolve ? (
                <Button
                  className={styles.button}
                  size="large"
                  icon={<CheckmarkCircleRegular />}
                  disabled={action.isPending}
                  onClick={() => action.mutate({ kind: 'resolve', commentId: c.id })}
                >
                  Resolve
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {elsewhere.length > 0 ? (
        <Text className={styles.muted}>{`Open comments are also shown on: ${elsewhere.join(', ')}.`}</Text>
      ) : null}
      <Text size={200} className={styles.muted}>
        Each stays here until it is marked resolved; the engineer sees at the next review which were resolved.
      </Text>
    </section>
  );
}
