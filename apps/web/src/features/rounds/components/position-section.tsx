import {
  Button,
  Caption1,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Text,
  tokens,
} from '@fluentui/react-components';
import { formatProjectTime } from '@roundbook/domain';
import { formatChainage } from '@roundbook/geomath';
import { CalendarDateInput, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useFormikContext } from 'formik';
import type { ChainageStyle, Round } from '@/features/rounds/api/types';
import { NumberField, TextField, useRoundEdit } from '@/features/rounds/components/round-fields';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { chainageInputOf, chainageOf, valueOf } from '@/features/rounds/schemas/round-form';
import { shiftLabels, stageLabels } from '@/features/rounds/utils/labels';

export interface PositionSectionProps {
  round: Round;
  chainage: { style: ChainageStyle; decimals: number };
  timeZone: string;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(15rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  facts: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXXL },
  fact: { display: 'flex', flexDirection: 'column' },
  factLabel: { color: tokens.colorNeutralForeground2 },
  factValue: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  // Two 8rem shift buttons side by side need 17rem: the shift row's cells are at least that wide.
  shiftGrid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(17rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  shift: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  shiftButton: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '8rem' },
});

/** Round length warnings while typing (the server repeats them, with the support class's limit, on save). */
export function lengthWarning(length: number | null, planned: number): string | null {
  if (length === null || Number.isNaN(length)) return null;
  if (length < 0) return 'The round length is negative: check the face and previous chainages.';
  if (length === 0) return 'The round length is zero: check the face and previous chainages.';
  if (length > planned) return `Over the planned maximum of ${planned} m for this heading.`;
  return null;
}

/** Where the face is: stage, number, chainages, round length, shift and who mapped it. */
export function PositionSection({ round, chainage, timeZone }: PositionSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly, serverErrors } = useRoundEdit();
  const show = (metres: number | null) => (metres === null ? '—' : formatChainage(metres, chainage));
  // How typed text was read ("2520" → "2+520.0"); nothing when the field already reads so.
  const readBack = (metres: number, typed: string) => {
    const read = show(metres);
    return read === typed.trim() || chainageInputOf(metres, chainage) === typed.trim() ? undefined : read;
  };

  const updateLength = (face: string, previous: string) => {
    const f = chainageOf(face);
    const p = chainageOf(previous);
    if (f !== null && p !== null)
      void setFieldValue('roundLength', String(Math.round((f - p) * 1000) / 1000));
  };

  const face = chainageOf(values.faceChainage);
  const previous = chainageOf(values.previousChainage);
  const warning = lengthWarning(valueOf(values.roundLength), round.plannedRoundLength);
  const mapped = formatProjectTime(round.mappedAt, timeZone);

  return (
    <section className={styles.root} aria-label="Position">
      <div className={styles.facts}>
        <div className={styles.fact}>
          <Text className={styles.factLabel}>Stage</Text>
          <Text className={styles.factValue}>{stageLabels[round.stage]}</Text>
        </div>
        <div className={styles.fact}>
          <Text className={styles.factLabel}>Round number</Text>
          <Text className={styles.factValue}>{round.roundNumber}</Text>
        </div>
        <div className={styles.fact}>
          <Text className={styles.factLabel}>Mapped by</Text>
          <Text className={styles.factValue}>{round.mappedByName}</Text>
        </div>
        <div className={styles.fact}>
          <Text className={styles.factLabel}>{`Opened (${timeZone})`}</Text>
          <Text className={styles.factValue}>{mapped}</Text>
        </div>
      </div>

      <div className={styles.grid}>
        <NumberField
          name="faceChainage"
          label="Face chainage"
          inputMode="text"
          hint={face === null ? 'as 1+250.0 or 1250.0' : readBack(face, values.faceChainage)}
          onValueChange={(v) => updateLength(v, values.previousChainage)}
        />
        <NumberField
          name="previousChainage"
          label="Previous chainage"
          inputMode="text"
          hint={
            previous === null
              ? 'from the last round of this stage'
              : readBack(previous, values.previousChainage)
          }
          onValueChange={(v) => updateLength(values.faceChainage, v)}
        />
        <NumberField
          name="roundLength"
          label="Round length"
          unit="m"
          hint={`planned ${round.plannedRoundLength} m`}
          warning={warning}
        />
      </div>

      {round.warnings.length > 0 && (
        <MessageBar intent="warning" layout="multiline" data-testid="round-warnings">
          <MessageBarBody>
            {round.warnings.map((w) => (
              <div key={w}>{w}</div>
            ))}
          </MessageBarBody>
        </MessageBar>
      )}

      <div className={styles.shiftGrid}>
        <Field
          label="Shift date"
          size="large"
          validationState={serverErrors.shiftDate ? 'error' : 'none'}
          validationMessage={serverErrors.shiftDate}
        >
          <CalendarDateInput
            label="Shift date"
            steppers
            value={values.shiftDate}
            readOnly={readOnly}
            onChange={(v) => void setFieldValue('shiftDate', v)}
          />
        </Field>
        <Field label="Shift" size="large" hint="a night shift belongs to the date it began">
          <div className={styles.shift} role="radiogroup" aria-label="Shift">
            {(['day', 'night'] as const).map((s) => (
              <Button
                key={s}
                role="radio"
                aria-checked={values.shift === s}
                className={styles.shiftButton}
                size="large"
                appearance={values.shift === s ? 'primary' : 'secondary'}
                disabled={readOnly}
                onClick={() => void setFieldValue('shift', s)}
              >
                {shiftLabels[s]}
              </Button>
            ))}
          </div>
        </Field>
      </div>

      <TextField
        name="distantParts"
        label="Parts of the face seen only from a distance"
        hint="e.g. crown above the spiling, left wall behind the muck pile"
        multiline
      />
      <Caption1>{`Chainages are shown as ${chainage.style === 'km+m' ? 'km+metres' : 'metres'}, as set for this heading.`}</Caption1>
    </section>
  );
}
