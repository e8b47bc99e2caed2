import {
  Button,
  Caption1,
  Input,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  Select,
  Subtitle2,
  Text,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular } from '@fluentui/react-icons';
import { STRENGTH_GRADES, WEATHERING_GRADES } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useFormikContext } from 'formik';
import type { GroundScale } from '@/features/rounds/api/types';
import { NumberField, TextField, useRoundEdit } from '@/features/rounds/components/round-fields';
import type { RoundFormValues, UnitRow } from '@/features/rounds/schemas/round-form';
import { newKey, valueOf } from '@/features/rounds/schemas/round-form';

export interface GroundSectionProps {
  groundScale: GroundScale;
  /** Inflow per 10 m of tunnel from the record as typed (the round's assessment). */
  inflowPer10m: number | null;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  units: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalS },
  unit: {
    display: 'grid',
    // Strength reads as its grade and field hint ("R4 strong (needs more than one hammer blow to break)"):
    // its column gets the room to show the whole choice at 1280 px (issue 19 item 5).
    gridTemplateColumns: 'minmax(9rem, 1fr) 7rem minmax(14rem, 1.75fr) minmax(14rem, 3fr) 3rem',
    gap: tokens.spacingHorizontalS,
    alignItems: 'center',
  },
  head: { color: tokens.colorNeutralForeground2, fontWeight: tokens.fontWeightSemibold },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%', minWidth: 0 },
  select: { minWidth: 0, '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  per10: { display: 'flex', flexDirection: 'column', justifyContent: 'center', minHeight: '5rem' },
  per10Value: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  muted: { color: tokens.colorNeutralForeground2 },
});

/** Units with their share of the face, grades on the project's scale, point load, water, overbreak. */
export function GroundSection({ groundScale, inflowPer10m }: GroundSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly } = useRoundEdit();
  const weathering = WEATHERING_GRADES[groundScale];
  const strength = STRENGTH_GRADES[groundScale];
  const scaleName = groundScale === 'isrm' ? 'ISRM' : 'ISO 14689';

  const shares = values.units.map((u) => valueOf(u.sharePercent) ?? 0);
  const total = shares.reduce((a, b) => a + (Number.isNaN(b) ? 0 : b), 0);
  const setUnit = (i: number, field: keyof UnitRow, value: string) =>
    void setFieldValue(`units.${i}.${field}`, value);

  return (
    <section className={styles.root} aria-label="Ground">
      <div className={styles.units}>
        <Subtitle2 as="h3">Rock units</Subtitle2>
        <Caption1
          className={styles.muted}
        >{`Grades on the ${scaleName} scale, as set for this project.`}</Caption1>
        {values.units.length > 0 && (
          <div className={mergeClasses(styles.unit, styles.head)} aria-hidden>
            <span>Unit</span>
            <span>Share %</span>
            <span>Weathering</span>
            <span>Strength</span>
            <span />
          </div>
        )}
        {values.units.map((u, i) => (
          <div key={u.key} className={styles.unit} data-testid="unit-row">
            <Input
              className={styles.input}
              aria-label={`Name of unit ${i + 1}`}
              value={u.name}
              size="large"
              readOnly={readOnly}
              onChange={(_e, d) => setUnit(i, 'name', d.value)}
            />
            <Input
              className={styles.input}
              aria-label={`Share of the face of unit ${i + 1}, %`}
              value={u.sharePercent}
              inputMode="decimal"
              size="large"
              readOnly={readOnly}
              onChange={(_e, d) => setUnit(i, 'sharePercent', d.value)}
            />
            <Select
              className={styles.select}
              aria-label={`Weathering grade of unit ${i + 1}`}
              value={u.weatheringGrade}
              size="large"
              disabled={readOnly}
              onChange={(_e, d) => setUnit(i, 'weatheringGrade', d.value)}
            >
              <option value="">—</option>
              {weathering.map((g) => (
                <option key={g.code} value={g.code} title={g.hint}>
                  {g.code === g.term ? g.term : `${g.code} ${g.term}`}
                </option>
              ))}
            </Select>
            <Select
              className={styles.select}
              aria-label={`Strength grade of unit ${i + 1}`}
              value={u.strengthGrade}
              size="large"
              disabled={readOnly}
              onChange={(_e, d) => setUnit(i, 'strengthGrade', d.value)}
            >
              <option value="">—</option>
              {strength.map((g) => (
                <option key={g.code} value={g.code} title={g.hint}>
                  {`${g.code === g.term ? g.term : `${g.code} ${g.term}`} (${g.hint})`}
                </option>
              ))}
            </Select>
            {!readOnly ? (
              <Button
                className={styles.button}
                size="large"
                appearance="subtle"
                icon={<DeleteRegular />}
                aria-label={`Remove unit ${i + 1}`}
                onClick={() =>
                  void setFieldValue(
                    'units',
                    values.units.filter((_, n) => n !== i),
                  )
                }
              />
            ) : (
              <span />
            )}
          </div>
        ))}
        {values.units.length > 0 && Math.abs(total - 100) > 0.01 && (
          <MessageBar intent="warning" data-testid="share-warning">
            <MessageBarBody>{`The shares add up to ${Math.round(total * 10) / 10} %, not 100 %.`}</MessageBarBody>
          </MessageBar>
        )}
        {!readOnly && (
          <Button
            className={styles.button}
            size="large"
            icon={<AddRegular />}
            onClick={() =>
              void setFieldValue('units', [
                ...values.units,
                {
                  key: newKey('unit'),
                  name: '',
                  sharePercent: values.units.length === 0 ? '100' : '',
                  weatheringGrade: '',
                  strengthGrade: '',
                },
              ])
            }
          >
            Add rock unit
          </Button>
        )}
      </div>

      <div className={styles.grid}>
        <NumberField
          name="pointLoadIs50"
          label="Point-load index Is50"
          unit="MPa"
          apiName="ground.pointLoadIs50"
        />
        <NumberField
          name="pointLoadFactor"
          label="Factor used (UCS ≈ factor × Is50)"
          hint="the factor your project uses, e.g. 20–25"
          apiName="ground.pointLoadFactor"
        />
        <NumberField name="overbreakM3" label="Overbreak" unit="m³" apiName="ground.overbreakM3" />
      </div>

      <div className={styles.grid}>
        <NumberField name="inflowLpm" label="Water inflow" unit="l/min" apiName="ground.inflowLpm" />
        <NumberField
          name="inflowLengthM"
          label="Tunnel length it comes from"
          unit="m"
          apiName="ground.inflowLengthM"
        />
        <div className={styles.per10} data-testid="inflow-per-10m">
          <Text className={styles.muted}>Inflow per 10 m</Text>
          <Text className={styles.per10Value}>
            {inflowPer10m === null ? '—' : `${Math.round(inflowPer10m * 10) / 10} l/min`}
          </Text>
        </div>
      </div>
      <TextField
        name="waterDescription"
        label="Water at the face, in words"
        multiline
        apiName="ground.waterDescription"
      />
      <TextField name="groundNotes" label="Notes on the ground" multiline apiName="ground.notes" />
    </section>
  );
}
