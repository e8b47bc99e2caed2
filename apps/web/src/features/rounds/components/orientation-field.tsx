import { Input, makeStyles, mergeClasses, Select, tokens } from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { KeyboardEvent } from 'react';
import { useId } from 'react';
import type { PlaneNotation } from '@/features/rounds/api/types';
import { notationLabels, notations } from '@/features/rounds/utils/labels';
import { readOrientation } from '@/features/rounds/utils/orientation';

export interface OrientationFieldProps {
  /** Accessible name of the text input, e.g. "Orientation of joint 3". */
  label: string;
  text: string;
  notation: PlaneNotation;
  /** The project's default notation, listed first. */
  defaultNotation: PlaneNotation;
  readOnly?: boolean;
  onTextChange: (text: string) => void;
  onNotationChange: (notation: PlaneNotation) => void;
  /** Enter in the text input (the table moves on or adds a row). */
  onEnter?: () => void;
  inputRef?: (element: HTMLInputElement | null) => void;
  /**
   * One line (the joints table's compact row): the reading as dip direction/dip beside the field (strike and
   * pole in its title), a problem under it; no typing hint (the placeholder and the section say it).
   */
  compact?: boolean;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXS, minWidth: '15rem' },
  row: { display: 'flex', columnGap: tokens.spacingHorizontalXS },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, flexGrow: 1, minWidth: '8rem' },
  text: { fontFamily: tokens.fontFamilyMonospace, fontSize: tokens.fontSizeBase400 },
  notation: {
    width: '7.5rem',
    '& select': { minHeight: `${TOUCH_TARGET_PX}px`, fontSize: tokens.fontSizeBase200 },
  },
  feedback: { fontSize: tokens.fontSizeBase300, lineHeight: tokens.lineHeightBase300 },
  reading: { color: tokens.colorPaletteGreenForeground1, fontWeight: tokens.fontWeightSemibold },
  error: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  empty: { color: tokens.colorNeutralForeground3 },
  compactRoot: { minWidth: '17rem' },
  compactRow: { alignItems: 'center' },
  compactReading: {
    width: '4.75rem',
    flexShrink: 0,
    fontVariantNumeric: 'tabular-nums',
    whiteSpace: 'nowrap',
  },
});

/** Short names for the notation picker (the full name is its title). */
const shortNotation: Record<PlaneNotation, string> = {
  'dip-direction/dip': 'DipDir/Dip',
  'dip/dip-direction': 'Dip/DipDir',
  'strike/dip-rhr': 'Strike RH',
};

/**
 * An orientation typed in any notation, read live by geomath: the reading (dip direction/dip, right-hand
 * strike, pole) or the parser's own message, right under the field. Quadrant forms (N30E 40SE, 030/40SE)
 * are read whatever notation is picked.
 */
export function OrientationField({
  label,
  text,
  notation,
  defaultNotation,
  readOnly,
  onTextChange,
  onNotationChange,
  onEnter,
  inputRef,
  compact = false,
}: OrientationFieldProps) {
  const styles = useStyles();
  const feedbackId = useId();
  const reading = readOrientation(text, notation);
  const ordered = [defaultNotation, ...notations.filter((n) => n !== defaultNotation)];
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Enter' && onEnter !== undefined) {
      event.preventDefault();
      onEnter();
    }
  };
  const feedback = (
    <div
      id={feedbackId}
      className={mergeClasses(styles.feedback, compact && reading.kind !== 'error' && styles.compactReading)}
      aria-live="polite"
      data-testid="orientation-feedback"
      title={
        compact && reading.kind === 'plane'
          ? `${reading.dipDirectionDip} · strike ${reading.strike} · pole ${reading.pole}`
          : undefined
      }
    >
      {reading.kind === 'empty' && !compact && (
        <span
          className={styles.empty}
        >{`Type it as ${notationLabels[notation].toLowerCase()}, or N30E 40SE`}</span>
      )}
      {reading.kind === 'plane' && (
        <span className={styles.reading}>
          {compact
            ? reading.dipDirectionDip
            : `${reading.dipDirectionDip} · strike ${reading.strike} · pole ${reading.pole}`}
        </span>
      )}
      {reading.kind === 'error' && (
        <span className={mergeClasses(styles.error)} role="alert">
          {reading.message}
        </span>
      )}
    </div>
  );
  return (
    <div className={mergeClasses(styles.root, compact && styles.compactRoot)}>
      <div className={mergeClasses(styles.row, compact && styles.compactRow)}>
        <Input
          className={styles.input}
          input={{ className: styles.text, ref: inputRef }}
          aria-label={label}
          aria-describedby={feedbackId}
          aria-invalid={reading.kind === 'error'}
          value={text}
          size="large"
          autoComplete="off"
          spellCheck={false}
          readOnly={readOnly}
          placeholder={
            notation === 'dip/dip-direction' ? '50/130' : notation === 'strike/dip-rhr' ? '040/50' : '130/50'
          }
          onChange={(_e, data) => onTextChange(data.value)}
          onKeyDown={onKeyDown}
        />
        <Select
          className={styles.notation}
          aria-label={`Notation of ${label.toLowerCase()}`}
          title={notationLabels[notation]}
          value={notation}
          disabled={readOnly}
          onChange={(_e, data) => onNotationChange(data.value as PlaneNotation)}
        >
          {ordered.map((n) => (
            <option key={n} value={n} title={notationLabels[n]}>
              {shortNotation[n]}
            </option>
          ))}
        </Select>
        {compact && reading.kind !== 'error' && feedback}
      </div>
      {(!compact || reading.kind === 'error') && feedback}
    </div>
  );
}
