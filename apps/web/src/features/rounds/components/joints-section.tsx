import {
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  Select,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, ArrowResetRegular, ClipboardPasteRegular, DeleteRegular } from '@fluentui/react-icons';
import { SET_WINDOWS, type RoundSets } from '@roundbook/domain';
import { formatPlane } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useFormikContext } from 'formik';
import { useEffect, useRef, useState } from 'react';
import type { KeyboardEvent } from 'react';
import type { JointWater, JrcMethod, PlaneNotation } from '@/features/rounds/api/types';
import { JointImportDialog } from '@/features/rounds/components/joint-import-dialog';
import { OrientationField } from '@/features/rounds/components/orientation-field';
import { useRoundEdit } from '@/features/rounds/components/round-fields';
import type { JointRow, RoundFormValues } from '@/features/rounds/schemas/round-form';
import { emptyJoint, numberOf } from '@/features/rounds/schemas/round-form';
import { jointKindLabels, jointKinds, jrcMethodLabels, waterLabels } from '@/features/rounds/utils/labels';

export interface JointsSectionProps {
  defaultNotation: PlaneNotation;
  /** The sets of the round's assessment (packages/domain), overrides included. */
  sets: RoundSets;
  /** Metres either side of the face within which earlier rounds' joints join the set analysis. */
  distance: number;
  onDistanceChange: (metres: number) => void;
  /** Number of sets asked for; null = found from the density. */
  setCount: number | null;
  onSetCountChange: (count: number | null) => void;
  nearbyCount: number;
  nearbyLoading: boolean;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  toolbar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  grid: {
    display: 'grid',
    gridTemplateColumns:
      '2.5rem minmax(8rem, 1fr) minmax(17rem, 3fr) 5rem 5.5rem 5.5rem 5.5rem 4.5rem 4.5rem minmax(7rem, 1fr) 3rem',
    columnGap: tokens.spacingHorizontalS,
    alignItems: 'start',
  },
  head: {
    fontWeight: tokens.fontWeightSemibold,
    color: tokens.colorNeutralForeground2,
    paddingBottom: tokens.spacingVerticalXS,
    borderBottom: `${tokens.strokeWidthThick} solid ${tokens.colorNeutralStroke1}`,
  },
  joint: {
    paddingBlock: tokens.spacingVerticalS,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    rowGap: tokens.spacingVerticalS,
  },
  jointProblem: { backgroundColor: tokens.colorPaletteYellowBackground1 },
  number: {
    fontSize: tokens.fontSizeBase500,
    fontWeight: tokens.fontWeightBold,
    lineHeight: `${TOUCH_TARGET_PX}px`,
    textAlign: 'center',
  },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%', minWidth: 0 },
  select: { minWidth: 0, '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  setCell: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXXS },
  override: { fontSize: tokens.fontSizeBase200, color: tokens.colorPaletteDarkOrangeForeground1 },
  details: {
    gridColumn: '2 / -1',
    display: 'grid',
    gridTemplateColumns: '5.5rem 9rem minmax(8rem, 1fr) 6.5rem minmax(12rem, 2fr)',
    columnGap: tokens.spacingHorizontalS,
  },
  note: { gridColumn: '2 / -1' },
  sets: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalS },
  setTable: {
    borderCollapse: 'collapse',
    fontSize: tokens.fontSizeBase400,
    '& th, & td': {
      padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
      borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
      textAlign: 'left',
    },
    '& td': { fontVariantNumeric: 'tabular-nums' },
  },
  muted: { color: tokens.colorNeutralForeground2 },
});

const fmt = (value: number | null, digits: number) =>
  value === null ? '—' : Number.isFinite(value) ? value.toFixed(digits) : '∞';

/** The joints of the face: a fast table (Enter moves on, a new row at the end), import, and the sets. */
export function JointsSection({
  defaultNotation,
  sets,
  distance,
  onDistanceChange,
  setCount,
  onSetCountChange,
  nearbyCount,
  nearbyLoading,
}: JointsSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly, serverErrors } = useRoundEdit();
  const [importing, setImporting] = useState(false);
  const orientationInputs = useRef(new Map<string, HTMLInputElement>());
  const focusKey = useRef<string | null>(null);
  const joints = values.joints;

  useEffect(() => {
    if (focusKey.current === null) return;
    orientationInputs.current.get(focusKey.current)?.focus();
    focusKey.current = null;
  });

  const set = (i: number, field: keyof JointRow, value: unknown) =>
    void setFieldValue(`joints.${i}.${field}`, value);

  const addJoint = () => {
    const last = joints[joints.length - 1];
    const joint = emptyJoint(last?.notation ?? defaultNotation);
    focusKey.current = joint.key;
    void setFieldValue('joints', [...joints, joint]);
  };

  const moveOn = (i: number) => {
    const next = joints[i + 1];
    if (next === undefined) addJoint();
    else orientationInputs.current.get(next.key)?.focus();
  };

  const onRowKey = (i: number) => (event: KeyboardEvent<HTMLDivElement>) => {
    const target = event.target as HTMLElement;
    if (event.key === 'Enter' && target.tagName === 'INPUT' && !readOnly) {
      event.preventDefault();
      moveOn(i);
    }
  };

  const numberInput = (i: number, field: keyof JointRow, label: string, unit?: string) => {
    const value = joints[i][field] as string;
    const n = numberOf(value);
    return (
      <Input
        className={styles.input}
        aria-label={`${label} of joint ${i + 1}${unit ? `, ${unit}` : ''}`}
        aria-invalid={n !== null && Number.isNaN(n)}
        value={value}
        inputMode="decimal"
        size="large"
        autoComplete="off"
        readOnly={readOnly}
        onChange={(_e, data) => set(i, field, data.value)}
      />
    );
  };

  return (
    <section className={styles.root} aria-label="Joints">
      <div className={styles.toolbar}>
        {!readOnly && (
          <>
            <Button
              className={styles.button}
              size="large"
              appearance="primary"
              icon={<AddRegular />}
              onClick={addJoint}
            >
              Add joint
            </Button>
            <Button
              className={styles.button}
              size="large"
              icon={<ClipboardPasteRegular />}
              onClick={() => setImporting(true)}
            >
              Paste or import CSV
            </Button>
          </>
        )}
        <Caption1 className={styles.muted}>
          Type the orientation and press Enter to go to the next joint. Quadrant forms such as N30E 40SE are
          read in any notation.
        </Caption1>
      </div>

      {serverErrors.joints !== undefined && (
        <MessageBar intent="error" data-testid="joints-error">
          <MessageBarBody>{serverErrors.joints}</MessageBarBody>
        </MessageBar>
      )}

      {joints.length === 0 ? (
        <p className={styles.muted}>No joints recorded on this face yet.</p>
      ) : (
        <div role="table" aria-label="Joints of this face">
          <div role="row" className={mergeClasses(styles.grid, styles.head)}>
            <span role="columnheader">#</span>
            <span role="columnheader">Kind</span>
            <span role="columnheader">Orientation</span>
            <span role="columnheader">Set</span>
            <span role="columnheader">Spacing m</span>
            <span role="columnheader">Persist. m</span>
            <span role="columnheader">Aperture mm</span>
            <span role="columnheader">Jr</span>
            <span role="columnheader">Ja</span>
            <span role="columnheader">Water</span>
            <span role="columnheader" aria-label="Remove" />
          </div>
          {joints.map((j, i) => (
            <div
              role="row"
              key={j.key}
              className={mergeClasses(styles.grid, styles.joint, j.importNote !== '' && styles.jointProblem)}
              onKeyDown={onRowKey(i)}
              data-testid="joint-row"
            >
              <span role="cell" className={styles.number}>
                {i + 1}
              </span>
              <span role="cell">
                <Select
                  className={styles.select}
                  aria-label={`Kind of joint ${i + 1}`}
                  value={j.kind}
                  size="large"
                  disabled={readOnly}
                  onChange={(_e, data) => set(i, 'kind', data.value)}
                >
                  {jointKinds.map((k) => (
                    <option key={k} value={k}>
                      {jointKindLabels[k]}
                    </option>
                  ))}
                </Select>
              </span>
              <span role="cell">
                <OrientationField
                  label={`Orientation of joint ${i + 1}`}
                  text={j.orientationText}
                  notation={j.notation}
                  defaultNotation={defaultNotation}
                  readOnly={readOnly}
                  onTextChange={(t) => set(i, 'orientationText', t)}
                  onNotationChange={(n) => set(i, 'notation', n)}
                  inputRef={(el) => {
                    if (el === null) orientationInputs.current.delete(j.key);
                    else orientationInputs.current.set(j.key, el);
                  }}
                />
              </span>
              <span role="cell" className={styles.setCell}>
                <Input
                  className={styles.input}
                  aria-label={`Set of joint ${i + 1}`}
                  value={j.setOverride ? j.setLabel : (sets.membership[j.key] ?? '')}
                  size="large"
                  readOnly={readOnly}
                  onChange={(_e, data) => {
                    set(i, 'setLabel', data.value);
                    set(i, 'setOverride', true);
                  }}
                />
                {j.setOverride && (
                  <Button
                    size="small"
                    appearance="subtle"
                    icon={<ArrowResetRegular />}
                    title="Go back to the computed set"
                    disabled={readOnly}
                    onClick={() => {
                      set(i, 'setOverride', false);
                      set(i, 'setLabel', '');
                    }}
                  >
                    <span className={styles.override}>yours</span>
                  </Button>
                )}
              </span>
              <span role="cell">{numberInput(i, 'spacingM', 'Spacing', 'm')}</span>
              <span role="cell">{numberInput(i, 'persistenceM', 'Persistence', 'm')}</span>
              <span role="cell">{numberInput(i, 'apertureMm', 'Aperture', 'mm')}</span>
              <span role="cell">{numberInput(i, 'jr', 'Jr')}</span>
              <span role="cell">{numberInput(i, 'ja', 'Ja')}</span>
              <span role="cell">
                <Select
                  className={styles.select}
                  aria-label={`Water of joint ${i + 1}`}
                  value={j.water}
                  size="large"
                  disabled={readOnly}
                  onChange={(_e, data) => set(i, 'water', data.value)}
                >
                  <option value="">—</option>
                  {(Object.keys(waterLabels) as JointWater[]).map((w) => (
                    <option key={w} value={w}>
                      {waterLabels[w]}
                    </option>
                  ))}
                </Select>
              </span>
              <span role="cell">
                {!readOnly && (
                  <Button
                    className={styles.button}
                    size="large"
                    appearance="subtle"
                    icon={<DeleteRegular />}
                    aria-label={`Remove joint ${i + 1}`}
                    onClick={() =>
                      void setFieldValue(
                        'joints',
                        joints.filter((_, n) => n !== i),
                      )
                    }
                  />
                )}
              </span>
              {/* The joint's further fields: a cell across the row (a row holds only cells; axe, ARIA 1.2). */}
              <div role="cell" aria-colspan={11} className={styles.details}>
                <Field label="JRC" size="small">
                  {numberInput(i, 'jrc', 'JRC')}
                </Field>
                <Field label="JRC by" size="small">
                  <Select
                    className={styles.select}
                    aria-label={`JRC method of joint ${i + 1}`}
                    value={j.jrcMethod}
                    size="large"
                    disabled={readOnly}
                    onChange={(_e, data) => set(i, 'jrcMethod', data.value)}
                  >
                    <option value="">—</option>
                    {(Object.keys(jrcMethodLabels) as JrcMethod[]).map((m) => (
                      <option key={m} value={m}>
                        {jrcMethodLabels[m]}
                      </option>
                    ))}
                  </Select>
                </Field>
                <Field label="Infill" size="small">
                  <Input
                    className={styles.input}
                    aria-label={`Infill of joint ${i + 1}`}
                    value={j.infill}
                    size="large"
                    readOnly={readOnly}
                    onChange={(_e, data) => set(i, 'infill', data.value)}
                  />
                </Field>
                <Field
                  label={j.kind === 'fault' || j.kind === 'shear-zone' ? 'Thickness m' : 'Thickness'}
                  size="small"
                >
                  {j.kind === 'fault' || j.kind === 'shear-zone' ? (
                    numberInput(i, 'thicknessM', 'Thickness', 'm')
                  ) : (
                    <Caption1 className={styles.muted}>faults and shear zones</Caption1>
                  )}
                </Field>
                <Field label="Notes" size="small">
                  <Input
                    className={styles.input}
                    aria-label={`Notes of joint ${i + 1}`}
                    value={j.notes}
                    size="large"
                    readOnly={readOnly}
                    onChange={(_e, data) => set(i, 'notes', data.value)}
                  />
                </Field>
              </div>
              {j.importNote !== '' && (
                <div className={styles.note}>
                  <MessageBar intent="warning" data-testid="import-note">
                    <MessageBarBody>{`Imported with a problem — ${j.importNote}`}</MessageBarBody>
                    {!readOnly && (
                      <Button size="large" className={styles.button} onClick={() => set(i, 'importNote', '')}>
                        Fixed
                      </Button>
                    )}
                  </MessageBar>
                </div>
              )}
            </div>
          ))}
        </div>
      )}

      <section className={styles.sets} aria-label="Sets">
        <Subtitle2 as="h3">Sets</Subtitle2>
        <div className={styles.toolbar}>
          <Field label="Earlier rounds within" size="large" orientation="horizontal">
            <Select
              className={styles.select}
              value={String(distance)}
              size="large"
              onChange={(_e, data) => onDistanceChange(Number(data.value))}
            >
              {SET_WINDOWS.map((d) => (
                <option key={d} value={d}>
                  {d === 0 ? 'none (this round only)' : `${d} m of the face`}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Sets" size="large" orientation="horizontal">
            <Select
              className={styles.select}
              value={setCount === null ? '' : String(setCount)}
              size="large"
              aria-label="Number of sets"
              onChange={(_e, data) => onSetCountChange(data.value === '' ? null : Number(data.value))}
            >
              <option value="">found from the density</option>
              {[1, 2, 3, 4, 5].map((n) => (
                <option key={n} value={n}>
                  {`${n} ${n === 1 ? 'set' : 'sets'}`}
                </option>
              ))}
            </Select>
          </Field>
          <Caption1 className={styles.muted}>
            {nearbyLoading
              ? 'Reading the earlier rounds…'
              : `${sets.used} readable ${sets.used === 1 ? 'joint' : 'joints'} used, ${nearbyCount} of them from earlier rounds.`}
          </Caption1>
        </div>
        {sets.sets.length === 0 ? (
          <p className={styles.muted}>
            {setCount === null
              ? 'No set stands out from the density yet (it needs many joints). Choose the number of sets you see at the face.'
              : 'No sets yet: sets need at least two joints of similar orientation.'}
          </p>
        ) : (
          <table className={styles.setTable} data-testid="sets-table">
            <thead>
              <tr>
                <th scope="col">Set</th>
                <th scope="col">Mean (dip direction/dip)</th>
                <th scope="col">Joints (this round)</th>
                <th scope="col">k</th>
                <th scope="col">α95</th>
                <th scope="col">Mean spacing</th>
              </tr>
            </thead>
            <tbody>
              {sets.sets.map((s) => (
                <tr key={s.label}>
                  <th scope="row">{s.label}</th>
                  <td>{formatPlane(s.mean, 'dip-direction/dip')}</td>
                  <td>{`${s.count} (${s.countHere})`}</td>
                  <td>{fmt(s.k, 1)}</td>
                  <td>{`${fmt(s.alpha95, 1)}°`}</td>
                  <td>{s.meanSpacingM === null ? '—' : `${s.meanSpacingM.toFixed(2)} m`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      <JointImportDialog
        open={importing}
        defaultNotation={defaultNotation}
        onClose={() => setImporting(false)}
        onImport={(imported) => {
          void setFieldValue('joints', [...joints, ...imported]);
          setImporting(false);
        }}
      />
    </section>
  );
}
