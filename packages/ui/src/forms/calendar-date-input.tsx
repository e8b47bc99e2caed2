import { Button, Text, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import {
  CalendarRegular,
  ChevronLeftRegular,
  ChevronRightRegular,
  DismissRegular,
} from '@fluentui/react-icons';
import { addCalendarDays, formatCalendarDate } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '../theme/touch';

const useStyles = makeStyles({
  root: { display: 'flex', alignItems: 'stretch', gap: tokens.spacingHorizontalXS, maxWidth: '100%' },
  box: {
    position: 'relative',
    flexGrow: 1,
    minWidth: '10.5rem',
    minHeight: `${TOUCH_TARGET_PX}px`,
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    padding: `0 ${tokens.spacingHorizontalM}`,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorNeutralForeground1,
    ':focus-within': {
      outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}`,
      outlineOffset: '1px',
    },
  },
  readOnly: { backgroundColor: tokens.colorNeutralBackground3 },
  text: { fontSize: tokens.fontSizeBase400, whiteSpace: 'nowrap' },
  placeholder: { color: tokens.colorNeutralForeground3 },
  // The browser's own date input lies over the box, invisible: a tap opens its calendar, while the box
  // shows the date in Roundbook's one style ("Wed 2 Dec 2026") whatever the browser's language.
  native: {
    position: 'absolute',
    inset: 0,
    width: '100%',
    height: '100%',
    margin: 0,
    padding: 0,
    border: 'none',
    opacity: 0,
    cursor: 'pointer',
    fontSize: tokens.fontSizeBase400,
  },
  step: { minWidth: `${TOUCH_TARGET_PX}px`, minHeight: `${TOUCH_TARGET_PX}px` },
});

export interface CalendarDateInputProps {
  /** YYYY-MM-DD, or '' for no date. */
  value: string;
  onChange: (value: string) => void;
  /** The accessible name of the date input (the label of its Field). */
  label: string;
  readOnly?: boolean;
  /** Day-before and day-after buttons beside the date (for a shift date, usually today or yesterday). */
  steppers?: boolean;
  placeholder?: string;
  /** A button that empties the date (for a filter where no date means any date). */
  clearable?: boolean;
  className?: string;
}

/**
 * A calendar date written as every other screen writes it (packages/domain's formatCalendarDate), not in the
 * browser's language: the browser's calendar opens on a tap, and with `steppers` a big button on each side
 * moves the date a day, so a gloved hand rarely needs the calendar at all.
 */
export function CalendarDateInput({
  value,
  onChange,
  label,
  readOnly = false,
  steppers = false,
  placeholder = 'Choose a date',
  clearable = false,
  className,
}: CalendarDateInputProps) {
  const styles = useStyles();
  const step = (days: number) => {
    if (value !== '') onChange(addCalendarDays(value, days));
  };
  return (
    <div className={mergeClasses(styles.root, className)}>
      {steppers && (
        <Button
          className={styles.step}
          size="large"
          icon={<ChevronLeftRegular />}
          aria-label={`Day before the ${label.toLowerCase()}`}
          disabled={readOnly || value === ''}
          onClick={() => step(-1)}
        />
      )}
      <div className={mergeClasses(styles.box, readOnly && styles.readOnly)}>
        <CalendarRegular aria-hidden />
        <Text
          className={mergeClasses(styles.text, value === '' && styles.placeholder)}
          data-testid="calendar-date-text"
          aria-hidden
        >
          {value === '' ? placeholder : formatCalendarDate(value, { weekday: true })}
        </Text>
        <input
          className={styles.native}
          type="date"
          aria-label={label}
          aria-description={value === '' ? undefined : formatCalendarDate(value, { weekday: true })}
          value={value}
          readOnly={readOnly}
          onClick={(e) => {
            if (readOnly) return;
            try {
              e.currentTarget.showPicker?.();
            } catch {
              // Not allowed here (e.g. not a user gesture): the browser's own control still opens it.
            }
          }}
          onChange={(e) => onChange(e.target.value)}
        />
      </div>
      {clearable && value !== '' && !readOnly && (
        <Button
          className={styles.step}
          size="large"
          icon={<DismissRegular />}
          aria-label={`Clear the ${label.toLowerCase()}`}
          onClick={() => onChange('')}
        />
      )}
      {steppers && (
        <Button
          className={styles.step}
          size="large"
          icon={<ChevronRightRegular />}
          aria-label={`Day after the ${label.toLowerCase()}`}
          disabled={readOnly || value === ''}
          onClick={() => step(1)}
        />
      )}
    </div>
  );
}
