import {
  Badge,
  Button,
  Field,
  Input,
  makeStyles,
  Select,
  Text,
  ToggleButton,
  tokens,
  Tooltip,
} from '@fluentui/react-components';
import {
  ArrowRedoRegular,
  ArrowUndoRegular,
  CheckmarkRegular,
  CursorRegular,
  DeleteRegular,
  DropRegular,
  EditRegular,
  LineHorizontal1DashesRegular,
  ShapeOrganicRegular,
  TextTRegular,
  ZoomFitRegular,
} from '@fluentui/react-icons';
import type {
  SketchDocument,
  SketchElement,
  SketchHistory,
  SketchPoint,
  Stage,
  TraceLink,
  WaterState,
} from '@roundbook/domain';
import {
  historyOf,
  overbreakArea,
  perform,
  redo,
  traceLength,
  traceColourBySet,
  tracesOfJoint,
  undo,
  WATER_STATES,
  waterStateLabels,
  type SketchActionName,
  type SketchActionPayload,
} from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useCallback, useLayoutEffect, useMemo, useRef, useState, type ReactElement } from 'react';
import type { SketchPhotoPin } from '@/features/sketch/components/sketch-canvas';
import { SKETCH_INK, SketchCanvas } from '@/features/sketch/components/sketch-canvas';
import type { SketchProfileInput, ViewTransform } from '@/features/sketch/utils/face-frame';
import { faceFrameOf, fitView } from '@/features/sketch/utils/face-frame';
import type { DraftLine, SketchTool, ToolSettings, ToolStep } from '@/features/sketch/utils/tools';
import {
  finishLine,
  pointerDown,
  pointerMove,
  pointerUp,
  SKETCH_TOOLS,
  snap,
  toolLabels,
} from '@/features/sketch/utils/tools';

/** A joint of the round as the sketch lists it. */
export interface SketchJoint {
  id: string;
  /** Its place in the list, e.g. "Joint 3 · 120/60". */
  label: string;
  setLabel: string | null;
}

export interface SketchSectionProps {
  document: SketchDocument;
  onChange: (document: SketchDocument) => void;
  readOnly: boolean;
  heading: SketchProfileInput;
  stage: Stage;
  chainageText: string;
  joints: SketchJoint[];
  /** The round's sets with their colours (the stereonet's). */
  sets: { label: string; colour: string }[];
  /** The round's photos pinned on the face, numbered as in the gallery. */
  photoPins?: (SketchPhotoPin & { label: string })[];
  /** A photo waiting for its pin: the next tap on the face places it (the sketch itself is not changed). */
  pinning?: { photoId: string; label: string } | null;
  onPin?: (photoId: string, at: SketchPoint) => void;
  onCancelPin?: () => void;
  /** The pin could not be saved. */
  pinError?: string | null;
  /** Opens a pinned photo in the photo viewer (a tap on its pin, or its line in the list). */
  onOpenPhoto?: (photoId: string) => void;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM },
  bar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'end' },
  tool: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  body: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-start' },
  canvas: {
    flexGrow: 1,
    flexBasis: '560px',
    minWidth: '320px',
    border: `1px solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    overflow: 'hidden',
  },
  side: {
    flexBasis: '280px',
    flexGrow: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
  },
  joint: {
    minHeight: `${TOUCH_TARGET_PX}px`,
    justifyContent: 'space-between',
    width: '100%',
  },
  swatch: {
    display: 'inline-block',
    width: '14px',
    height: '14px',
    borderRadius: '3px',
    marginInlineEnd: '6px',
  },
});

const toolIcons: Record<SketchTool, ReactElement> = {
  select: <CursorRegular />,
  freehand: <EditRegular />,
  polyline: <LineHorizontal1DashesRegular />,
  overbreak: <ShapeOrganicRegular />,
  water: <DropRegular />,
  label: <TextTRegular />,
};

const newId = (): string => globalThis.crypto.randomUUID();

const linkValue = (link: TraceLink): string =>
  link === null ? '' : 'jointId' in link ? `joint:${link.jointId}` : `set:${link.setLabel}`;
const linkOf = (value: string): TraceLink =>
  value.startsWith('joint:')
    ? { jointId: value.slice(6) }
    : value.startsWith('set:')
      ? { setLabel: value.slice(4) }
      : null;

/** The Sketch section of a round: the face on the heading's profile, drawn with tools, linked to the joints. */
export function SketchSection(props: SketchSectionProps) {
  const { document: doc, onChange, readOnly, joints, sets, pinning } = props;
  const styles = useStyles();
  const frame = useMemo(() => faceFrameOf(props.heading, props.stage), [props.heading, props.stage]);
  const [history, setHistory] = useState<SketchHistory>(() => historyOf(doc));
  // A document from outside (another version loaded, a restored draft) starts a new history (adjusted
  // while rendering, React's pattern for state derived from a prop).
  if (history.present !== doc && !history.past.includes(doc) && !history.future.includes(doc)) {
    setHistory(historyOf(doc));
  }
  const present = history.present;
  const [tool, setTool] = useState<SketchTool>('select');
  const [draft, setDraft] = useState<DraftLine | null>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [selectedJoint, setSelectedJoint] = useState<string | null>(null);
  const [link, setLink] = useState<TraceLink>(null);
  const [water, setWater] = useState<{ state: WaterState; inflowLpm: number | null }>({
    state: 'damp',
    inflowLpm: null,
  });
  const [labelText, setLabelText] = useState('');
  const [error, setError] = useState<string | null>(null);

  const box = useRef<HTMLDivElement>(null);
  const [size, setSize] = useState({ width: 800, height: 560 });
  useLayoutEffect(() => {
    const el = box.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(([entry]) => {
      const width = Math.max(320, Math.floor(entry.contentRect.width));
      setSize({ width, height: Math.round(Math.min(640, Math.max(360, width * 0.7))) });
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const [view, setView] = useState<ViewTransform | null>(null);
  const fitted = useMemo(
    () => (frame ? fitView(frame, size.width, size.height) : null),
    [frame, size.width, size.height],
  );
  const shownView = view ?? fitted;

  const act = useCallback(
    <N extends SketchActionName>(name: N, payload: SketchActionPayload<N>) => {
      try {
        const next = perform(history, name, payload);
        setHistory(next);
        setError(null);
        if (next.present !== history.present) onChange(next.present);
      } catch (e) {
        setError(e instanceof Error ? e.message : 'That edit could not be made.');
      }
    },
    [history, onChange],
  );
  const step = (h: SketchHistory) => {
    setHistory(h);
    if (h.present !== history.present) onChange(h.present);
  };

  const settings: ToolSettings = { newId, link, water, labelText };
  const apply = (s: ToolStep) => {
    setDraft(s.draft);
    if (s.add) act('add', { element: s.add });
  };

  const setColour = useCallback(
    (label: string | null | undefined) => sets.find((s) => s.label === label)?.colour,
    [sets],
  );
  // The same rule as the PNG render's (packages/domain traceColourBySet), with the colours given here.
  const colourOf = useMemo(() => {
    const ofTrace = traceColourBySet(
      sets.map((s) => s.label),
      joints,
      sets.map((s) => s.colour),
    );
    return (el: SketchElement): string => (el.kind === 'trace' ? ofTrace(el) : SKETCH_INK.ink);
  }, [sets, joints]);

  const highlighted = useMemo(() => {
    const joint = joints.find((j) => j.id === selectedJoint);
    return new Set(joint ? tracesOfJoint(present, joint).map((t) => t.id) : []);
  }, [joints, selectedJoint, present]);
  const tracedJoints = useMemo(
    () => new Set(joints.filter((j) => tracesOfJoint(present, j).length > 0).map((j) => j.id)),
    [joints, present],
  );
  const selected = present.elements.find((e) => e.id === selectedId) ?? null;

  // Picking a trace shows its joint (or set) as selected; picking a joint lights up its traces.
  const pick = (id: string | null) => {
    setSelectedId(id);
    const el = present.elements.find((e) => e.id === id);
    if (el?.kind === 'trace' && el.link !== null) {
      if ('jointId' in el.link) setSelectedJoint(el.link.jointId);
      else
        setSelectedJoint(
          joints.find((j) => j.setLabel === (el.link as { setLabel: string }).setLabel)?.id ?? null,
        );
    } else if (id !== null) setSelectedJoint(null);
  };

  const keys = (e: React.KeyboardEvent) => {
    if (readOnly) return;
    const mod = e.ctrlKey || e.metaKey;
    if (mod && e.key.toLowerCase() === 'z') {
      e.preventDefault();
      step(e.shiftKey ? redo(history) : undo(history));
    } else if (mod && e.key.toLowerCase() === 'y') {
      e.preventDefault();
      step(redo(history));
    } else if (e.key === 'Enter') apply(finishLine(draft, settings));
    else if (e.key === 'Escape') setDraft(null);
    else if ((e.key === 'Delete' || e.key === 'Backspace') && selectedId !== null) {
      act('remove', { ids: [selectedId] });
      setSelectedId(null);
    }
  };

  if (frame === null || shownView === null) {
    return (
      <Text>
        The heading’s profile cannot be drawn (check its shape, width, height and axis height under Setup).
      </Text>
    );
  }

  const linkOptions = (
    <>
      <option value="">Not linked</option>
      {joints.map((j) => (
        <option key={j.id} value={`joint:${j.id}`}>
          {j.label}
        </option>
      ))}
      {sets.map((s) => (
        <option key={s.label} value={`set:${s.label}`}>
          {`Set ${s.label}`}
        </option>
      ))}
    </>
  );

  return (
    <section className={styles.root} aria-label="Sketch" onKeyDown={keys} tabIndex={-1}>
      {!readOnly && (
        <div className={styles.bar} role="toolbar" aria-label="Sketch tools">
          {SKETCH_TOOLS.map((t) => (
            <Tooltip key={t} content={toolLabels[t]} relationship="label">
              <ToggleButton
                className={styles.tool}
                size="large"
                icon={toolIcons[t]}
                checked={tool === t}
                onClick={() => {
                  setTool(t);
                  setDraft(null);
                }}
              />
            </Tooltip>
          ))}
          <Tooltip content="Undo" relationship="label">
            <Button
              className={styles.tool}
              size="large"
              icon={<ArrowUndoRegular />}
              disabled={history.past.length === 0}
              onClick={() => step(undo(history))}
            />
          </Tooltip>
          <Tooltip content="Redo" relationship="label">
            <Button
              className={styles.tool}
              size="large"
              icon={<ArrowRedoRegular />}
              disabled={history.future.length === 0}
              onClick={() => step(redo(history))}
            />
          </Tooltip>
          <Tooltip content="Delete the selected element" relationship="label">
            <Button
              className={styles.tool}
              size="large"
              icon={<DeleteRegular />}
              disabled={selectedId === null}
              onClick={() => {
                if (selectedId !== null) act('remove', { ids: [selectedId] });
                setSelectedId(null);
              }}
            />
          </Tooltip>
          <Tooltip content="Fit the face to the screen" relationship="label">
            <Button
              className={styles.tool}
              size="large"
              icon={<ZoomFitRegular />}
              onClick={() => setView(null)}
            />
          </Tooltip>
          {(tool === 'freehand' || tool === 'polyline') && (
            <Field label="New traces link to">
              <Select size="large" value={linkValue(link)} onChange={(_e, d) => setLink(linkOf(d.value))}>
                {linkOptions}
              </Select>
            </Field>
          )}
          {(tool === 'polyline' || tool === 'overbreak') && (
            <Button
              className={styles.tool}
              size="large"
              icon={<CheckmarkRegular />}
              disabled={draft === null}
              onClick={() => apply(finishLine(draft, settings))}
            >
              Finish line
            </Button>
          )}
          {tool === 'water' && (
            <>
              <Field label="Water">
                <Select
                  size="large"
                  value={water.state}
                  onChange={(_e, d) => setWater({ ...water, state: d.value as WaterState })}
                >
                  {WATER_STATES.map((s) => (
                    <option key={s} value={s}>
                      {waterStateLabels[s]}
                    </option>
                  ))}
                </Select>
              </Field>
              {water.state === 'flowing' && (
                <Field label="Inflow (l/min)">
                  <Input
                    size="large"
                    type="number"
                    min={0}
                    value={water.inflowLpm === null ? '' : String(water.inflowLpm)}
                    onChange={(_e, d) => {
                      const v = d.value === '' ? null : Number(d.value);
                      setWater({
                        ...water,
                        inflowLpm: v !== null && Number.isFinite(v) && v >= 0 ? v : null,
                      });
                    }}
                  />
                </Field>
              )}
            </>
          )}
          {tool === 'label' && (
            <Field label="Label text (tap the face to place it)">
              <Input
                size="large"
                value={labelText}
                maxLength={200}
                onChange={(_e, d) => setLabelText(d.value)}
              />
            </Field>
          )}
        </div>
      )}
      {pinning && (
        <div className={styles.bar} role="status" data-testid="sketch-pinning">
          <Text weight="semibold">{`Tap the face where “${pinning.label}” was taken.`}</Text>
          <Button className={styles.tool} size="large" onClick={() => props.onCancelPin?.()}>
            Cancel the pin
          </Button>
          {props.pinError && <Text role="alert">{props.pinError}</Text>}
        </div>
      )}
      {error !== null && (
        <Text role="alert" style={{ color: tokens.colorPaletteRedForeground1 }}>
          {error}
        </Text>
      )}
      <div className={styles.body}>
        <div className={styles.canvas} ref={box} data-testid="sketch-canvas">
          <SketchCanvas
            document={present}
            frame={frame}
            view={shownView}
            onViewChange={setView}
            width={size.width}
            height={size.height}
            chainageText={props.chainageText}
            draft={draft}
            colourOf={colourOf}
            selectedId={selectedId}
            highlighted={highlighted}
            selecting={!pinning && (readOnly || tool === 'select')}
            pins={props.photoPins}
            onPhotoPin={props.onOpenPhoto}
            onPick={pick}
            onMove={(id, dx, dy) => act('move', { ids: [id], dx, dy })}
            onPointerDown={(p) => {
              if (pinning) props.onPin?.(pinning.photoId, snap(p));
              else if (!readOnly) apply(pointerDown(tool, draft, p, settings));
            }}
            onPointerMove={(p) => !pinning && setDraft((d) => pointerMove(d, p))}
            onPointerUp={(p) => !readOnly && !pinning && apply(pointerUp(draft, p, settings))}
            onDoubleTap={() => !readOnly && !pinning && apply(finishLine(draft, settings))}
          />
        </div>
        <div className={styles.side}>
          {selected !== null && (
            <div data-testid="sketch-selection">
              {selected.kind === 'trace' && (
                <>
                  <Text
                    block
                    weight="semibold"
                  >{`Trace · ${traceLength(selected.points).toFixed(2)} m long`}</Text>
                  <Field label="Linked to">
                    <Select
                      size="large"
                      disabled={readOnly}
                      value={linkValue(selected.link)}
                      onChange={(_e, d) => {
                        const next = linkOf(d.value);
                        act('link', { id: selected.id, link: next });
                        if (next !== null && 'jointId' in next) setSelectedJoint(next.jointId);
                      }}
                    >
                      {linkOptions}
                    </Select>
                  </Field>
                </>
              )}
              {selected.kind === 'overbreak' && (
                <Text
                  block
                  weight="semibold"
                >{`Overbreak · ${overbreakArea(selected.points).toFixed(2)} m² on the face`}</Text>
              )}
              {selected.kind === 'water' && (
                <Text block weight="semibold">
                  {`${waterStateLabels[selected.state]}${selected.inflowLpm !== null ? ` · ${selected.inflowLpm} l/min` : ''}`}
                </Text>
              )}
              {selected.kind === 'label' && <Text block weight="semibold">{`Label “${selected.text}”`}</Text>}
            </div>
          )}
          <Text weight="semibold">Joints of this round</Text>
          {joints.length === 0 && <Text>No joints recorded yet (Joints section).</Text>}
          {joints.map((j) => {
            const colour = setColour(j.setLabel);
            return (
              <ToggleButton
                key={j.id}
                className={styles.joint}
                size="large"
                appearance="subtle"
                checked={selectedJoint === j.id}
                data-testid={`sketch-joint-${j.id}`}
                onClick={() => {
                  setSelectedJoint(selectedJoint === j.id ? null : j.id);
                  const first = tracesOfJoint(present, j)[0];
                  setSelectedId(first?.id ?? null);
                }}
              >
                <span>
                  {colour && <span className={styles.swatch} style={{ backgroundColor: colour }} />}
                  {j.label}
                  {j.setLabel ? ` · ${j.setLabel}` : ''}
                </span>
                {/* The name is the visible text (axe label-content-name-mismatch): "Joint 1 · 130/50 · S1 Traced on the sketch" */}
                {tracedJoints.has(j.id) && (
                  <>
                    {' '}
                    <Badge appearance="tint" color="brand">
                      Traced on the sketch
                    </Badge>
                  </>
                )}
              </ToggleButton>
            );
          })}
          {(props.photoPins?.length ?? 0) > 0 && (
            <>
              <Text weight="semibold">Photos pinned on the sketch</Text>
              {props.photoPins!.map((pin) =>
                props.onOpenPhoto ? (
                  <Button
                    key={pin.photoId}
                    className={styles.joint}
                    size="large"
                    appearance="subtle"
                    data-testid={`sketch-pin-${pin.photoId}`}
                    onClick={() => props.onOpenPhoto?.(pin.photoId)}
                  >
                    {`${pin.number} · ${pin.label}`}
                  </Button>
                ) : (
                  <Text key={pin.photoId} data-testid={`sketch-pin-${pin.photoId}`}>
                    {`${pin.number} · ${pin.label}`}
                  </Text>
                ),
              )}
            </>
          )}
          <Text size={200}>
            Damp: dashed ring · Dripping: ring with a falling drop · Flowing: filled drop with a run-off line
            and its inflow. Overbreak: dashed outline with its area. Numbered disc on a stem: where a photo of
            the round was taken (its number in Photos); tap it, with Select and move, to open the photo.
          </Text>
        </div>
      </div>
    </section>
  );
}
