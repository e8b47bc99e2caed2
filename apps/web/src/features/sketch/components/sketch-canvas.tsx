import type { SketchDocument, SketchElement, SketchPoint } from '@roundbook/domain';
import {
  overbreakArea,
  SKETCH_COLOURS,
  SKETCH_PIN_DISC_RADIUS_PX,
  SKETCH_PIN_DISC_RISE_PX,
} from '@roundbook/domain';
import type Konva from 'konva';
import { memo, useCallback, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { Circle, Group, Layer, Line, Rect, Stage, Text } from 'react-konva';
import type { FaceFrame, ViewTransform } from '@/features/sketch/utils/face-frame';
import {
  centreOf,
  dragDelta,
  flatPx,
  gridLines,
  toMetres,
  toPx,
  zoomAbout,
} from '@/features/sketch/utils/face-frame';
import type { DraftLine } from '@/features/sketch/utils/tools';

/** Concrete colours (Konva draws on a canvas, where theme variables do not resolve): the SVG render's. */
export const SKETCH_INK = SKETCH_COLOURS;

export interface SketchCanvasProps {
  document: SketchDocument;
  frame: FaceFrame;
  view: ViewTransform;
  onViewChange: (view: ViewTransform) => void;
  width: number;
  height: number;
  chainageText: string;
  draft: DraftLine | null;
  /** Colour of a trace (its set's colour, or the ink). */
  colourOf: (element: SketchElement) => string;
  selectedId: string | null;
  /** Traces drawn highlighted (the selected joint's). */
  highlighted: ReadonlySet<string>;
  /** Elements may be picked and dragged (the Select tool). */
  selecting: boolean;
  onPick: (id: string | null) => void;
  onMove: (id: string, dx: number, dy: number) => void;
  /** Pointer events in metres, for the drawing tools (pinch and pan are handled here). */
  onPointerDown: (p: SketchPoint) => void;
  onPointerMove: (p: SketchPoint) => void;
  onPointerUp: (p: SketchPoint) => void;
  onDoubleTap: () => void;
  /** Photos pinned on the face (not part of the document: each photo keeps its own pin). */
  pins?: SketchPhotoPin[];
  /** A tap on a photo's pin (with the Select tool, or read-only): opens that photo. */
  onPhotoPin?: (photoId: string) => void;
}

/** A photo's pin on the sketch, numbered as in the round's gallery. */
export interface SketchPhotoPin {
  photoId: string;
  number: number;
  at: SketchPoint;
}

/** Half the size of a pin's tap target, px (48 px across: big enough for a gloved finger). */
export const PIN_TARGET_RADIUS = 24;

/**
 * Roundbook's photo pin: a numbered disc on a short stem whose foot is the spot (drawn over everything). With
 * `onTap` the disc is a tap target (48 px across) that opens the photo.
 */
function PhotoPin({
  pin,
  view,
  onTap,
}: {
  pin: SketchPhotoPin;
  view: ViewTransform;
  onTap?: (photoId: string) => void;
}) {
  const [x, y] = toPx(view, pin.at);
  return (
    <Group
      name="photo-pin"
      id={`pin-${pin.photoId}`}
      listening={onTap !== undefined}
      onPointerDown={(e: Konva.KonvaEventObject<PointerEvent>) => {
        e.cancelBubble = true;
      }}
      onPointerUp={(e: Konva.KonvaEventObject<PointerEvent>) => {
        e.cancelBubble = true;
        onTap?.(pin.photoId);
      }}
    >
      <Circle x={x} y={y - 22} radius={PIN_TARGET_RADIUS} fill="rgba(0,0,0,0)" />
      <Line points={[x, y, x, y - 14]} stroke={SKETCH_INK.ink} strokeWidth={2} />
      <Circle x={x} y={y} radius={3} fill={SKETCH_INK.ink} />
      <Circle
        x={x}
        y={y - SKETCH_PIN_DISC_RISE_PX}
        radius={SKETCH_PIN_DISC_RADIUS_PX}
        fill={SKETCH_INK.ink}
        stroke={SKETCH_INK.paper}
        strokeWidth={2}
      />
      <Text
        x={x - 12}
        y={y - 33}
        width={24}
        align="center"
        text={String(pin.number)}
        fontSize={LABEL_FONT}
        fontStyle="bold"
        fill={SKETCH_INK.paper}
      />
    </Group>
  );
}

const LABEL_FONT = 13;

/** Roundbook's own water marks: a ring (damp), a ring with a falling drop (dripping), a filled drop with a run-off line (flowing). */
function WaterMark({
  element,
  view,
  selected,
}: {
  element: Extract<SketchElement, { kind: 'water' }>;
  view: ViewTransform;
  selected: boolean;
}) {
  const [x, y] = toPx(view, element.at);
  const colour = selected ? SKETCH_INK.selection : SKETCH_INK.water;
  return (
    <>
      {element.state === 'damp' && (
        <Circle x={x} y={y} radius={9} stroke={colour} strokeWidth={2} dash={[3, 3]} />
      )}
      {element.state === 'dripping' && (
        <>
          <Circle x={x} y={y} radius={9} stroke={colour} strokeWidth={2} />
          <Line points={[x, y + 9, x, y + 20]} stroke={colour} strokeWidth={2} />
          <Circle x={x} y={y + 24} radius={3} fill={colour} />
        </>
      )}
      {element.state === 'flowing' && (
        <>
          <Circle x={x} y={y} radius={9} fill={colour} />
          <Line
            points={[x, y + 9, x - 5, y + 17, x + 5, y + 25, x, y + 33]}
            stroke={colour}
            strokeWidth={2}
          />
          {element.inflowLpm !== null && (
            <Text
              x={x + 12}
              y={y - 6}
              text={`${element.inflowLpm} l/min`}
              fontSize={LABEL_FONT}
              fill={colour}
            />
          )}
        </>
      )}
    </>
  );
}

interface FrameLayerProps {
  frame: FaceFrame;
  view: ViewTransform;
  width: number;
  height: number;
  chainageText: string;
}

/**
 * The paper, grid, profile and reference lines: redrawn only when the view or the size changes (not while a
 * line is drawn; the drawing benchmark, e2e/bench/sketch-draw.bench.ts).
 */
const FrameLayer = memo(function FrameLayer({ frame, view, width, height, chainageText }: FrameLayerProps) {
  const bounds = useMemo(() => {
    const [x0, y0] = toMetres(view, { x: 0, y: height });
    const [x1, y1] = toMetres(view, { x: width, y: 0 });
    return { x0, y0, x1, y1 };
  }, [view, width, height]);

  const xs = gridLines(bounds.x0, bounds.x1);
  const ys = gridLines(bounds.y0, bounds.y1);
  const [, crownY] = toPx(view, [0, frame.height]);
  const label = (
    text: string,
    p: SketchPoint,
    align: 'left' | 'right' | 'center' = 'left',
    colour: string = SKETCH_INK.muted,
  ) => {
    const [x, y] = toPx(view, p);
    const w = 160;
    return (
      <Text
        text={text}
        x={align === 'left' ? x : align === 'right' ? x - w : x - w / 2}
        y={y - LABEL_FONT - 2}
        width={w}
        align={align}
        fontSize={LABEL_FONT}
        fill={colour}
        listening={false}
      />
    );
  };
  const half = frame.width / 2;

  return (
    <Layer listening={false}>
      <Rect x={0} y={0} width={width} height={height} fill={SKETCH_INK.paper} />
      {xs.map((m) => {
        const [x] = toPx(view, [m, 0]);
        return (
          <Line
            key={`x${m}`}
            points={[x, 0, x, height]}
            stroke={m % 5 === 0 ? SKETCH_INK.gridMajor : SKETCH_INK.grid}
            strokeWidth={1}
          />
        );
      })}
      {ys.map((m) => {
        const [, y] = toPx(view, [0, m]);
        return (
          <Line
            key={`y${m}`}
            points={[0, y, width, y]}
            stroke={m % 5 === 0 ? SKETCH_INK.gridMajor : SKETCH_INK.grid}
            strokeWidth={1}
          />
        );
      })}
      {/* the whole excavation line faint, the round's stage part bold */}
      <Line
        points={flatPx(view, frame.outline)}
        closed
        stroke={SKETCH_INK.otherStage}
        strokeWidth={1.5}
        dash={[6, 4]}
      />
      <Line points={flatPx(view, frame.part)} closed stroke={SKETCH_INK.excavation} strokeWidth={3} />
      {/* centre line and axis */}
      <Line
        points={flatPx(view, [
          [0, -0.5],
          [0, frame.height + 0.5],
        ])}
        stroke={SKETCH_INK.axis}
        strokeWidth={1}
        dash={[10, 4, 2, 4]}
      />
      <Line
        points={flatPx(view, [
          [-half - 0.5, frame.axisHeight],
          [half + 0.5, frame.axisHeight],
        ])}
        stroke={SKETCH_INK.axis}
        strokeWidth={1}
        dash={[10, 4, 2, 4]}
      />
      {label('Axis', [half + 0.6, frame.axisHeight + 0.05], 'left', SKETCH_INK.axis)}
      {/* springline */}
      <Line
        points={flatPx(view, [
          [-half - 0.3, frame.springline],
          [half + 0.3, frame.springline],
        ])}
        stroke={SKETCH_INK.muted}
        strokeWidth={1}
        dash={[2, 4]}
      />
      {label('Springline', [-half - 0.6, frame.springline + 0.05], 'right')}
      {frame.benchLine !== null && (
        <>
          <Line
            points={flatPx(view, [
              [-half - 0.3, frame.benchLine],
              [half + 0.3, frame.benchLine],
            ])}
            stroke={SKETCH_INK.ink}
            strokeWidth={1.5}
            dash={[12, 6]}
          />
          {label('Bench line', [-half - 0.6, frame.benchLine + 0.05], 'right', SKETCH_INK.ink)}
        </>
      )}
      <Circle x={toPx(view, [0, frame.height])[0]} y={crownY} radius={4} fill={SKETCH_INK.ink} />
      {label('Crown', [0.15, frame.height + 0.25])}
      {label('Left wall', [-half - 0.4, frame.height * 0.45], 'right', SKETCH_INK.ink)}
      {label('Right wall', [half + 0.4, frame.height * 0.45], 'left', SKETCH_INK.ink)}
      {label('Invert', [0.15, -0.05])}
      <Text
        x={12}
        y={10}
        text={`Face at ${chainageText} · looking in the drive direction`}
        fontSize={15}
        fontStyle="bold"
        fill={SKETCH_INK.ink}
      />
      <Text x={12} y={30} text="Grid 1 m" fontSize={LABEL_FONT} fill={SKETCH_INK.muted} />
    </Layer>
  );
});

interface ElementsLayerProps {
  document: SketchDocument;
  view: ViewTransform;
  colourOf: (element: SketchElement) => string;
  selectedId: string | null;
  highlighted: ReadonlySet<string>;
  selecting: boolean;
  pins: SketchPhotoPin[] | undefined;
  /** Stable handlers (SketchCanvas keeps them across renders). */
  onPick: (id: string | null) => void;
  onMove: (id: string, dx: number, dy: number) => void;
  onPhotoPin?: (photoId: string) => void;
  onDragging: (dragging: boolean) => void;
}

/** The document's elements and the photo pins: redrawn when the document, the view or the selection changes. */
const ElementsLayer = memo(function ElementsLayer(props: ElementsLayerProps) {
  const { document: doc, view, selecting, selectedId } = props;
  const pickable = (id: string) => ({
    onPointerDown: selecting
      ? (e: Konva.KonvaEventObject<PointerEvent>) => {
          e.cancelBubble = true;
          props.onPick(id);
        }
      : undefined,
    draggable: selecting && selectedId === id,
    onDragStart: () => props.onDragging(true),
    onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => {
      props.onDragging(false);
      const node = e.target;
      const { dx, dy } = dragDelta(view, node.position());
      node.position({ x: 0, y: 0 });
      props.onMove(id, dx, dy);
    },
    hitStrokeWidth: 24,
  });

  return (
    <Layer listening={selecting}>
      {doc.elements.map((el) => {
        const selected = selectedId === el.id;
        switch (el.kind) {
          case 'trace': {
            const lit = props.highlighted.has(el.id);
            return (
              <Line
                key={el.id}
                id={el.id}
                points={flatPx(view, el.points)}
                stroke={selected ? SKETCH_INK.selection : props.colourOf(el)}
                strokeWidth={lit || selected ? 6 : 3}
                shadowColor={lit ? SKETCH_INK.selection : undefined}
                shadowBlur={lit ? 12 : 0}
                lineCap="round"
                lineJoin="round"
                tension={el.mode === 'freehand' ? 0.3 : 0}
                {...pickable(el.id)}
              />
            );
          }
          case 'overbreak': {
            const [cx0, cy] = toPx(view, centreOf(el.points));
            // A ring too small for its figure gets it beside, right of the ring.
            const xs = el.points.map((p) => toPx(view, p)[0]);
            const narrow = Math.max(...xs) - Math.min(...xs) < 120;
            const cx = narrow ? Math.max(...xs) + 48 : cx0;
            return (
              <Group key={el.id} id={el.id} {...pickable(el.id)}>
                <Line
                  points={flatPx(view, el.points)}
                  closed
                  stroke={selected ? SKETCH_INK.selection : SKETCH_INK.overbreak}
                  strokeWidth={2}
                  fill={SKETCH_INK.overbreakFill}
                  dash={[8, 4]}
                />
                <Text
                  x={cx - 40}
                  y={cy - 7}
                  width={80}
                  align="center"
                  text={`${overbreakArea(el.points).toFixed(2)} m²`}
                  fontSize={LABEL_FONT}
                  fontStyle="bold"
                  fill={SKETCH_INK.overbreak}
                />
              </Group>
            );
          }
          case 'water':
            return (
              <Group key={el.id} id={el.id} {...pickable(el.id)}>
                <Rect x={toPx(view, el.at)[0] - 14} y={toPx(view, el.at)[1] - 14} width={28} height={50} />
                <WaterMark element={el} view={view} selected={selected} />
              </Group>
            );
          case 'label': {
            const [x, y] = toPx(view, el.at);
            return (
              <Text
                key={el.id}
                id={el.id}
                x={x}
                y={y}
                text={el.text}
                fontSize={15}
                padding={4}
                fill={selected ? SKETCH_INK.selection : SKETCH_INK.ink}
                {...pickable(el.id)}
              />
            );
          }
        }
      })}
      {props.pins?.map((pin) => (
        <PhotoPin key={pin.photoId} pin={pin} view={view} onTap={selecting ? props.onPhotoPin : undefined} />
      ))}
    </Layer>
  );
});

/** The face drawn at true scale: grid, profile, reference lines, then the document's elements. */
export function SketchCanvas(props: SketchCanvasProps) {
  const { document: doc, frame, view, width, height, draft, selecting, selectedId } = props;
  const stageRef = useRef<Konva.Stage>(null);
  const touches = useRef(new Map<number, { x: number; y: number }>());
  const pinch = useRef<{ distance: number; mid: { x: number; y: number } } | null>(null);
  const pan = useRef<{ x: number; y: number } | null>(null);
  const penSeen = useRef(0);
  const lastTap = useRef(0);
  const [dragging, setDragging] = useState(false);

  const pointer = (): { x: number; y: number } | null => stageRef.current?.getPointerPosition() ?? null;

  const down = (e: Konva.KonvaEventObject<PointerEvent>) => {
    const evt = e.evt;
    // Palm rejection: while a stylus is in use, touches of the hand are ignored.
    if (evt.pointerType === 'pen') penSeen.current = Date.now();
    if (evt.pointerType === 'touch' && Date.now() - penSeen.current < 1500) return;
    const at = pointer();
    if (at === null) return;
    if (evt.pointerType === 'touch') touches.current.set(evt.pointerId, at);
    if (touches.current.size === 2) {
      const [a, b] = [...touches.current.values()];
      pinch.current = {
        distance: Math.hypot(a.x - b.x, a.y - b.y),
        mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 },
      };
      return;
    }
    const now = Date.now();
    if (now - lastTap.current < 300) props.onDoubleTap();
    lastTap.current = now;
    if (selecting) {
      if (e.target === e.target.getStage()) {
        props.onPick(null);
        pan.current = at;
      }
      return;
    }
    props.onPointerDown(toMetres(view, at));
  };

  const move = (e: Konva.KonvaEventObject<PointerEvent>) => {
    const evt = e.evt;
    if (evt.pointerType === 'touch' && Date.now() - penSeen.current < 1500) return;
    const at = pointer();
    if (at === null) return;
    if (evt.pointerType === 'touch' && touches.current.has(evt.pointerId))
      touches.current.set(evt.pointerId, at);
    if (pinch.current !== null && touches.current.size === 2) {
      const [a, b] = [...touches.current.values()];
      const distance = Math.hypot(a.x - b.x, a.y - b.y);
      const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
      const zoomed = zoomAbout(view, distance / Math.max(1, pinch.current.distance), mid);
      props.onViewChange({
        ...zoomed,
        ox: zoomed.ox + mid.x - pinch.current.mid.x,
        oy: zoomed.oy + mid.y - pinch.current.mid.y,
      });
      pinch.current = { distance, mid };
      return;
    }
    if (pan.current !== null && !dragging) {
      props.onViewChange({ ...view, ox: view.ox + at.x - pan.current.x, oy: view.oy + at.y - pan.current.y });
      pan.current = at;
      return;
    }
    if (!selecting && (evt.buttons > 0 || evt.pointerType !== 'mouse'))
      props.onPointerMove(toMetres(view, at));
  };

  const up = (e: Konva.KonvaEventObject<PointerEvent>) => {
    const evt = e.evt;
    touches.current.delete(evt.pointerId);
    if (pinch.current !== null) {
      if (touches.current.size < 2) pinch.current = null;
      return;
    }
    pan.current = null;
    const at = pointer();
    if (at !== null && !selecting) props.onPointerUp(toMetres(view, at));
  };

  const wheel = (e: Konva.KonvaEventObject<WheelEvent>) => {
    e.evt.preventDefault();
    const at = pointer() ?? { x: width / 2, y: height / 2 };
    props.onViewChange(zoomAbout(view, e.evt.deltaY < 0 ? 1.15 : 1 / 1.15, at));
  };

  // Handlers that keep their identity across renders, so the memoised layers are not redrawn for a new closure.
  const latest = useRef(props);
  useLayoutEffect(() => {
    latest.current = props;
  });
  const onPick = useCallback((id: string | null) => latest.current.onPick(id), []);
  const onMove = useCallback((id: string, dx: number, dy: number) => latest.current.onMove(id, dx, dy), []);
  const onPhotoPin = useCallback((photoId: string) => latest.current.onPhotoPin?.(photoId), []);

  return (
    <Stage
      ref={stageRef}
      width={width}
      height={height}
      onPointerDown={down}
      onPointerMove={move}
      onPointerUp={up}
      onPointerCancel={up}
      onWheel={wheel}
      style={{ touchAction: 'none', cursor: selecting ? 'default' : 'crosshair' }}
    >
      <FrameLayer frame={frame} view={view} width={width} height={height} chainageText={props.chainageText} />
      <ElementsLayer
        document={doc}
        view={view}
        colourOf={props.colourOf}
        selectedId={selectedId}
        highlighted={props.highlighted}
        selecting={selecting}
        pins={props.pins}
        onPick={onPick}
        onMove={onMove}
        onPhotoPin={props.onPhotoPin ? onPhotoPin : undefined}
        onDragging={setDragging}
      />
      <Layer listening={false}>
        {draft !== null && (
          <Line
            points={flatPx(view, draft.points)}
            closed={draft.tool === 'overbreak'}
            stroke={draft.tool === 'overbreak' ? SKETCH_INK.overbreak : SKETCH_INK.ink}
            strokeWidth={3}
            dash={draft.tool === 'freehand' ? undefined : [6, 4]}
            listening={false}
          />
        )}
      </Layer>
    </Stage>
  );
}
