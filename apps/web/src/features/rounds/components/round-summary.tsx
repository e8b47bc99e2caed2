import {
  Badge,
  Caption1,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
  Text,
  tokens,
} from '@fluentui/react-components';
import {
  formatCalendarDate,
  formatChainageFor,
  formatProjectTime,
  formatQ,
  type RoundSets,
} from '@roundbook/domain';
import {
  Q_EDITION,
  Q_TABLES,
  ratingCaution,
  RMR89_CONDITION_SIMPLE,
  RMR89_EDITION,
  RMR_TUNNEL_ADJUSTMENT,
  STRENGTH_GRADES,
  WEATHERING_GRADES,
} from '@roundbook/geomath';
import type { GradeRow } from '@roundbook/geomath';
import { useFormikContext } from 'formik';
import type { ReactNode } from 'react';
import type { GroundScale, HeadingDetail, Round, SupportClass } from '@/features/rounds/api/types';
import { SetsTable } from '@/features/rounds/components/joints-section';
import { RatingResult } from '@/features/rounds/components/rating-results';
import { classLines } from '@/features/rounds/components/support-section';
import type { QParameterKey, RoundFormValues } from '@/features/rounds/schemas/round-form';
import { chainageOf, valueOf } from '@/features/rounds/schemas/round-form';
import {
  jointKindLabels,
  jrcMethodLabels,
  qLocationLabels,
  sentence,
  shiftLabels,
  stageLabels,
  waterLabels,
} from '@/features/rounds/utils/labels';
import { readOrientation } from '@/features/rounds/utils/orientation';

// A round that cannot be edited (submitted or confirmed, or read by someone who does not map rounds) reads
// as a summary (issue 19 item 11): each section's record as label and value at full contrast, values wrap,
// choices in their full words, the joints as a table. It reads the same form values the editor shows and
// formats with packages/domain, so a value reads the same here as in the editor, the e-mails and the PDF.

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  groups: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(min(100%, 30rem), 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  group: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
    minWidth: 0,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  wide: { gridColumn: '1 / -1' },
  title: { margin: 0 },
  list: {
    margin: 0,
    display: 'grid',
    gridTemplateColumns: 'minmax(9rem, 16rem) minmax(0, 1fr)',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    fontSize: tokens.fontSizeBase400,
    lineHeight: tokens.lineHeightBase400,
  },
  label: { color: tokens.colorNeutralForeground1, overflowWrap: 'anywhere' },
  value: {
    margin: 0,
    minWidth: 0,
    color: tokens.colorNeutralForeground1,
    fontWeight: tokens.fontWeightSemibold,
    overflowWrap: 'anywhere',
    whiteSpace: 'pre-wrap',
  },
  note: { color: tokens.colorNeutralForeground1 },
  tableWrap: { overflowX: 'auto' },
  table: {
    width: '100%',
    borderCollapse: 'collapse',
    fontSize: tokens.fontSizeBase400,
    lineHeight: tokens.lineHeightBase400,
    color: tokens.colorNeutralForeground1,
    '& th, & td': {
      padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalS}`,
      borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
      textAlign: 'left',
      verticalAlign: 'top',
      overflowWrap: 'anywhere',
    },
    '& thead th': {
      fontWeight: tokens.fontWeightSemibold,
      borderBottom: `${tokens.strokeWidthThick} solid ${tokens.colorNeutralStroke1}`,
    },
    '& td': { fontVariantNumeric: 'tabular-nums' },
  },
  cards: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  classTop: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  classCode: { fontSize: tokens.fontSizeBase600, fontWeight: tokens.fontWeightBold },
});

/** One label and its value; an empty value reads as a dash. */
export interface SummaryItem {
  label: string;
  value: ReactNode;
  testId?: string;
}

const empty = (v: ReactNode) => v === null || v === undefined || v === '' || v === false;

/** Label/value pairs, full contrast, values wrap (never an ellipsis). */
export function SummaryList({ items }: { items: SummaryItem[] }) {
  const styles = useStyles();
  return (
    <dl className={styles.list}>
      {items.map((item) => (
        <div key={item.label} style={{ display: 'contents' }}>
          <dt className={styles.label}>{item.label}</dt>
          <dd className={styles.value} data-testid={item.testId}>
            {empty(item.value) ? '—' : item.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

function Group({ title, wide, children }: { title: string; wide?: boolean; children: ReactNode }) {
  const styles = useStyles();
  return (
    <section className={mergeClasses(styles.group, wide && styles.wide)} aria-label={title}>
      <Subtitle2 as="h3" className={styles.title}>
        {title}
      </Subtitle2>
      {children}
    </section>
  );
}

/** A typed number with its unit, or nothing when it was left empty. */
function withUnit(text: string, unit: string): string {
  const t = text.trim();
  return t === '' ? '' : `${t} ${unit}`;
}

export interface PositionSummaryProps {
  round: Round;
  heading: HeadingDetail;
  timeZone: string;
}

export function PositionSummary({ round, heading, timeZone }: PositionSummaryProps) {
  const styles = useStyles();
  const { values } = useFormikContext<RoundFormValues>();
  const chainage = (text: string) => {
    const m = chainageOf(text);
    return m === null ? '' : formatChainageFor(m, heading);
  };
  const length = valueOf(values.roundLength);
  return (
    <section className={styles.root} aria-label="Position" data-testid="summary-position">
      <div className={styles.groups}>
        <Group title="The round">
          <SummaryList
            items={[
              { label: 'Stage', value: stageLabels[round.stage] },
              { label: 'Round number', value: String(round.roundNumber) },
              { label: 'Mapped by', value: round.mappedByName },
              { label: `Opened (${timeZone})`, value: formatProjectTime(round.mappedAt, timeZone) },
              {
                label: 'Shift',
                value: shiftLabels[values.shift],
                testId: 'summary-shift',
              },
              {
                label: 'Shift date',
                value: values.shiftDate === '' ? '' : formatCalendarDate(values.shiftDate),
              },
            ]}
          />
        </Group>
        <Group title="Where the face is">
          <SummaryList
            items={[
              { label: 'Face chainage', value: chainage(values.faceChainage) },
              { label: 'Previous chainage', value: chainage(values.previousChainage) },
              {
                label: 'Round length',
                value:
                  length === null || Number.isNaN(length)
                    ? ''
                    : `${length} m (planned ${round.plannedRoundLength} m)`,
              },
              { label: 'Parts of the face seen only from a distance', value: values.distantParts.trim() },
            ]}
          />
        </Group>
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
    </section>
  );
}

/** A grade in its full words: "R4 strong — needs more than one hammer blow to break". */
function gradeWords(rows: readonly GradeRow[], code: string): string {
  const row = rows.find((g) => g.code === code);
  if (row === undefined) return code;
  const name = row.code === row.term ? sentence(row.term) : `${row.code} ${row.term}`;
  return `${name} — ${row.hint}`;
}

export function GroundSummary({
  groundScale,
  inflowPer10m,
}: {
  groundScale: GroundScale;
  inflowPer10m: number | null;
}) {
  const styles = useStyles();
  const { values } = useFormikContext<RoundFormValues>();
  const scaleName = groundScale === 'isrm' ? 'ISRM' : 'ISO 14689';
  return (
    <section className={styles.root} aria-label="Ground" data-testid="summary-ground">
      <Group title="Rock units" wide>
        <Caption1
          className={styles.note}
        >{`Grades on the ${scaleName} scale, as set for this project.`}</Caption1>
        {values.units.length === 0 ? (
          <Text className={styles.note}>No rock unit recorded.</Text>
        ) : (
          <div className={styles.tableWrap}>
            <table className={styles.table} aria-label="Rock units">
              <thead>
                <tr>
                  <th scope="col">Unit</th>
                  <th scope="col">Share of the face</th>
                  <th scope="col">Weathering</th>
                  <th scope="col">Strength</th>
                </tr>
              </thead>
              <tbody>
                {values.units.map((u) => (
                  <tr key={u.key}>
                    <th scope="row">{u.name.trim() || '—'}</th>
                    <td>{withUnit(u.sharePercent, '%') || '—'}</td>
                    <td>
                      {u.weatheringGrade
                        ? gradeWords(WEATHERING_GRADES[groundScale], u.weatheringGrade)
                        : '—'}
                    </td>
                    <td>
                      {u.strengthGrade ? gradeWords(STRENGTH_GRADES[groundScale], u.strengthGrade) : '—'}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Group>
      <div className={styles.groups}>
        <Group title="Strength and overbreak">
          <SummaryList
            items={[
              { label: 'Point-load index Is50', value: withUnit(values.pointLoadIs50, 'MPa') },
              { label: 'Factor used (UCS ≈ factor × Is50)', value: values.pointLoadFactor.trim() },
              { label: 'Overbreak', value: withUnit(values.overbreakM3, 'm³') },
            ]}
          />
        </Group>
        <Group title="Water">
          <SummaryList
            items={[
              { label: 'Water inflow', value: withUnit(values.inflowLpm, 'l/min') },
              { label: 'Tunnel length it comes from', value: withUnit(values.inflowLengthM, 'm') },
              {
                label: 'Inflow per 10 m',
                value: inflowPer10m === null ? '' : `${Math.round(inflowPer10m * 10) / 10} l/min`,
              },
              { label: 'Water at the face, in words', value: values.waterDescription.trim() },
            ]}
          />
        </Group>
        <Group title="Notes on the ground" wide>
          <SummaryList items={[{ label: 'Notes', value: values.groundNotes.trim() }]} />
        </Group>
      </div>
    </section>
  );
}

export function JointsSummary({ sets }: { sets: RoundSets }) {
  const styles = useStyles();
  const { values } = useFormikContext<RoundFormValues>();
  const { windowM, count } = values.setParameters;
  return (
    <section className={styles.root} aria-label="Joints" data-testid="summary-joints">
      <Group title={`Joints (${values.joints.length})`} wide>
        {values.joints.length === 0 ? (
          <Text className={styles.note}>No joints recorded on this face.</Text>
        ) : (
          <div className={styles.tableWrap}>
            <table className={styles.table} aria-label="Joints of this face">
              <thead>
                <tr>
                  <th scope="col">#</th>
                  <th scope="col">Kind</th>
                  <th scope="col">Orientation (dip direction/dip)</th>
                  <th scope="col">Set</th>
                  <th scope="col">Spacing</th>
                  <th scope="col">Persistence</th>
                  <th scope="col">Aperture</th>
                  <th scope="col">Jr</th>
                  <th scope="col">Ja</th>
                  <th scope="col">JRC</th>
                  <th scope="col">Water</th>
                  <th scope="col">Infill, notes</th>
                </tr>
              </thead>
              <tbody>
                {values.joints.map((j, i) => {
                  const reading = readOrientation(j.orientationText, j.notation);
                  const set = j.setOverride
                    ? `${j.setLabel || 'in no set'} (set by the geologist)`
                    : sets.membership[j.key];
                  const fault = j.kind === 'fault' || j.kind === 'shear-zone';
                  const remarks = [
                    j.infill.trim() && `Infill: ${j.infill.trim()}`,
                    fault && j.thicknessM.trim() && `${j.thicknessM.trim()} m thick`,
                    j.sameAsJointId && 'Same feature as one of an earlier round',
                    j.notes.trim(),
                  ].filter((p): p is string => typeof p === 'string' && p !== '');
                  return (
                    <tr key={j.key} data-testid="summary-joint">
                      <th scope="row">{i + 1}</th>
                      <td>{jointKindLabels[j.kind]}</td>
                      <td>
                        {reading.kind === 'plane'
                          ? reading.dipDirectionDip === j.orientationText.trim()
                            ? reading.dipDirectionDip
                            : `${reading.dipDirectionDip} (typed ${j.orientationText.trim()})`
                          : reading.kind === 'error'
                            ? `${j.orientationText.trim()} — not readable`
                            : '—'}
                      </td>
                      <td>{set || '—'}</td>
                      <td>{withUnit(j.spacingM, 'm') || '—'}</td>
                      <td>{withUnit(j.persistenceM, 'm') || '—'}</td>
                      <td>{withUnit(j.apertureMm, 'mm') || '—'}</td>
                      <td>{j.jr.trim() || '—'}</td>
                      <td>{j.ja.trim() || '—'}</td>
                      <td>
                        {j.jrc.trim() === ''
                          ? '—'
                          : `${j.jrc.trim()}${j.jrcMethod ? ` (${jrcMethodLabels[j.jrcMethod].toLowerCase()})` : ''}`}
                      </td>
                      <td>{j.water ? waterLabels[j.water] : '—'}</td>
                      <td>{remarks.length === 0 ? '—' : remarks.join('; ')}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}
      </Group>
      <Group title="Sets" wide>
        <SummaryList
          items={[
            {
              label: 'Joints used',
              value:
                windowM === 0
                  ? 'This round only'
                  : `This round and earlier rounds within ${windowM} m of the face`,
            },
            {
              label: 'Number of sets',
              value: count === null ? 'Found from the density' : `${count} asked for`,
            },
          ]}
        />
        {sets.sets.length === 0 ? (
          <Text className={styles.note}>No sets were found.</Text>
        ) : (
          <SetsTable sets={sets} />
        )}
      </Group>
    </section>
  );
}

const qKey = (parameter: string) => parameter as QParameterKey;

/** A Q parameter in full: "Ja 2 · Slightly altered joint walls, … (φr 25–30°)", or the value as typed. */
function qWords(values: RoundFormValues, table: (typeof Q_TABLES)[number]): string {
  const key = qKey(table.parameter);
  const row = table.rows.find((r) => r.id === values.q.rows[key]);
  const typed = values.q[key].trim();
  if (row !== undefined) {
    const band = row.range ? `${row.range[0]}–${row.range[1]}` : String(row.value);
    const value = typed !== '' && typed !== String(row.value) ? ` (${typed} used)` : '';
    return `${table.symbol} ${band}${value} · ${row.description}${row.extra ? ` (${row.extra})` : ''}`;
  }
  if (typed === '') return '';
  if (key === 'rqd')
    return `${table.symbol} ${typed} %${values.q.rqdFromJv ? ' — estimated from Jv, a correlation' : ''}`;
  // A value saved without its row (e.g. typed, or imported): the meaning of the rows that give that value.
  const same = table.rows.filter((r) => String(r.value) === typed);
  if (same.length === 0) return `${table.symbol} ${typed}`;
  const meaning = same.map((r) => `${r.description}${r.extra ? ` (${r.extra})` : ''}`);
  return `${table.symbol} ${typed} · ${meaning.length === 1 ? meaning[0] : `one of: ${meaning.join('; or ')}`}`;
}

export function RatingSummary({ saved }: { saved: Round['ratings'] }) {
  const styles = useStyles();
  const { values } = useFormikContext<RoundFormValues>();
  const rmr = values.rmr;
  const simple = RMR89_CONDITION_SIMPLE.find((r) => r.id === rmr.simple);
  const orientation = rmr.orientation;
  const condition: SummaryItem[] =
    rmr.conditionKind === 'simple'
      ? [
          {
            label: 'Condition of discontinuities',
            value: simple === undefined ? '' : `${simple.rating} · ${simple.description}`,
          },
        ]
      : [
          { label: 'Persistence', value: withUnit(rmr.persistenceM, 'm') },
          { label: 'Separation', value: withUnit(rmr.separationMm, 'mm') },
          { label: 'Roughness', value: rmr.roughness ? sentence(rmr.roughness) : '' },
          {
            label: 'Infilling',
            value:
              rmr.infillKind === 'none'
                ? 'None'
                : `${sentence(rmr.infillKind)}${rmr.infillMm.trim() ? `, ${rmr.infillMm.trim()} mm` : ''}`,
          },
          { label: 'Weathering of the walls', value: rmr.weathering ? sentence(rmr.weathering) : '' },
        ];
  const water: SummaryItem =
    rmr.waterKind === 'inflow'
      ? { label: 'Groundwater: inflow per 10 m', value: withUnit(rmr.inflowPer10m, 'l/min') }
      : rmr.waterKind === 'condition'
        ? {
            label: 'Groundwater: general condition',
            value: rmr.waterCondition ? sentence(rmr.waterCondition) : '',
          }
        : { label: 'Groundwater: water pressure / major stress', value: rmr.pressureRatio.trim() };
  return (
    <section className={styles.root} aria-label="Rating" data-testid="summary-rating">
      <div className={styles.cards}>
        <RatingResult title="Q" live={saved.q} saved={saved.q} format={formatQ} testId="rating-q" asSaved />
        <RatingResult
          title="RMR89"
          live={saved.rmr}
          saved={saved.rmr}
          format={(v) => v.toFixed(0)}
          testId="rating-rmr"
          asSaved
        />
        <RatingResult
          title="GSI"
          live={saved.gsi}
          saved={saved.gsi}
          format={(v) => v.toFixed(0)}
          testId="rating-gsi"
          asSaved
        />
      </div>
      <Group title="Q parameters" wide>
        <Caption1 className={styles.note}>{`Tables: ${Q_EDITION.name}.`}</Caption1>
        <dl className={styles.list}>
          {Q_TABLES.map((table) => {
            const words = qWords(values, table);
            return (
              <div key={table.parameter} style={{ display: 'contents' }}>
                <dt className={styles.label}>{`${table.symbol} — ${table.title}`}</dt>
                <dd className={styles.value} data-testid={`summary-q-${table.parameter}`}>
                  {words === '' ? '—' : words}
                </dd>
              </div>
            );
          })}
        </dl>
        <SummaryList
          items={[
            { label: 'Where', value: qLocationLabels[values.q.location] },
            {
              label: 'Relevant set spaced over 3 m',
              value: values.q.jrSpacingOver3m ? 'Yes — 1 added to Jr' : 'No',
            },
          ]}
        />
      </Group>
      <div className={styles.groups}>
        <Group title="RMR89 ratings">
          <Caption1 className={styles.note}>{`${RMR89_EDITION}.`}</Caption1>
          <SummaryList
            items={[
              rmr.strengthKind === 'point-load'
                ? { label: 'Strength: point-load index Is50', value: withUnit(rmr.is50, 'MPa') }
                : { label: 'Strength: uniaxial compressive strength', value: withUnit(rmr.ucs, 'MPa') },
              { label: 'RQD', value: withUnit(rmr.rqd, '%') },
              { label: 'Spacing of discontinuities', value: withUnit(rmr.spacingM, 'm') },
              ...condition,
              water,
              {
                label: 'Orientation of the discontinuities to the drive',
                value:
                  orientation === ''
                    ? 'Not assessed (no adjustment)'
                    : `${sentence(orientation)} (${RMR_TUNNEL_ADJUSTMENT[orientation]})`,
              },
            ]}
          />
        </Group>
        <Group title="GSI">
          <SummaryList
            items={[
              {
                label: 'GSI read from the chart at the face',
                value:
                  values.gsiObserved.trim() === ''
                    ? 'Not read: GSI from RMR89 (dry, unadjusted) − 5'
                    : values.gsiObserved.trim(),
              },
            ]}
          />
        </Group>
      </div>
      <Caption1 className={styles.note} data-testid="rating-cautions">
        {`${ratingCaution('empirical-aids').title}: they do not prove any support adequate; the responsible engineer and the competent person decide.`}
      </Caption1>
    </section>
  );
}

export function SupportSummary({
  classes,
  suggestedClassIds,
}: {
  classes: SupportClass[];
  suggestedClassIds: string[];
}) {
  const styles = useStyles();
  const { values } = useFormikContext<RoundFormValues>();
  const chosen = classes.find((c) => c.id === values.recommendedClassId) ?? null;
  const fitting = suggestedClassIds
    .map((id) => classes.find((c) => c.id === id))
    .filter((c): c is SupportClass => c !== undefined);
  const caution = ratingCaution('who-decides');
  return (
    <section className={styles.root} aria-label="Support" data-testid="summary-support">
      <MessageBar intent="warning" layout="multiline" data-testid="support-caution">
        <MessageBarBody>
          <MessageBarTitle>{caution.title}</MessageBarTitle>
          {caution.text}
        </MessageBarBody>
      </MessageBar>
      <div className={styles.groups}>
        <Group title="Recommended class">
          {chosen === null ? (
            <Text className={styles.note}>No class recommended.</Text>
          ) : (
            <>
              <div className={styles.classTop}>
                <span className={styles.classCode} data-testid="summary-class">
                  {chosen.code}
                </span>
                <Text weight="semibold">{chosen.name}</Text>
                {suggestedClassIds.includes(chosen.id) ? (
                  <Badge appearance="filled" color="success" size="large" shape="rounded">
                    Fits the ratings
                  </Badge>
                ) : (
                  <Badge appearance="filled" color="warning" size="large" shape="rounded">
                    Outside the suggestion
                  </Badge>
                )}
              </div>
              {classLines(chosen).map((line) => (
                <Text key={line} className={styles.note}>
                  {line}
                </Text>
              ))}
            </>
          )}
          <SummaryList
            items={[
              { label: 'Next round length', value: withUnit(values.nextRoundLength, 'm') },
              { label: 'Reason or remarks', value: values.recommendationReason.trim() },
            ]}
          />
        </Group>
        <Group title="Classes that fit the ratings">
          {fitting.length === 0 ? (
            <Text className={styles.note}>No class fitted the ratings as saved.</Text>
          ) : (
            <SummaryList
              items={fitting.map((c) => ({
                label: `${c.code} · ${c.name}`,
                value: classLines(c).join('\n'),
              }))}
            />
          )}
        </Group>
      </div>
    </section>
  );
}
