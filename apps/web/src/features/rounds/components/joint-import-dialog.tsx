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
  Select,
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
  problems: {
    maxHeight: '12rem',
    overflowY: 'auto',
    margin: 0,
    paddingLeft: tokens.spacingHorizontalXL,
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalXS,
  },
});

/** The round picker's value for "every row of the file". */
const ALL_ROUNDS = '';

/** Paste joints from a spreadsheet, or pick a CSV file. Every row is added; rows with problems are marked. */
export function JointImportDialog({ open, defaultNotation, onClose, onImport }: JointImportDialogProps) {
  const styles = useStyles();
  const [text, setText] = useState('');
  const [round, setRound] = useState(ALL_ROUNDS);
  const preview =
    text.trim() === '' ? null : importJoints(text, defaultNotation, round === ALL_ROUNDS ? {} : { round });
  const rounds = preview?.rounds ?? [];
  const changeText = (value: string) => {
    setText(value);
    setRound(ALL_ROUNDS);
  };

  const readFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (file !== undefined) changeText(await file.text());
  };

  return (
    <Dialog open={open} onOpenChange={(_e, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <DialogBody>
          <DialogTitle>Paste or import joints</DialogTitle>
          <DialogContent className={styles.content}>
            <p>
              One joint per line, values separated by commas, semicolons or tabs (a copy from a spreadsheet
              works). A first line naming the columns (orientation, or dip direction and dip, or strike and
              dip; kind, notation, set, spacing, persistence, aperture, Jr, JRC, method, infill, Ja, water,
              thickness, notes) is read, and so is a heading&apos;s Joints as CSV export; without a first line
              the order is orientation, kind, spacing, persistence, aperture, Jr, Ja, water, notes.
            </p>
            <Field label="Joints as text" size="large">
              <Textarea
                className={styles.text}
                value={text}
                resize="vertical"
                onChange={(_e, data) => changeText(data.value)}
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
            {rounds.length > 1 && (
              <Field label="Rounds in the file" size="large">
                <Select size="large" value={round} onChange={(_e, data) => setRound(data.value)}>
                  <option value={ALL_ROUNDS}>{`All ${rounds.length} rounds`}</option>
                  {rounds.map((r) => (
                    <option key={r.key} value={r.key}>
                      {`${r.label} (${r.rows} ${r.rows === 1 ? 'row' : 'rows'})`}
                    </option>
                  ))}
                </Select>
              </Field>
            )}
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
                  {preview.otherRounds > 0 &&
                    ` ${preview.otherRounds} ${preview.otherRounds === 1 ? 'row' : 'rows'} of other rounds left out, as chosen.`}
                  {preview.ignoredHeaders.length > 0 &&
                    ` Columns not known to Roundbook go into the notes: ${preview.ignoredHeaders.join(', ')}.`}
                  {preview.notImported.length > 0 &&
                    ` Not taken over: ${preview.notImported.map((c) => `${c.header} (${c.reason})`).join('; ')}.`}
                </MessageBarBody>
              </MessageBar>
            )}
            {preview !== null && preview.problems.length > 0 && (
              <ul className={styles.problems} aria-label="Rows with problems" data-testid="import-problems">
                {preview.problems.map((p) => (
                  <li key={p.line}>{p.message}</li>
                ))}
              </ul>
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
                changeText('');
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
