import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
} from '@fluentui/react-components';
import type { ReactNode } from 'react';
import { TOUCH_TARGET_PX } from '../../theme/touch';

export interface ConfirmDialogProps {
  open: boolean;
  title: string;
  /** What will happen, in words the person can check before they say yes. */
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  /** True while the confirmed action runs: the buttons wait. */
  busy?: boolean;
  /** A problem from the last attempt, shown inside the dialog. */
  problem?: string | null;
  onConfirm: () => void;
  onCancel: () => void;
}

const useStyles = makeStyles({
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '8rem' },
});

/** A yes/no question before something that cannot be undone (delete, remove, withdraw). */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Keep it',
  busy = false,
  problem,
  onConfirm,
  onCancel,
}: ConfirmDialogProps) {
  const styles = useStyles();
  return (
    <Dialog
      open={open}
      modalType="alert"
      onOpenChange={(_event, data) => {
        if (!data.open && !busy) onCancel();
      }}
    >
      <DialogSurface>
        <DialogBody>
          <DialogTitle>{title}</DialogTitle>
          <DialogContent>
            {children}
            {problem !== undefined && problem !== null && (
              <div role="alert">
                <MessageBar intent="error" layout="multiline">
                  <MessageBarBody>{problem}</MessageBarBody>
                </MessageBar>
              </div>
            )}
          </DialogContent>
          <DialogActions>
            <Button className={styles.button} size="large" disabled={busy} onClick={onCancel}>
              {cancelLabel}
            </Button>
            <Button
              className={styles.button}
              size="large"
              appearance="primary"
              disabled={busy}
              icon={busy ? <Spinner size="tiny" /> : undefined}
              onClick={onConfirm}
            >
              {confirmLabel}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
