import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import type { ReactNode } from 'react';
import { TOUCH_TARGET_PX } from '../theme/touch';

const useStyles = makeStyles({
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '9rem' },
  spacer: { flexGrow: 1 },
});

export interface FormFooterProps {
  /** Why the last save failed, shown as an alert above the buttons; null when nothing is wrong */
  problem: ReactNode | null;
  /** Title of the alert (default "Not saved") */
  problemTitle?: string;
  submitting: boolean;
  submitLabel: string;
  /** Shows a Cancel button when given */
  onCancel?: () => void;
  /** Further actions, placed at the far end of the row */
  extra?: ReactNode;
}

/** The end of a Setup form: what went wrong, if anything, then the save and cancel buttons (touch-sized). */
export function FormFooter({
  problem,
  problemTitle = 'Not saved',
  submitting,
  submitLabel,
  onCancel,
  extra,
}: FormFooterProps) {
  const styles = useStyles();
  return (
    <>
      {problem !== null && (
        <div role="alert">
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>{problemTitle}</MessageBarTitle>
              {problem}
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      <div className={styles.actions}>
        <Button
          type="submit"
          appearance="primary"
          size="large"
          className={styles.button}
          disabled={submitting}
          icon={submitting ? <Spinner size="tiny" /> : undefined}
        >
          {submitLabel}
        </Button>
        {onCancel && (
          <Button size="large" className={styles.button} onClick={onCancel} disabled={submitting}>
            Cancel
          </Button>
        )}
        {extra !== undefined && (
          <>
            <span className={styles.spacer} />
            {extra}
          </>
        )}
      </div>
    </>
  );
}
