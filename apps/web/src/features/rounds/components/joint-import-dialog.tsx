import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { ChangeEvent } from 'react';
import type { PlaneNotation } from '@/features/rounds/api/types';
import type { JointRow } from '@/features/rounds/schemas/round-form';
import { importJoints } from '@/features/rounds/utils/joint-import';

export interface JointImportDialogProps {
  open: boolean;
  defaultNotation: PlaneNotation;
  onClose: () => void;
  onImport: (joints: JointRow[]) => void;
}

const useStyles = makeStyles({
  surface: { maxWidth: '760px', width: '100%' },
  content: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM },
  text: { fontFamily: tokens.fontFamilyMonospace, minHeight: '10rem' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  file: { minHeight: `${TOUCH_TARGET_PX}px`, fontSize: tokens.fontSizeBase400 },
});

/** Paste joints from a spreadsheet, or pick a CSV file. Every row is added; rows with problems are marked. */
export function JointImportDialog({ open, defaultNotation, onClose, onImport }: JointImportDialogProps) {
  const styles = useStyles();
  const [text, setText] = useState('');
  const preview = text.trim() === '' ? null : importJoints(text, defaultNotation);

  const readFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (file !== undefined) setText(await file.text());
  };

  return (
    <Dialog open={open} onOpenChange={(_e, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <DialogBody>
          <DialogTitle>Paste or import joints</DialogTitle>
          <DialogContent className={styles.content}>
            <p>
              One joint per line, values separated by commas, semicolons or tabs (a copy from a spreadsheet
              works). A first line naming the columns (orientation, kind, notation, set, spacing, persistence,
              aperture, Jr, JRC, method, infill, Ja, water, thickness, notes) is read; without it the order is
              orientation, kind, spacing, persistence, aperture, Jr, Ja, water, notes.
            </p>
            <Field label="Joints as text" size="large">
              <Textarea
                className={styles.text}
                value={text}
                resize="vertical"
                onChange={(_e, data) => setText(data.value)}
                placeholder={'orientation;kind;spacing\n130/50;joint;0.4\nN30E 40SE;bedding;1.2'}
              />
            </Field>
            <Field label="Or a CSV file" size="large">
              <input
                className={styles.file}
                type="file"
                accept=".csv,.txt,text/csv,text/plain"
                onChange={(event) => void readFile(event)}
              />
            </Field>
            {preview !== null && (
              <MessageBar
                intent={preview.withProblems > 0 ? 'warning' : 'success'}
                data-testid="import-preview"
              >
                <MessageBarBody>
                  {`${preview.joints.length} ${preview.joints.length === 1 ? 'joint' : 'joints'} read`}
                  {preview.withProblems > 0
                    ? `, ${preview.withProblems} with problems: they are added too, marked with the reason, for you to fix.`
                    : ', all readable.'}
                  {preview.ignoredHeaders.length > 0 &&
                    ` Columns not known to Roundbook go into the notes: ${preview.ignoredHeaders.join(', ')}.`}
                </MessageBarBody>
              </MessageBar>
            )}
          </DialogContent>
          <DialogActions>
            <Button className={styles.button} size="large" onClick={onClose}>
              Cancel
            </Button>
            <Button
              className={styles.button}
              size="large"
              appearance="primary"
              disabled={preview === null || preview.joints.length === 0}
              onClick={() => {
                if (preview === null) return;
                onImport(preview.joints);
                setText('');
              }}
            >
              {preview === null
                ? 'Add joints'
                : `Add ${preview.joints.length} ${preview.joints.length === 1 ? 'joint' : 'joints'}`}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
