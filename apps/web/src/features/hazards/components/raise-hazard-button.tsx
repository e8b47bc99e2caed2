import {
  Button,
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  MessageBar,
  MessageBarBody,
} from '@fluentui/react-components';
import { WarningRegular } from '@fluentui/react-icons';
import { hazardKindLabels } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { Hazard, Heading } from '@/api/contract';
import type { RaiseHazardFormProps } from '@/features/hazards/components/raise-hazard-form';
import { RaiseHazardForm } from '@/features/hazards/components/raise-hazard-form';

export interface RaiseHazardButtonProps extends Pick<RaiseHazardFormProps, 'round' | 'faceChainage'> {
  projectId: string;
  heading: Heading;
  appearance?: 'primary' | 'secondary';
}

const useStyles = makeStyles({
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '9rem' },
  dialog: { maxWidth: '44rem' },
});

/** "Raise hazard": the form in a dialog, then a short note of what was raised. */
export function RaiseHazardButton({
  projectId,
  heading,
  faceChainage,
  round,
  appearance = 'primary',
}: RaiseHazardButtonProps) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  const [raised, setRaised] = useState<Hazard | null>(null);
  return (
    <>
      <Button
        appearance={appearance}
        size="large"
        className={styles.button}
        icon={<WarningRegular />}
        onClick={() => {
          setRaised(null);
          setOpen(true);
        }}
      >
        Raise hazard
      </Button>
      {raised && (
        <div role="status">
          <MessageBar intent="success" layout="multiline">
            <MessageBarBody>
              {`${hazardKindLabels[raised.kind]} raised on ${heading.code}; it is on the heading’s Hazards tab.`}
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      {open && (
        <Dialog open modalType="modal" onOpenChange={(_, d) => !d.open && setOpen(false)}>
          <DialogSurface className={styles.dialog}>
            <DialogBody>
              <DialogTitle>Raise hazard on {heading.code}</DialogTitle>
              <DialogContent>
                <RaiseHazardForm
                  projectId={projectId}
                  heading={heading}
                  faceChainage={faceChainage}
                  round={round}
                  onRaised={(h) => {
                    setRaised(h);
                    setOpen(false);
                  }}
                  onCancel={() => setOpen(false)}
                />
              </DialogContent>
            </DialogBody>
          </DialogSurface>
        </Dialog>
      )}
    </>
  );
}
