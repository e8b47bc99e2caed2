import {
  Button,
  Caption1,
  Checkbox,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Select,
  Subtitle2,
  Text,
  tokens,
} from '@fluentui/react-components';
import { formatAzimuth, formatQ, jvOfSets, worstOrientation, type RoundSet } from '@roundbook/domain';
import {
  formatPlane,
  Q_EDITION,
  Q_TABLES,
  ratingCaution,
  RMR89_CONDITION_SIMPLE,
  RMR89_EDITION,
  RMR_ORIENTATION_RULE,
  RMR_TUNNEL_ADJUSTMENT,
  rqdEstimateFromJv,
} from '@roundbook/geomath';
import type { JvEdition, QLocation, QParameterTable, RmrOrientationAssessment } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useFormikContext } from 'formik';
import { useState } from 'react';
import type { RoundRatings } from '@/features/rounds/api/types';
import { CarriedNote } from '@/features/rounds/components/carried-note';
import { RatingResult } from '@/features/rounds/components/rating-results';
import { ChoiceField, NumberField, useRoundEdit } from '@/features/rounds/components/round-fields';
import type { CarriedInputs } from '@/features/rounds/hooks/use-carried-inputs';
import { numberOf, type RoundFormValues } from '@/features/rounds/schemas/round-form';
import {
  qLocationLabels,
  rmrRoughnessOptions,
  rmrWaterOptions,
  rmrWeatheringOptions,
  sentence,
} from '@/features/rounds/utils/labels';

export interface RatingSectionProps {
  live: RoundRatings;
  saved: RoundRatings;
  /** The sets of the round's assessment. */
  sets: RoundSet[];
  /** Inflow per 10 m of tunnel from the Ground record as typed (for the RMR89 groundwater rating). */
  inflowPer10m: number | null;
  driveTrend: number;
  /** Values carried in from Ground and Joints (useCarriedInputs), by input. */
  carried?: CarriedInputs;
  /** The Jv–RQD correlation used for the carried RQD and the estimate below. */
  jvEdition?: JvEdition;
  onJvEditionChange?: (edition: JvEdition) => void;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXL },
  results: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  block: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusLarge,
  },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(18rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  select: { minWidth: 0, '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  input: { minHeight: `${TOUCH_TARGET_PX}px` },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  row: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  muted: { color: tokens.colorNeutralForeground2 },
  edition: { color: tokens.colorNeutralForeground2, fontStyle: 'italic' },
  toggle: { display: 'flex', gap: tokens.spacingHorizontalS },
  suggestion: { fontWeight: tokens.fontWeightSemibold },
  footer: { color: tokens.colorNeutralForeground2 },
});

/** Beside each table's edition line (the editions-differ caution, short). */
const EDITIONS_NOTE = 'Other editions give other values for some rows; quote this one with the rating.';

/** A Q parameter chosen from its published table (rows grouped as the table groups them). */
function QTableChoice({ table }: { table: QParameterTable }) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly } = useRoundEdit();
  const key = table.parameter;
  const groups = [...new Set(table.rows.map((r) => r.group ?? ''))];
  const selected = values.q.rows[key] ?? '';
  const choose = (id: string) => {
    const row = table.rows.find((r) => r.id === id);
    void setFieldValue(`q.rows`, { ...values.q.rows, [key]: id === '' ? undefined : id });
    void setFieldValue(`q.${key}`, row === undefined ? '' : String(row.value));
    if (key === 'rqd') void setFieldValue('q.rqdFromJv', false);
  };
  const option = (r: QParameterTable['rows'][number]) => (
    <option key={r.id} value={r.id}>
      {`${table.symbol} ${r.range ? `${r.range[0]}–${r.range[1]}` : r.value} · ${r.description}${r.extra ? ` (${r.extra})` : ''}`}
    </option>
  );
  return (
    <Field
      label={`${table.symbol} — ${table.title}`}
      size="large"
      hint={table.notes.length > 0 ? table.notes[0] : undefined}
    >
      <Select
        className={styles.select}
        value={selected}
        size="large"
        disabled={readOnly}
        aria-label={`${table.symbol} from the table`}
        onChange={(_e, d) => choose(d.value)}
      >
        <option value="">{`Choose ${table.symbol}…`}</option>
        {groups.map((g) =>
          g === '' ? (
            table.rows.filter((r) => (r.group ?? '') === '').map(option)
          ) : (
            <optgroup key={g} label={sentence(g)}>
              {table.rows.filter((r) => r.group === g).map(option)}
            </optgroup>
          ),
        )}
      </Select>
    </Field>
  );
}

/** Q, RMR89 and GSI: inputs from the published tables, values computed live with geomath, with their inputs. */
export function RatingSection({
  live,
  saved,
  sets,
  driveTrend,
  carried = {},
  jvEdition: jvEditionProp,
  onJvEditionChange,
}: RatingSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly, serverErrors } = useRoundEdit();
  const [jvEditionOwn, setJvEditionOwn] = useState<JvEdition>(1982);
  const jvEdition = jvEditionProp ?? jvEditionOwn;
  const setJvEdition = onJvEditionChange ?? setJvEditionOwn;
  const jv = jvOfSets(sets);
  let rqdEstimate: ReturnType<typeof rqdEstimateFromJv> | null = null;
  try {
    rqdEstimate = jv === null ? null : rqdEstimateFromJv(jv.jv, jvEdition);
  } catch {
    rqdEstimate = null;
  }
  const worst = worstOrientation(sets);
  // RQD from Jv is a correlation: said on each rating that uses it, once.
  const rqdFromJvNote = 'RQD estimated from Jv — a correlation, not a measurement.';
  const qNotes = values.q.rqdFromJv && values.q.rqd.trim() !== '' ? [rqdFromJvNote] : [];
  const rmrNotes =
    carried.rmrRqd !== undefined && numberOf(values.rmr.rqd) === carried.rmrRqd.value ? [rqdFromJvNote] : [];

  return (
    <section className={styles.root} aria-label="Rating">
      <div className={styles.results}>
        <RatingResult
          title="Q"
          live={live.q}
          saved={saved.q}
          format={formatQ}
          testId="rating-q"
          notes={qNotes}
        />
        <RatingResult
          title="RMR89"
          live={live.rmr}
          saved={saved.rmr}
          format={(v) => v.toFixed(0)}
          testId="rating-rmr"
          notes={rmrNotes}
        />
        <RatingResult
          title="GSI"
          live={live.gsi}
          saved={saved.gsi}
          format={(v) => v.toFixed(0)}
          testId="rating-gsi"
        />
      </div>
      {serverErrors.ratings !== undefined && (
        <MessageBar intent="error" data-testid="ratings-error">
          <MessageBarBody>{serverErrors.ratings}</MessageBarBody>
        </MessageBar>
      )}

      <div className={styles.block}>
        <Subtitle2 as="h3">Q parameters</Subtitle2>
        <Caption1 className={styles.edition}>
          {`Tables: ${Q_EDITION.name}.`} {EDITIONS_NOTE}
        </Caption1>
        <div className={styles.grid}>
          {Q_TABLES.map((table) => (
            <QTableChoice key={table.parameter} table={table} />
          ))}
          <NumberField
            name="q.rqd"
            label="RQD as measured or estimated"
            unit="%"
            hint={
              carried.qRqd !== undefined && values.q.rows.rqd === undefined ? (
                <CarriedNote
                  field="q.rqd"
                  carried={carried.qRqd}
                  unit="%"
                  onUse={() => void setFieldValue('q.rqdFromJv', true)}
                />
              ) : values.q.rqdFromJv ? (
                'estimated from Jv — a correlation'
              ) : (
                'the table band sets its middle; type the value if known'
              )
            }
            onValueChange={() => void setFieldValue('q.rqdFromJv', false)}
          />
          <ChoiceField
            name="q.location"
            label="Where"
            options={(Object.keys(qLocationLabels) as QLocation[]).map((l) => ({
              value: l,
              label: qLocationLabels[l],
            }))}
          />
          <Field label="Relevant set spaced over 3 m" size="large">
            <Checkbox
              size="large"
              checked={values.q.jrSpacingOver3m}
              disabled={readOnly}
              label="Add 1 to Jr"
              onChange={(_e, d) => void setFieldValue('q.jrSpacingOver3m', d.checked === true)}
            />
          </Field>
        </div>

        <div className={styles.block} data-testid="rqd-from-jv">
          <Text weight="semibold">RQD from the set spacings (Jv) — a correlation, not a measurement</Text>
          {jv === null ? (
            <Caption1 className={styles.muted}>Needs sets with spacings in the Joints section.</Caption1>
          ) : (
            <div className={styles.row}>
              <Text>{`Jv = ${jv.jv.toFixed(2)} joints/m³ from spacings ${jv.spacings.map((s) => s.toFixed(2)).join(', ')} m`}</Text>
              {carried.rmrRqd?.caution != null && (
                <Text weight="semibold" data-testid="rqd-optimistic">
                  {carried.rmrRqd.caution}
                </Text>
              )}
              <Select
                className={styles.select}
                aria-label="Jv–RQD correlation"
                value={String(jvEdition)}
                onChange={(_e, d) => setJvEdition(Number(d.value) as JvEdition)}
              >
                <option value="1982">Palmström 1982</option>
                <option value="2005">Palmström 2005</option>
              </Select>
              {rqdEstimate !== null && (
                <>
                  <Text
                    className={styles.suggestion}
                  >{`RQD ≈ ${rqdEstimate.rqd.toFixed(0)} %${rqdEstimate.clipped ? ' (clipped to 0–100)' : ''}`}</Text>
                  {!readOnly && (
                    <Button
                      className={styles.button}
                      size="large"
                      onClick={() => {
                        const v = String(Math.round(rqdEstimate.rqd));
                        void setFieldValue('q.rqd', v);
                        void setFieldValue('q.rqdFromJv', true);
                        void setFieldValue('q.rows', { ...values.q.rows, rqd: undefined });
                        void setFieldValue('rmr.rqd', v);
                      }}
                    >
                      Use as estimated RQD
                    </Button>
                  )}
                  <Caption1 className={styles.muted}>{rqdEstimate.source}</Caption1>
                </>
              )}
            </div>
          )}
        </div>
      </div>

      <div className={styles.block}>
        <Subtitle2 as="h3">RMR89 ratings</Subtitle2>
        <Caption1 className={styles.edition}>
          {`${RMR89_EDITION}.`} {EDITIONS_NOTE}
        </Caption1>
        <div className={styles.grid}>
          <ChoiceField
            name="rmr.strengthKind"
            label="Strength from"
            options={[
              { value: 'point-load', label: 'Point-load index Is50' },
              { value: 'ucs', label: 'Uniaxial compressive strength' },
            ]}
          />
          {values.rmr.strengthKind === 'point-load' ? (
            <NumberField
              name="rmr.is50"
              label="Is50"
              unit="MPa"
              hint={carried.is50 && <CarriedNote field="rmr.is50" carried={carried.is50} unit="MPa" />}
            />
          ) : (
            <NumberField name="rmr.ucs" label="UCS" unit="MPa" />
          )}
          <NumberField
            name="rmr.rqd"
            label="RQD"
            unit="%"
            hint={carried.rmrRqd && <CarriedNote field="rmr.rqd" carried={carried.rmrRqd} unit="%" />}
          />
          <NumberField
            name="rmr.spacingM"
            label="Spacing of discontinuities"
            unit="m"
            hint={
              carried.spacingM && <CarriedNote field="rmr.spacingM" carried={carried.spacingM} unit="m" />
            }
          />
        </div>
        <div className={styles.toggle} role="radiogroup" aria-label="Joint condition">
          {(['simple', 'detailed'] as const).map((k) => (
            <Button
              key={k}
              role="radio"
              aria-checked={values.rmr.conditionKind === k}
              className={styles.button}
              size="large"
              appearance={values.rmr.conditionKind === k ? 'primary' : 'secondary'}
              disabled={readOnly}
              onClick={() => void setFieldValue('rmr.conditionKind', k)}
            >
              {k === 'simple' ? 'Joint condition in one choice' : 'Joint condition in detail'}
            </Button>
          ))}
        </div>
        {values.rmr.conditionKind === 'simple' ? (
          <ChoiceField
            name="rmr.simple"
            label="Condition of discontinuities"
            placeholder="Choose…"
            options={RMR89_CONDITION_SIMPLE.map((r) => ({
              value: r.id,
              label: `${r.rating} · ${r.description}`,
            }))}
          />
        ) : (
          <div className={styles.grid}>
            <NumberField name="rmr.persistenceM" label="Persistence" unit="m" />
            <NumberField name="rmr.separationMm" label="Separation" unit="mm" />
            <ChoiceField
              name="rmr.roughness"
              label="Roughness"
              placeholder="Choose…"
              options={rmrRoughnessOptions.map((r) => ({ value: r, label: sentence(r) }))}
            />
            <ChoiceField
              name="rmr.infillKind"
              label="Infilling"
              options={[
                { value: 'none', label: 'None' },
                { value: 'hard', label: 'Hard' },
                { value: 'soft', label: 'Soft' },
              ]}
            />
            {values.rmr.infillKind !== 'none' && (
              <NumberField name="rmr.infillMm" label="Infilling thickness" unit="mm" />
            )}
            <ChoiceField
              name="rmr.weathering"
              label="Weathering of the walls"
              placeholder="Choose…"
              options={rmrWeatheringOptions.map((r) => ({ value: r, label: sentence(r) }))}
            />
          </div>
        )}
        <div className={styles.grid}>
          <ChoiceField
            name="rmr.waterKind"
            label="Groundwater from"
            options={[
              { value: 'inflow', label: 'Inflow per 10 m of tunnel' },
              { value: 'condition', label: 'General condition' },
              { value: 'pressure-ratio', label: 'Water pressure / major stress' },
            ]}
          />
          {values.rmr.waterKind === 'inflow' && (
            <NumberField
              name="rmr.inflowPer10m"
              label="Inflow per 10 m"
              unit="l/min"
              hint={
                carried.inflowPer10m && (
                  <CarriedNote field="rmr.inflowPer10m" carried={carried.inflowPer10m} unit="l/min" />
                )
              }
            />
          )}
          {values.rmr.waterKind === 'condition' && (
            <ChoiceField
              name="rmr.waterCondition"
              label="Condition"
              placeholder="Choose…"
              options={rmrWaterOptions.map((r) => ({ value: r, label: sentence(r) }))}
            />
          )}
          {values.rmr.waterKind === 'pressure-ratio' && (
            <NumberField name="rmr.pressureRatio" label="Pressure ratio" />
          )}
        </div>

        <div className={styles.block} data-testid="orientation-suggestion">
          <ChoiceField
            name="rmr.orientation"
            label="Orientation of the discontinuities to the drive"
            placeholder="Not assessed (no adjustment)"
            options={(Object.keys(RMR_TUNNEL_ADJUSTMENT) as RmrOrientationAssessment[]).map((a) => ({
              value: a,
              label: `${sentence(a)} (${RMR_TUNNEL_ADJUSTMENT[a]})`,
            }))}
          />
          {worst === null ? (
            <Caption1 className={styles.muted}>
              {`No set to compare with the drive (${formatAzimuth(driveTrend)}) yet.`}
            </Caption1>
          ) : (
            <div className={styles.row}>
              <Text className={styles.suggestion}>
                {`Suggested: ${worst.result.assessment} (${worst.result.adjustment}) from set ${worst.set.label} ${formatPlane(worst.set.mean, 'dip-direction/dip')} against the drive ${formatAzimuth(driveTrend)}`}
              </Text>
              {!readOnly && values.rmr.orientation !== worst.result.assessment && (
                <Button
                  className={styles.button}
                  size="large"
                  onClick={() => void setFieldValue('rmr.orientation', worst.result.assessment)}
                >
                  Use the suggestion
                </Button>
              )}
              <Caption1 className={styles.muted}>{worst.result.reason}</Caption1>
            </div>
          )}
          {sets.length > 1 && (
            <ul className={styles.muted}>
              {sets
                .filter((s) => s.orientation !== null)
                .map((s) => (
                  <li
                    key={s.label}
                  >{`${s.label} ${formatPlane(s.mean, 'dip-direction/dip')}: ${s.orientation?.assessment} (${s.orientation?.adjustment})`}</li>
                ))}
            </ul>
          )}
          <Caption1 className={styles.muted}>{RMR_ORIENTATION_RULE}</Caption1>
        </div>
      </div>

      <div className={styles.block}>
        <Subtitle2 as="h3">GSI</Subtitle2>
        <div className={styles.grid}>
          <Field
            label="GSI read from the chart at the face"
            size="large"
            hint="leave empty to take GSI from RMR89 (dry, unadjusted) − 5"
          >
            <Input
              className={styles.input}
              value={values.gsiObserved}
              inputMode="numeric"
              size="large"
              readOnly={readOnly}
              aria-label="GSI read from the chart"
              onChange={(_e, d) => void setFieldValue('gsiObserved', d.value)}
            />
          </Field>
        </div>
      </div>

      {/* The cautions that qualify a value sit beside it (cards, edition lines, RQD from Jv, the orientation
          rule); the footer keeps the one that qualifies them all, short. */}
      <Caption1 className={styles.footer} data-testid="rating-cautions">
        {`${ratingCaution('empirical-aids').title}: they do not prove any support adequate; the responsible engineer and the competent person decide.`}
      </Caption1>
    </section>
  );
}
