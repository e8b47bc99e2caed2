import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Radio,
  RadioGroup,
  Spinner,
  Subtitle2,
  ToggleButton,
  tokens,
} from '@fluentui/react-components';
import type { JointKind } from '@roundbook/domain';
import {
  JOINT_KINDS,
  driveTrendAt,
  formatChainageFor,
  jointKindLabels,
  onePerFeature,
  senseSign,
} from '@roundbook/domain';
import type { Drive, TerzaghiSampling } from '@roundbook/geomath';
import {
  TERZAGHI_SAMPLING_LABELS,
  driveOf,
  findSets,
  planeOfPole,
  poleOf,
  rmrOrientationInTunnel,
  terzaghiWeights,
} from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useCallback, useMemo, useState } from 'react';
import type { Heading } from '@/api/contract';
import {
  useMappedExtent,
  useWindowJoints,
  WINDOW_JOINT_LIMIT,
} from '@/features/orientation/api/get-window-joints';
import type { WindowJoint } from '@/features/orientation/api/get-window-joints';
import {
  DEFAULT_FRICTION_ANGLE,
  OrientationView,
  SymbolSwatch,
} from '@/features/orientation/components/orientation-view';
import type { ViewJoint, ViewSet } from '@/features/orientation/components/orientation-view';
import { RoofWedgeList } from '@/features/orientation/components/roof-wedge-list';
import { SetHistoryChart } from '@/features/orientation/components/set-history-chart';
import { setHistoryOf } from '@/features/orientation/scene/set-history';

export interface HeadingOrientationProps {
  projectId: string;
  heading: Heading;
  /** The high-contrast theme is on (the net then uses its own palette). */
  highContrast: boolean;
}

/** Quick windows back from the face, metres. */
export const WINDOW_LENGTHS = [25, 50, 100] as const;
const DEFAULT_WINDOW_M = 50;

const useStyles = makeStyles({
  controls: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    alignItems: 'flex-end',
  },
  field: { width: '11rem' },
  input: { minHeight: `${TOUCH_TARGET_PX}px` },
  big: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  kinds: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  option: { minHeight: `${TOUCH_TARGET_PX}px` },
});

interface Window {
  fromChainage: number;
  toChainage: number;
}

/** The last `length` metres behind the face (the face being the mapped end in the drive direction). */
export function windowBehindFace(
  extent: { from: number; to: number },
  length: number,
  sense: Heading['chainageSense'],
): Window {
  const sign = senseSign(sense);
  const face = sign > 0 ? extent.to : extent.from;
  const back = face - sign * length;
  return { fromChainage: Math.min(face, back), toChainage: Math.max(face, back) };
}

/** Chainage text typed by the engineer: metres ("1250.5") or km+m ("1+250.5"). */
export function readChainage(text: string): number | null {
  const t = text.trim().replace(',', '.');
  const km = /^(-?)(\d+)\+(\d+(?:\.\d+)?)$/.exec(t);
  if (km) {
    const v = Number(km[2]) * 1000 + Number(km[3]);
    return km[1] ? -v : v;
  }
  if (!/^-?\d+(\.\d+)?$/.test(t)) return null;
  return Number(t);
}

/**
 * The heading's Orientation tab: a chainage window of the heading's mapped joints on the stereonet, with
 * filters by kind, the sets of the window (Fisher mean, k and α95), Terzaghi weighting on request, a
 * read-out of any pole in every notation, and beside the net each round's set means along the chainage.
 */
export function HeadingOrientation({ projectId, heading, highContrast }: HeadingOrientationProps) {
  const styles = useStyles();
  const { extent, isPending: extentPending, error: extentError } = useMappedExtent(projectId, heading.id);
  const [chosen, setChosen] = useState<Window | null>(null);
  const extentFrom = extent?.from;
  const extentTo = extent?.to;
  const applied = useMemo(
    () =>
      chosen ??
      (extentFrom !== undefined && extentTo !== undefined
        ? windowBehindFace({ from: extentFrom, to: extentTo }, DEFAULT_WINDOW_M, heading.chainageSense)
        : null),
    [chosen, extentFrom, extentTo, heading.chainageSense],
  );
  const [fromText, setFromText] = useState<string | null>(null);
  const [toText, setToText] = useState<string | null>(null);
  const [hidden, setHidden] = useState<ReadonlySet<JointKind>>(new Set());
  const [sampling, setSampling] = useState<TerzaghiSampling | 'none'>('none');
  const joints = useWindowJoints(projectId, heading.id, applied);
  const chainage = useCallback((m: number) => formatChainageFor(m, heading), [heading]);

  const fromValue = fromText ?? (applied ? String(applied.fromChainage) : '');
  const toValue = toText ?? (applied ? String(applied.toChainage) : '');
  const from = readChainage(fromValue);
  const to = readChainage(toValue);
  const windowError =
    from === null || to === null ? 'Type both chainages in metres (1250.5) or km+m (1+250.5).' : null;

  const choose = (w: Window) => {
    setChosen({
      fromChainage: Math.min(w.fromChainage, w.toChainage),
      toChainage: Math.max(w.fromChainage, w.toChainage),
    });
    setFromText(null);
    setToText(null);
  };

  // The drive at the face end of the window, with the heading's gradient.
  const drive: Drive | null = useMemo(() => {
    if (!applied) return null;
    const faceEnd = senseSign(heading.chainageSense) > 0 ? applied.toChainage : applied.fromChainage;
    return { trend: driveTrendAt(heading, faceEnd), plunge: driveOf(heading).plunge };
  }, [applied, heading]);

  // A feature linked across faces ("same feature as") is one pole, at its latest face: the window's sets,
  // densities and Terzaghi weights count it once (issue 10 item 2; the rule is onePerFeature's).
  const visible = useMemo(
    () => (joints.data ?? []).filter((j) => !hidden.has(j.kind)),
    [joints.data, hidden],
  );
  const shown = useMemo(() => onePerFeature(visible, (a, b) => a.roundNumber - b.roundNumber), [visible]);
  const folded = visible.length - shown.length;
  // Each round's sets along the window: every sighting counts on its own round (the kinds shown only).
  const history = useMemo(() => setHistoryOf(visible), [visible]);
  const analysis = useMemo(
    () => analyse(projectId, shown, drive, sampling, chainage),
    [projectId, shown, drive, sampling, chainage],
  );

  if (extentPending) return <Spinner label="Reading the heading's rounds…" />;
  if (extentError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>The heading's rounds could not be read: {extentError.message}</MessageBarBody>
      </MessageBar>
    );
  if (!extent || !applied)
    return (
      <MessageBar intent="info">
        <MessageBarBody>
          No round is mapped on this heading yet: the stereonet fills in as rounds are mapped.
        </MessageBarBody>
      </MessageBar>
    );

  const count = joints.data?.length ?? 0;
  const caption =
    `${shown.length} of ${count} pole${count === 1 ? '' : 's'} from ${chainage(applied.fromChainage)} to ` +
    `${chainage(applied.toChainage)}` +
    (hidden.size > 0
      ? ` (hidden: ${[...hidden].map((k) => jointKindLabels[k].toLowerCase()).join(', ')})`
      : '') +
    (folded > 0
      ? `; ${folded} earlier sighting${folded === 1 ? '' : 's'} of features mapped again on a later face ${folded === 1 ? 'is' : 'are'} counted once, at the latest face`
      : '') +
    `. Sets W1, W2, … are found over this window (largest first); they are not yet matched to the set labels of the rounds.` +
    (count >= WINDOW_JOINT_LIMIT
      ? ` Only the ${WINDOW_JOINT_LIMIT} joints nearest the face are read: narrow the window.`
      : '');

  return (
    <OrientationView
      joints={analysis.joints}
      sets={analysis.sets}
      drive={drive}
      highContrast={highContrast}
      weighting={analysis.weighting}
      fileName={`${heading.code}-stereonet-${Math.round(applied.fromChainage)}-${Math.round(applied.toChainage)}`}
      caption={caption}
      aside={
        <>
          <SetHistoryChart
            history={history}
            fromChainage={applied.fromChainage}
            toChainage={applied.toChainage}
            chainage={chainage}
            highContrast={highContrast}
          />
          <RoofWedgeList sets={analysis.sets} frictionAngle={DEFAULT_FRICTION_ANGLE} scope="this stretch" />
        </>
      }
    >
      <Subtitle2 as="h2">Chainage window</Subtitle2>
      <form
        className={styles.controls}
        aria-label="Chainage window"
        onSubmit={(e) => {
          e.preventDefault();
          if (from !== null && to !== null) choose({ fromChainage: from, toChainage: to });
        }}
      >
        <Field className={styles.field} label="From chainage">
          <Input
            className={styles.input}
            inputMode="decimal"
            value={fromValue}
            onChange={(_, d) => setFromText(d.value)}
          />
        </Field>
        <Field className={styles.field} label="To chainage">
          <Input
            className={styles.input}
            inputMode="decimal"
            value={toValue}
            onChange={(_, d) => setToText(d.value)}
          />
        </Field>
        <Button className={styles.big} type="submit" appearance="primary" disabled={windowError !== null}>
          Show window
        </Button>
        {WINDOW_LENGTHS.map((m) => (
          <Button
            key={m}
            className={styles.big}
            onClick={() => choose(windowBehindFace(extent, m, heading.chainageSense))}
          >
            {`Last ${m} m`}
          </Button>
        ))}
        <Button
          className={styles.big}
          onClick={() => choose({ fromChainage: extent.from, toChainage: extent.to })}
        >
          Whole heading
        </Button>
      </form>
      {windowError && (fromText !== null || toText !== null) && (
        <MessageBar intent="warning">
          <MessageBarBody>{windowError}</MessageBarBody>
        </MessageBar>
      )}
      {joints.error && (
        <MessageBar intent="error">
          <MessageBarBody>The joints of this window could not be read: {joints.error.message}</MessageBarBody>
        </MessageBar>
      )}
      {joints.isFetching && <Spinner size="tiny" label="Reading the window's joints…" />}
      <div className={styles.kinds} role="group" aria-label="Kinds shown">
        {JOINT_KINDS.map((k) => (
          <ToggleButton
            key={k}
            className={styles.big}
            checked={!hidden.has(k)}
            icon={
              <SymbolSwatch
                setIndex={null}
                colour={tokens.colorNeutralForeground1}
                paper={tokens.colorNeutralBackground1}
                kind={k}
              />
            }
            onClick={() =>
              setHidden((h) => {
                const next = new Set(h);
                if (next.has(k)) next.delete(k);
                else next.add(k);
                return next;
              })
            }
          >
            {jointKindLabels[k]}
          </ToggleButton>
        ))}
      </div>
      <RadioGroup
        layout="horizontal"
        value={sampling}
        onChange={(_, d) => setSampling(d.value as typeof sampling)}
        aria-label="Weighting"
      >
        <Radio className={styles.option} value="none" label="Unweighted" />
        <Radio className={styles.option} value="scanline" label="Terzaghi, faces pooled along the axis" />
        <Radio className={styles.option} value="planar-window" label="Terzaghi, one face (planar window)" />
      </RadioGroup>
    </OrientationView>
  );
}

/** Poles, window sets (geomath findSets, optionally Terzaghi-weighted) and their rows. */
function analyse(
  projectId: string,
  shown: WindowJoint[],
  drive: Drive | null,
  sampling: TerzaghiSampling | 'none',
  chainage: (m: number) => string,
): {
  joints: ViewJoint[];
  sets: ViewSet[];
  weighting: { weights: number[]; label: string; sampling: TerzaghiSampling } | null;
} {
  const planes = shown.map((j) => ({ dipDirection: j.dipDirection, dip: j.dip }));
  const poles = planes.map(poleOf);
  const terzaghi =
    sampling !== 'none' && drive && poles.length > 0 ? { sampling, direction: drive } : undefined;
  const weights = terzaghi ? terzaghiWeights(poles, terzaghi) : null;
  const membership = new Map<number, string>();
  const sets: ViewSet[] = [];
  if (poles.length >= 2) {
    const found = findSets(poles, terzaghi ? { terzaghi } : undefined);
    found.sets.forEach((s, i) => {
      const label = `W${i + 1}`;
      for (const m of s.members) membership.set(m, label);
      const mean = planeOfPole(s.mean);
      sets.push({
        label,
        mean,
        count: s.members.length,
        k: Number.isFinite(s.k) ? s.k : null,
        alpha95: Number.isFinite(s.alpha95) ? s.alpha95 : null,
        assessment: drive ? rmrOrientationInTunnel(mean, drive).assessment : null,
      });
    });
  }
  const joints: ViewJoint[] = shown.map((j, i) => ({
    id: j.id,
    kind: j.kind,
    plane: planes[i],
    set: membership.get(i) ?? null,
    href: `/projects/${projectId}/rounds/${j.roundId}`,
    details: [
      { label: 'Round', value: `${j.roundNumber} at ${chainage(j.faceChainage)}` },
      { label: 'Window set', value: membership.get(i) ?? 'random (in no set)' },
      { label: "Round's set", value: j.setLabel ?? '—' },
      ...(weights ? [{ label: 'Terzaghi weight', value: weights.weights[i].toFixed(2) }] : []),
    ],
  }));
  return {
    joints,
    sets,
    weighting:
      weights && terzaghi
        ? {
            weights: weights.weights,
            label: TERZAGHI_SAMPLING_LABELS[terzaghi.sampling],
            sampling: terzaghi.sampling,
          }
        : null,
  };
}
