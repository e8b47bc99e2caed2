import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  tokens,
} from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '../../theme/touch';

export interface VersionDifference {
  label: string;
  yours: string;
  theirs: string;
}

export interface StaleVersionNoticeProps {
  /** The server's sentence (who changed what is not known to the browser). */
  message: string;
  /** The fields where the person's typing and the saved version differ. */
  differences: VersionDifference[];
  /** 'choose': nothing decided yet; 'loaded': their version is in the form; 'kept': the next save applies the typing. */
  state: 'choose' | 'loaded' | 'kept';
  onLoadTheirs: () => void;
  onKeepMine: () => void;
  onDismiss: () => void;
}

const useStyles = makeStyles({
  table: {
    borderCollapse: 'collapse',
    marginTop: tokens.spacingVerticalS,
    '& th, & td': {
      textAlign: 'left',
      padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalM}`,
      borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
      verticalAlign: 'top',
    },
  },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/**
 * Someone else saved first (409 STALE_VERSION). The person's typing stays on screen; they choose
 * to load the saved version or to apply theirs over it. Nothing is overwritten without a choice.
 */
export function StaleVersionNotice({
  message,
  differences,
  state,
  onLoadTheirs,
  onKeepMine,
  onDismiss,
}: StaleVersionNoticeProps) {
  const styles = useStyles();
  const title =
    state === 'loaded'
      ? 'Their version is now in the form'
      : state === 'kept'
        ? 'Your changes stay: save again to apply them over theirs'
        : 'Changed by someone else while you were typing';
  return (
    <div role="alert" data-testid="stale-version-notice">
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>{title}</MessageBarTitle>
          {message}
          {differences.length > 0 ? (
            <table className={styles.table}>
              <thead>
                <tr>
                  <th scope="col">Field</th>
                  <th scope="col">Your typing</th>
                  <th scope="col">Saved by them</th>
                </tr>
              </thead>
              <tbody>
                {differences.map((d) => (
                  <tr key={d.label}>
                    <th scope="row">{d.label}</th>
                    <td>{d.yours}</td>
                    <td>{d.theirs}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <div>Their version has the same values as your typing.</div>
          )}
        </MessageBarBody>
        <MessageBarActions>
          {state === 'choose' ? (
            <>
              <Button className={styles.button} size="large" appearance="primary" onClick={onLoadTheirs}>
                Load their version
              </Button>
              <Button className={styles.button} size="large" onClick={onKeepMine}>
                Keep my changes
              </Button>
            </>
          ) : (
            <Button className={styles.button} size="large" onClick={onDismiss}>
              Close this note
            </Button>
          )}
        </MessageBarActions>
      </MessageBar>
    </div>
  );
}
