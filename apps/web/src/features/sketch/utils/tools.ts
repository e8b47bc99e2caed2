// What each drawing tool does with the pointer, as pure functions of metre points (no Konva here): the
// canvas turns pointer events into face-frame metres and calls these; a finished drawing comes back as a
// sketch element for the document's `add` action. The line being drawn is the only thing kept outside the
// document, and only until it is finished.
import type { SketchElement, SketchPoint, TraceLink, WaterState } from '@roundbook/domain';

export const SKETCH_TOOLS = ['select', 'freehand', 'polyline', 'overbreak', 'water', 'label'] as const;
export type SketchTool = (typeof SKETCH_TOOLS)[number];

export const toolLabels: Record<SketchTool, string> = {
  select: 'Select and move',
  freehand: 'Freehand trace',
  polyline: 'Straight-segment trace',
  overbreak: 'Overbreak outline',
  water: 'Water',
  label: 'Text label',
};

/** Freehand points closer than this to the last one are dropped (keeps long strokes small). */
export const FREEHAND_STEP_M = 0.05;

/** A line being drawn: the points so far and the tool drawing it. */
export interface DraftLine {
  tool: 'freehand' | 'polyline' | 'overbreak';
  points: SketchPoint[];
}

export interface ToolSettings {
  /** New element ids (UUIDs in the browser). */
  newId: () => string;
  /** The link a new trace gets (the joint or set chosen before drawing). */
  link: TraceLink;
  water: { state: WaterState; inflowLpm: number | null };
  labelText: string;
}

export interface ToolStep {
  draft: DraftLine | null;
  /** A finished element, for the `add` action. */
  add?: SketchElement;
}

/** Metres to the millimetre: what the document keeps. */
const mm = (v: number) => Math.round(v * 1000) / 1000;
export const snap = (p: SketchPoint): SketchPoint => [mm(p[0]), mm(p[1])];

const far = (a: SketchPoint, b: SketchPoint, step: number) => Math.hypot(a[0] - b[0], a[1] - b[1]) >= step;

/** A finished line as an element, or nothing when it is too short to keep. */
function elementOf(draft: DraftLine, settings: ToolSettings): SketchElement | undefined {
  const points = draft.points;
  if (draft.tool === 'overbreak') {
    return points.length >= 3 ? { id: settings.newId(), kind: 'overbreak', points } : undefined;
  }
  if (points.length < 2) return undefined;
  return {
    id: settings.newId(),
    kind: 'trace',
    mode: draft.tool === 'freehand' ? 'freehand' : 'polyline',
    points,
    link: settings.link,
  };
}

/** Pointer down at `p` (metres). */
export function pointerDown(
  tool: SketchTool,
  draft: DraftLine | null,
  p: SketchPoint,
  settings: ToolSettings,
): ToolStep {
  const at = snap(p);
  switch (tool) {
    case 'select':
      return { draft: null };
    case 'freehand':
      return { draft: { tool, points: [at] } };
    case 'polyline':
    case 'overbreak': {
      const points = draft?.tool === tool ? draft.points : [];
      const last = points[points.length - 1];
      // a tap on the last point again is not a new point
      if (last !== undefined && !far(last, at, 0.01)) return { draft: { tool, points } };
      return { draft: { tool, points: [...points, at] } };
    }
    case 'water':
      return {
        draft: null,
        add: {
          id: settings.newId(),
          kind: 'water',
          at,
          state: settings.water.state,
          inflowLpm: settings.water.state === 'flowing' ? settings.water.inflowLpm : null,
        },
      };
    case 'label': {
      const text = settings.labelText.trim();
      return text === ''
        ? { draft: null }
        : { draft: null, add: { id: settings.newId(), kind: 'label', at, text } };
    }
  }
}

/** Pointer moved to `p` with the button (or finger, or stylus) down: a freehand line grows. */
export function pointerMove(draft: DraftLine | null, p: SketchPoint): DraftLine | null {
  if (draft === null || draft.tool !== 'freehand') return draft;
  const at = snap(p);
  const last = draft.points[draft.points.length - 1];
  if (last !== undefined && !far(last, at, FREEHAND_STEP_M)) return draft;
  return { ...draft, points: [...draft.points, at] };
}

/** Pointer up: a freehand line is finished; straight-segment lines wait for Finish. */
export function pointerUp(draft: DraftLine | null, p: SketchPoint, settings: ToolSettings): ToolStep {
  if (draft === null || draft.tool !== 'freehand') return { draft };
  const grown = pointerMove(draft, p) ?? draft;
  const add = elementOf(grown, settings);
  return add ? { draft: null, add } : { draft: null };
}

/** Finish a straight-segment trace or an overbreak outline (button, double tap or Enter). */
export function finishLine(draft: DraftLine | null, settings: ToolSettings): ToolStep {
  if (draft === null) return { draft: null };
  const add = elementOf(draft, settings);
  return add ? { draft: null, add } : { draft: null };
}
