import { makeStyles, Text, tokens } from '@fluentui/react-components';
import { WarningRegular } from '@fluentui/react-icons';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    columnGap: tokens.spacingHorizontalS,
    alignItems: 'flex-start',
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderLeft: `4px solid ${tokens.colorPaletteMarigoldBorderActive}`,
    backgroundColor: tokens.colorNeutralBackground2,
    borderRadius: tokens.borderRadiusMedium,
  },
  icon: { flexShrink: 0, fontSize: '20px', marginTop: '2px' },
});

/** The review caution, as the API sends it (shown wherever a decision is asked for or shown). */
export function ReviewCaution({ text }: { text: string }) {
  const styles = useStyles();
  return (
    <div className={styles.root} data-testid="review-caution" role="note">
      <WarningRegular className={styles.icon} aria-hidden />
      <Text>{text}</Text>
    </div>
  );
}
