import {
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Select,
  Subtitle2,
  ToggleButton,
  tokens,
} from '@fluentui/react-components';
import {
  AddRegular,
  ArrowResetRegular,
  ArrowUndoRegular,
  ChevronDownRegular,
  ChevronUpRegular,
  ClipboardPasteRegular,
  DeleteRegular,
  DismissRegular,
} from '@fluentui/react-icons';
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
import { SameFeaturePicker, type FeatureSource } from '@/features/rounds/components/same-feature-picker';
import type { JointRow, RoundFormValues } from '@/features/rounds/schemas/round-form';
import { emptyJoint, numberOf } from '@/features/rounds/schemas/round-form';
import { jointKindLabels, jointKinds, jrcMethodLabels, waterLabels } from '@/features/rounds/utils/labels';
import { readOrientation } from '@/features/rounds/utils/orientation';

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
  /** Where the round is, for "same feature as" (earlier rounds of the heading); absent: the link is only shown. */
  featureSource?: FeatureSource;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  toolbar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  // One line per joint (issue 19 item 4): the essentials in the row, the rest under More.
  grid: {
    display: 'grid',
    gridTemplateColumns:
      '2rem minmax(7.5rem, 9rem) minmax(19rem, 2.2fr) 6.5rem 5rem 4.25rem 4.25rem minmax(4rem, 1fr) 44px 60px',
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
    paddingBlock: tokens.spacingVerticalXXS,
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
  // The set pickers in the toolbar are as wide as their longest choice (never "found from the c…").
  // A label and its picker side by side, each as wide as it needs (not Fluent's 33 % / rest).
  pickerField: { gridTemplateColumns: 'max-content max-content', columnGap: tokens.spacingHorizontalS },
  picker: { minWidth: 'max-content', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  override: { fontSize: tokens.fontSizeBase200, color: tokens.colorPaletteDarkOrangeForeground1 },
  summary: {
    lineHeight: `${TOUCH_TARGET_PX}px`,
    overflow: 'hidden',
    textOverflow: 'ellipsis',
    whiteSpace: 'nowrap',
    color: tokens.colorNeutralForeground2,
    fontSize: tokens.fontSizeBase200,
  },
  // The remove target stands apart: its own column, a divider and 16 px from the expand toggle.
  removeCell: {
    display: 'flex',
    justifyContent: 'flex-end',
    borderLeft: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  toggle: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  remove: {
    minHeight: `${TOUCH_TARGET_PX}px`,
    minWidth: `${TOUCH_TARGET_PX}px`,
    color: tokens.colorPaletteRedForeground1,
  },
  details: {
    gridColumn: '2 / -1',
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(9.5rem, 1fr))',
    gap: tokens.spacingHorizontalS,
    paddingBottom: tokens.spacingVerticalS,
  },
  wide: { gridColumn: 'span 3' },
  note: { gridColumn: '2 / -1' },
  undo: {
    position: 'sticky',
    bottom: tokens.spacingVerticalS,
    zIndex: 2,
    boxShadow: tokens.shadow16,
  },
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

/** The fields under More that have a value, as short words for the row (what is recorded at a glance). */
function summaryOf(j: JointRow, linked: string | null): string {
  const parts = [
    j.persistenceM.trim() && `${j.persistenceM.trim()} m long`,
    j.apertureMm.trim() && `${j.apertureMm.trim()} mm open`,
    j.water && waterLabels[j.water].toLowerCase(),
    j.jrc.trim() && `JRC ${j.jrc.trim()}`,
    j.infill.trim() && j.infill.trim(),
    (j.kind === 'fault' || j.kind === 'shear-zone') &&
      j.thicknessM.trim() &&
      `${j.thicknessM.trim()} m thick`,
    linked,
    j.notes.trim() && j.notes.trim(),
  ];
  return parts.filter((p): p is string => typeof p === 'string' && p !== '').join(' · ');
}

/** "fault 240/20" — the removed joint named in the Undo bar. */
function removedWords(j: JointRow): string {
  const reading = readOrientation(j.orientationText, j.notation);
  const kind = jointKindLabels[j.kind].toLowerCase();
  return reading.kind === 'plane' ? `${kind} ${reading.dipDirectionDip}` : kind;
}

const fmt = (value: number | null, digits: number) =>
  value === null ? '—' : Number.isFinite(value) ? value.toFixed(digits) : '∞';

/** The sets of the round (mean, counts, Fisher k and α95, spacing): in the editor and the read-only summary. */
export function SetsTable({ sets }: { sets: RoundSets }) {
  const styles = useStyles();
  return (
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
  );
}

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
  featureSource,
}: JointsSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly, serverErrors } = useRoundEdit();
  const [importing, setImporting] = useState(false);
  const orientationInputs = useRef(new Map<string, HTMLInputElement>());
  const focusKey = useRef<string | null>(null);
  const joints = values.joints;
  // Rows whose further fields are shown (by joint key; a new row opens closed).
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  // The last joint removed, for Undo (kept until the next removal or until dismissed: no timer to race).
  const [removed, setRemoved] = useState<{ joint: JointRow; index: number } | null>(null);

  const toggle = (key: string) =>
    setOpen((o) => {
      const next = new Set(o);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });

  const removeJoint = (i: number) => {
    setRemoved({ joint: joints[i], index: i });
    void setFieldValue(
      'joints',
      joints.filter((_, n) => n !== i),
    );
  };

  // The joint comes back where it was, with its id (the next save puts it back on the round).
  const undoRemove = () => {
    if (removed === null) return;
    const at = Math.min(removed.index, joints.length);
    void setFieldValue('joints', [...joints.slice(0, at), removed.joint, ...joints.slice(at)]);
    focusKey.current = removed.joint.key;
    setRemoved(null);
  };

  const linkedLabel = (j: JointRow): string | null =>
    j.sameAsJointId ? 'same feature as an earlier one' : null;

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
            <span role="columnheader">Jr</span>
            <span role="columnheader">Ja</span>
            <span role="columnheader">Other fields</span>
            <span role="columnheader" aria-label="Show more" />
            <span role="columnheader" aria-label="Remove" />
          </div>
          {joints.map((j, i) => {
            const isOpen = open.has(j.key);
            const detailsId = `joint-details-${j.key}`;
            const fault = j.kind === 'fault' || j.kind === 'shear-zone';
            const reading = readOrientation(j.orientationText, j.notation);
            const summary = summaryOf(j, linkedLabel(j));
            return (
              <div
                role="row"
                key={j.key}
                className={mergeClasses(
                  styles.grid,
                  styles.joint,
                  j.importNote !== '' && styles.jointProblem,
                )}
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
                    compact
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
                <span role="cell">
                  <Input
                    className={styles.input}
                    aria-label={`Set of joint ${i + 1}`}
                    title={
                      j.setOverride
                        ? j.setLabel.trim() === ''
                          ? 'In no set, as you chose (Go back to the computed set under More)'
                          : 'Your own set (Go back to the computed set under More)'
                        : undefined
                    }
                    value={j.setOverride ? j.setLabel : (sets.membership[j.key] ?? '')}
                    placeholder={j.setOverride ? '—' : undefined}
                    size="large"
                    readOnly={readOnly}
                    contentAfter={j.setOverride ? <span className={styles.override}>yours</span> : undefined}
                    onChange={(_e, data) => {
                      set(i, 'setLabel', data.value);
                      set(i, 'setOverride', true);
                    }}
                  />
                </span>
                <span role="cell">{numberInput(i, 'spacingM', 'Spacing', 'm')}</span>
                <span role="cell">{numberInput(i, 'jr', 'Jr')}</span>
                <span role="cell">{numberInput(i, 'ja', 'Ja')}</span>
                <span role="cell" className={styles.summary} title={summary}>
                  {summary}
                </span>
                <span role="cell">
                  <ToggleButton
                    className={styles.toggle}
                    size="large"
                    appearance="subtle"
                    checked={isOpen}
                    icon={isOpen ? <ChevronUpRegular /> : <ChevronDownRegular />}
                    aria-label={`More of joint ${i + 1}`}
                    aria-expanded={isOpen}
                    aria-controls={isOpen ? detailsId : undefined}
                    onClick={() => toggle(j.key)}
                  />
                </span>
                <span role="cell" className={styles.removeCell}>
                  {!readOnly && (
                    <Button
                      className={styles.remove}
                      size="large"
                      appearance="subtle"
                      icon={<DeleteRegular />}
                      aria-label={`Remove joint ${i + 1}`}
                      onClick={() => removeJoint(i)}
                    />
                  )}
                </span>
                {isOpen && (
                  // The joint's further fields: a cell across the row (a row holds only cells; axe, ARIA 1.2).
                  <div role="cell" aria-colspan={10} id={detailsId} className={styles.details}>
                    <Field label="Persistence m" size="small">
                      {numberInput(i, 'persistenceM', 'Persistence', 'm')}
                    </Field>
                    <Field label="Aperture mm" size="small">
                      {numberInput(i, 'apertureMm', 'Aperture', 'mm')}
                    </Field>
                    <Field label="Water" size="small">
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
                    </Field>
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
                    <Field label={fault ? 'Thickness m' : 'Thickness'} size="small">
                      {fault ? (
                        numberInput(i, 'thicknessM', 'Thickness', 'm')
                      ) : (
                        <Caption1 className={styles.muted}>faults and shear zones</Caption1>
                      )}
                    </Field>
                    <Field label="Notes" size="small" className={styles.wide}>
                      <Input
                        className={styles.input}
                        aria-label={`Notes of joint ${i + 1}`}
                        value={j.notes}
                        size="large"
                        readOnly={readOnly}
                        onChange={(_e, data) => set(i, 'notes', data.value)}
                      />
                    </Field>
                    <div className={styles.wide}>
                      {featureSource ? (
                        <SameFeaturePicker
                          jointNumber={i + 1}
                          plane={reading.kind === 'plane' ? reading.plane : null}
                          value={j.sameAsJointId}
                          onChange={(id) => set(i, 'sameAsJointId', id)}
                          source={featureSource}
                          readOnly={readOnly}
                        />
                      ) : (
                        <Caption1 className={styles.muted}>
                          {j.sameAsJointId
                            ? 'Same feature as one of an earlier round.'
                            : 'Not linked to an earlier round.'}
                        </Caption1>
                      )}
                    </div>
                    {j.setOverride && (
                      <Field label="Set" size="small">
                        <Button
                          className={styles.button}
                          size="large"
                          icon={<ArrowResetRegular />}
                          disabled={readOnly}
                          onClick={() => {
                            set(i, 'setOverride', false);
                            set(i, 'setLabel', '');
                          }}
                        >
                          Go back to the computed set
                        </Button>
                      </Field>
                    )}
                  </div>
                )}
                {j.importNote !== '' && (
                  <div className={styles.note}>
                    <MessageBar intent="warning" data-testid="import-note">
                      <MessageBarBody>{`Imported with a problem — ${j.importNote}`}</MessageBarBody>
                      {!readOnly && (
                        <Button
                          size="large"
                          className={styles.button}
                          onClick={() => set(i, 'importNote', '')}
                        >
                          Fixed
                        </Button>
                      )}
                    </MessageBar>
                  </div>
                )}
              </div>
            );
          })}
        </div>
      )}

      {removed !== null && (
        <div className={styles.undo}>
          <MessageBar intent="info" data-testid="joint-removed" politeness="polite">
            <MessageBarBody>{`Joint ${removed.index + 1} (${removedWords(removed.joint)}) removed.`}</MessageBarBody>
            <MessageBarActions
              containerAction={
                <Button
                  className={styles.button}
                  size="large"
                  appearance="transparent"
                  icon={<DismissRegular />}
                  aria-label="Dismiss"
                  onClick={() => setRemoved(null)}
                />
              }
            >
              <Button className={styles.button} size="large" icon={<ArrowUndoRegular />} onClick={undoRemove}>
                Undo
              </Button>
            </MessageBarActions>
          </MessageBar>
        </div>
      )}

      <section className={styles.sets} aria-label="Sets">
        <Subtitle2 as="h3">Sets</Subtitle2>
        <div className={styles.toolbar}>
          <Field
            label="Earlier rounds within"
            size="large"
            orientation="horizontal"
            className={styles.pickerField}
          >
            <Select
              className={styles.picker}
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
          <Field label="Sets" size="large" orientation="horizontal" className={styles.pickerField}>
            <Select
              className={styles.picker}
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
          <SetsTable sets={sets} />
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
