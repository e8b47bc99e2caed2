import {
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  Radio,
  RadioGroup,
  Subtitle2,
  Switch,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  ToggleButton,
  tokens,
} from '@fluentui/react-components';
import { ArrowDownloadRegular, LassoRegular } from '@fluentui/react-icons';
import { jointKindLabels } from '@roundbook/domain';
import type { Drive, Net, Plane, TerzaghiSampling } from '@roundbook/geomath';
import { RMR_ORIENTATION_RULE, formatPlane } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { ReactNode } from 'react';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { downloadPng, downloadSvg } from '@/features/orientation/components/download';
import { PoleChoiceBar } from '@/features/orientation/components/pole-choice-bar';
import { filePalette, screenPalette } from '@/features/orientation/components/screen-palette';
import { Stereonet } from '@/features/orientation/components/stereonet';
import type { FreeSurface } from '@/features/orientation/scene/daylight';
import { FREE_SURFACES } from '@/features/orientation/scene/daylight';
import { setColour } from '@/features/orientation/scene/palette';
import type { StereonetJoint, StereonetOptions } from '@/features/orientation/scene/stereonet-scene';
import {
  buildStereonetScene,
  lineNotations,
  netLabels,
  poleNotations,
  setOrder,
} from '@/features/orientation/scene/stereonet-scene';
import {
  KIND_LEGEND,
  markPath,
  RANDOM_SHAPE,
  setShape,
  shapePath,
} from '@/features/orientation/scene/symbols';

/** A joint to plot, with the lines the readout shows beside its notations and where to open it. */
export interface ViewJoint extends StereonetJoint {
  details: Array<{ label: string; value: string }>;
  /** Link to the round (and joint) it was mapped on. */
  href?: string;
}

/** A set to list beside the net. */
export interface ViewSet {
  label: string;
  mean: Plane;
  count: number;
  k: number | null;
  alpha95: number | null;
  /** RMR89 orientation assessment against the drive, in words, or null. */
  assessment: string | null;
}

export interface OrientationViewProps {
  joints: ViewJoint[];
  sets: ViewSet[];
  drive: Drive | null;
  highContrast: boolean;
  /** Terzaghi weights for the density, one per joint, with the words that state the weighting. */
  weighting?: { weights: number[]; label: string; sampling: TerzaghiSampling } | null;
  /** Base of the downloaded file's name (no extension). */
  fileName: string;
  /** What the net shows, in words (above the net). */
  caption: string;
  /** Extra controls (the heading's window and filters), shown above the net options. */
  children?: ReactNode;
  /** Friction angle the friction circle starts at (the project's, when there is one), degrees. */
  frictionAngle?: number;
  /**
   * Put joints in a set (a label) or take them out of their set (null), as the geologist's own choice: an
   * editable round. Absent or null: no choosing of poles (read only, or the heading's window).
   */
  onAssign?: ((ids: string[], label: string | null) => void) | null;
  /** Shown in the side column under the sets (e.g. the history of the sets along the heading). */
  aside?: ReactNode;
}

/**
 * Friction angle of the joints when the project gives none, degrees: the default of the kinematic screens
 * (packages/domain triggers.ts, common practice). The user can change it beside the switch.
 */
export const DEFAULT_FRICTION_ANGLE = 30;

/** viewBox size of the net on screen; CSS scales it to the space available. */
const SCREEN_SIZE = 560;
const FILE_SIZE = 900;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  options: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalL,
    alignItems: 'center',
  },
  option: { minHeight: `${TOUCH_TARGET_PX}px` },
  body: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXXL, alignItems: 'flex-start' },
  net: { flex: '1 1 24rem', minWidth: '18rem', maxWidth: '40rem' },
  side: { flex: '1 1 20rem', display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  readout: {
    padding: tokens.spacingHorizontalM,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  list: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: '2px',
    margin: 0,
  },
  dt: { color: tokens.colorNeutralForeground3 },
  dd: { margin: 0, fontWeight: tokens.fontWeightSemibold },
  notes: { color: tokens.colorNeutralForeground2 },
  caution: {
    color: tokens.colorNeutralForeground2,
    borderLeft: `${tokens.strokeWidthThick} solid ${tokens.colorPaletteDarkOrangeBorder2}`,
    paddingLeft: tokens.spacingHorizontalS,
  },
  key: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    color: tokens.colorNeutralForeground2,
  },
  keyItem: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  big: { minHeight: `${TOUCH_TARGET_PX}px` },
  choose: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalS,
  },
});

/** A set's or kind's symbol as a small inline picture. */
export function SymbolSwatch({
  setIndex,
  colour,
  paper,
  kind = 'joint',
}: {
  setIndex: number | null;
  colour: string;
  paper: string;
  kind?: StereonetJoint['kind'];
}) {
  const style = KIND_LEGEND.find((k) => k.kind === kind)?.style;
  const solid = style?.fill === 'solid';
  const mark = style ? markPath(style.mark, 10, 10, 6) : '';
  return (
    <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true">
      <path
        d={shapePath(setIndex === null ? RANDOM_SHAPE : setShape(setIndex), 10, 10, 6)}
        fill={solid ? colour : paper}
        stroke={colour}
        strokeWidth={style?.outline === 2 ? 2.2 : 1.2}
      />
      {mark &&
        (style?.mark === 'dot' ? (
          <path d={mark} fill={colour} />
        ) : (
          <path d={mark} stroke={solid ? paper : colour} strokeWidth={1.2} />
        ))}
    </svg>
  );
}

const fixed = (v: number | null, digits: number) =>
  v === null || !Number.isFinite(v) ? '—' : v.toFixed(digits);

/**
 * The stereonet with its options, the sets beside it and the readout of the pole last tapped. Shared by
 * the heading's Orientation tab and a round's orientation panel.
 */
export function OrientationView({
  joints,
  sets,
  drive,
  highContrast,
  weighting = null,
  fileName,
  caption,
  children,
  frictionAngle = DEFAULT_FRICTION_ANGLE,
  onAssign = null,
  aside,
}: OrientationViewProps) {
  const styles = useStyles();
  const [net, setNet] = useState<Net>('equal-area');
  const [grid, setGrid] = useState(false);
  const [contours, setContours] = useState(true);
  const [circles, setCircles] = useState<'none' | 'sets' | 'all'>('sets');
  const [friction, setFriction] = useState(false);
  const [phiText, setPhiText] = useState(String(frictionAngle));
  const [daylight, setDaylight] = useState<FreeSurface | 'none'>('none');
  const [intersections, setIntersections] = useState(false);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);
  // Choosing poles to put in a set (an editable round only): the mode, the chosen ids, the last change.
  const [choosingOn, setChoosingOn] = useState(false);
  const [chosen, setChosen] = useState<ReadonlySet<string>>(new Set());
  const [done, setDone] = useState<string | null>(null);
  const canChoose = onAssign !== null;
  const palette = useMemo(() => screenPalette(highContrast), [highContrast]);
  const phiValue = Number(phiText);
  const phiValid = phiText.trim() !== '' && Number.isFinite(phiValue) && phiValue > 0 && phiValue < 90;
  const phi = friction && phiValid ? phiValue : null;
  const options: Omit<StereonetOptions, 'size' | 'palette'> = {
    net,
    grid,
    contours,
    greatCircles: circles,
    drive,
    weighting,
    legend: true,
    frictionAngle: phi,
    daylight: daylight === 'none' ? [] : [daylight],
    intersections,
  };
  const setsForScene = sets.map((s) => ({ label: s.label, mean: s.mean, alpha95: s.alpha95 }));
  const scene = useMemo(
    () => buildStereonetScene(joints, setsForScene, { ...options, size: SCREEN_SIZE, palette }),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the options are all listed by value
    [joints, sets, net, grid, contours, circles, drive, weighting, palette, phi, daylight, intersections],
  );
  const order = setOrder([...sets.map((s) => s.label), ...joints.flatMap((j) => (j.set ? [j.set] : []))]);
  const selected = joints.find((j) => j.id === selectedId) ?? null;
  const selectedLine = selected ? null : (scene.lines.find((l) => l.id === selectedId) ?? null);
  // Poles no longer drawn (removed, or their orientation cleared) drop out of the choice.
  const chosenHere = joints.filter((j) => chosen.has(j.id)).map((j) => j.id);
  const toggle = (id: string) => {
    setDone(null);
    setChosen((c) => {
      const next = new Set(c);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  };
  const assign = (label: string | null) => {
    if (!onAssign || chosenHere.length === 0) return;
    onAssign(chosenHere, label);
    const n = chosenHere.length;
    setDone(
      `${n} pole${n === 1 ? '' : 's'} ${label === null ? `taken out of ${n === 1 ? 'its set' : 'their sets'}` : `put in set ${label}`} (your own choice; the Joints list shows it).`,
    );
    setChosen(new Set());
  };
  const fileScene = () =>
    buildStereonetScene(joints, setsForScene, {
      ...options,
      size: FILE_SIZE,
      palette: filePalette(highContrast),
    });

  return (
    <section className={styles.root} aria-label="Stereonet">
      {children}
      <div className={styles.options} role="group" aria-label="Net options">
        <RadioGroup
          layout="horizontal"
          value={net}
          onChange={(_, d) => setNet(d.value as Net)}
          aria-label="Projection"
        >
          <Radio className={styles.option} value="equal-area" label={netLabels['equal-area']} />
          <Radio className={styles.option} value="equal-angle" label={netLabels['equal-angle']} />
        </RadioGroup>
        <Switch
          className={styles.option}
          checked={grid}
          onChange={(_, d) => setGrid(d.checked)}
          label="Grid"
        />
        <Switch
          className={styles.option}
          checked={contours}
          onChange={(_, d) => setContours(d.checked)}
          label="Density contours"
        />
        <RadioGroup
          layout="horizontal"
          value={circles}
          onChange={(_, d) => setCircles(d.value as typeof circles)}
          aria-label="Great circles"
        >
          <Radio className={styles.option} value="none" label="No great circles" />
          <Radio className={styles.option} value="sets" label="Great circles of set means" />
          <Radio className={styles.option} value="all" label="Great circles of every joint" />
        </RadioGroup>
      </div>
      <div className={styles.options} role="group" aria-label="Sliding aids">
        <Switch
          className={styles.option}
          checked={friction}
          onChange={(_, d) => setFriction(d.checked)}
          label="Friction circle"
        />
        {friction && (
          <Field
            label="Friction angle φ (°)"
            validationState={phiValid ? 'none' : 'error'}
            validationMessage={phiValid ? undefined : 'Between 0 and 90°'}
          >
            <Input
              className={styles.option}
              type="number"
              inputMode="decimal"
              min={1}
              max={89}
              value={phiText}
              onChange={(_, d) => setPhiText(d.value)}
              style={{ width: '6rem' }}
            />
          </Field>
        )}
        <Switch
          className={styles.option}
          checked={intersections}
          onChange={(_, d) => setIntersections(d.checked)}
          label="Intersections of set pairs"
        />
        <RadioGroup
          layout="horizontal"
          value={daylight}
          onChange={(_, d) => setDaylight(d.value as typeof daylight)}
          aria-label="Daylight envelope"
          disabled={!drive}
        >
          <Radio className={styles.option} value="none" label="No daylight envelope" />
          {FREE_SURFACES.map((s) => (
            <Radio key={s} className={styles.option} value={s} label={`Daylights on the ${s}`} />
          ))}
        </RadioGroup>
      </div>
      <Caption1 className={styles.notes}>{caption}</Caption1>
      <div className={styles.body}>
        <div className={styles.net}>
          {canChoose && (
            <div className={styles.choose}>
              <ToggleButton
                className={styles.big}
                size="large"
                icon={<LassoRegular />}
                checked={choosingOn}
                onClick={() => {
                  setChoosingOn((on) => !on);
                  setChosen(new Set());
                  setDone(null);
                }}
              >
                Choose poles for a set
              </ToggleButton>
              {choosingOn && (
                <Caption1 className={styles.notes}>
                  Tap poles to choose them, or draw a loop around several. With the keys: arrows step through
                  the poles, Space or Enter chooses the one read.
                </Caption1>
              )}
            </div>
          )}
          {canChoose && choosingOn && (
            <PoleChoiceBar
              count={chosenHere.length}
              labels={order}
              onPut={(label) => assign(label)}
              onTakeOut={() => assign(null)}
              onClear={() => setChosen(new Set())}
            />
          )}
          {canChoose && done && (
            <Caption1 className={styles.notes} role="status" data-testid="pole-choice-done" block>
              {done}
            </Caption1>
          )}
          <Stereonet
            scene={scene}
            selectedId={selectedId}
            onPick={(p) => setSelectedId(p?.id ?? null)}
            onPickLine={(l) => setSelectedId(l.id)}
            choosing={
              canChoose && choosingOn
                ? {
                    ids: chosen,
                    onToggle: toggle,
                    onLasso: (ids) => {
                      setDone(null);
                      setChosen((c) => new Set([...c, ...ids]));
                    },
                  }
                : null
            }
          />
          {scene.notes.map((n) => (
            <Caption1 key={n} className={styles.notes} block>
              {n}
            </Caption1>
          ))}
          <div className={styles.key} aria-label="Symbols by kind">
            {KIND_LEGEND.map((k) => (
              <span key={k.kind} className={styles.keyItem}>
                <SymbolSwatch setIndex={null} colour={palette.ink} paper={palette.paper} kind={k.kind} />
                {k.label}
              </span>
            ))}
          </div>
          <div className={styles.options}>
            <Button
              className={styles.big}
              icon={<ArrowDownloadRegular />}
              onClick={() => downloadSvg(fileScene(), filePalette(highContrast).paper, `${fileName}.svg`)}
            >
              Save as SVG
            </Button>
            <Button
              className={styles.big}
              icon={<ArrowDownloadRegular />}
              onClick={() => {
                setSaveError(null);
                downloadPng(fileScene(), filePalette(highContrast).paper, `${fileName}.png`).catch(
                  (e: unknown) =>
                    setSaveError(e instanceof Error ? e.message : 'The PNG could not be saved.'),
                );
              }}
            >
              Save as PNG
            </Button>
          </div>
          {saveError && (
            <Caption1 className={styles.notes} role="alert">
              {saveError}
            </Caption1>
          )}
        </div>
        <div className={styles.side}>
          <Subtitle2 as="h3">Sets</Subtitle2>
          {sets.length === 0 ? (
            <Text>No set: too few poles, or none close enough together.</Text>
          ) : (
            <Table aria-label="Sets" size="medium">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Set</TableHeaderCell>
                  <TableHeaderCell>Poles</TableHeaderCell>
                  <TableHeaderCell>Mean plane</TableHeaderCell>
                  <TableHeaderCell>Fisher k</TableHeaderCell>
                  <TableHeaderCell>α95</TableHeaderCell>
                  <TableHeaderCell>RMR89 vs drive</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {sets.map((s) => {
                  const i = order.indexOf(s.label);
                  return (
                    <TableRow key={s.label}>
                      <TableCell>
                        <span className={styles.keyItem}>
                          <SymbolSwatch setIndex={i} colour={setColour(palette, i)} paper={palette.paper} />
                          {s.label}
                        </span>
                      </TableCell>
                      <TableCell>{s.count}</TableCell>
                      <TableCell>{formatPlane(s.mean)}</TableCell>
                      <TableCell>{fixed(s.k, 1)}</TableCell>
                      <TableCell>{s.alpha95 === null ? '—' : `${fixed(s.alpha95, 1)}°`}</TableCell>
                      <TableCell>{s.assessment ?? '—'}</TableCell>
                    </TableRow>
                  );
                })}
              </TableBody>
            </Table>
          )}
          {sets.length > 0 && drive && <Caption1 className={styles.notes}>{RMR_ORIENTATION_RULE}</Caption1>}
          {weighting && <Caption1 className={styles.notes}>{weighting.label}</Caption1>}
          {aside}
          <div className={styles.readout} aria-live="polite" aria-label="Pole read-out">
            {selectedLine ? (
              <>
                <Subtitle2 as="h3">Intersection {selectedLine.label}</Subtitle2>
                <dl className={styles.list}>
                  {lineNotations(selectedLine).map((n) => (
                    <div key={n.label} style={{ display: 'contents' }}>
                      <dt className={styles.dt}>{n.label}</dt>
                      <dd className={styles.dd}>{n.value}</dd>
                    </div>
                  ))}
                </dl>
              </>
            ) : selected === null ? (
              <Text>Tap a pole (or step through them with the arrow keys) to read it.</Text>
            ) : (
              <>
                <Subtitle2 as="h3">
                  {jointKindLabels[selected.kind]} {formatPlane(selected.plane)}
                </Subtitle2>
                <dl className={styles.list}>
                  {[...poleNotations(selected.plane), ...selected.details].map((n) => (
                    <div key={n.label} style={{ display: 'contents' }}>
                      <dt className={styles.dt}>{n.label}</dt>
                      <dd className={styles.dd}>{n.value}</dd>
                    </div>
                  ))}
                </dl>
                {selected.href && (
                  <Link to={selected.href}>
                    <Button className={styles.big} appearance="secondary">
                      Open its round
                    </Button>
                  </Link>
                )}
              </>
            )}
          </div>
          <Caption1 className={styles.caution}>
            Roundbook computes and plots; it does not judge the ground. Sets, contours and the shaded zone are
            aids: the responsible engineer and the competent person on site decide.
          </Caption1>
        </div>
      </div>
    </section>
  );
}
