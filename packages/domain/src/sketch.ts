// The face sketch as data: a versioned JSON document in metres in the face frame (geomath profile.ts:
// looking in the drive direction, x to the right of the centre line, y up from the invert). The browser
// draws only this document; every edit is a registered action (perform → next document + whether it is
// recorded for undo); the API validates a saved document with restoreSketch. Roundbook's own format.
import { polygonArea } from '@roundbook/geomath';

export const SKETCH_SCHEMA_VERSION = 2;

/** Largest stored sketch, bytes of JSON (the API refuses a larger one with 413). */
export const SKETCH_MAX_BYTES = 512 * 1024;
export const SKETCH_MAX_ELEMENTS = 2000;
/** Points of one trace or outline, and of the whole sketch. */
export const SKETCH_MAX_POINTS = 5000;
export const SKETCH_MAX_TOTAL_POINTS = 40000;
/** Coordinates are metres from the centre line / invert; a face is never wider or taller than this. */
export const SKETCH_MAX_COORDINATE_M = 100;
export const SKETCH_MAX_TEXT = 200;

export const TRACE_MODES = ['freehand', 'polyline'] as const;
export type TraceMode = (typeof TRACE_MODES)[number];

export const WATER_STATES = ['damp', 'dripping', 'flowing'] as const;
export type WaterState = (typeof WATER_STATES)[number];
export const waterStateLabels: Record<WaterState, string> = {
  damp: 'Damp',
  dripping: 'Dripping',
  flowing: 'Flowing',
};

/** A point of the sketch: [x right of the centre line, y up from the invert], metres. */
export type SketchPoint = [number, number];

/** What a trace stands for: one joint record of the round (by its id) or a whole set (by its label). */
export type TraceLink = { jointId: string } | { setLabel: string } | null;

export interface SketchTrace {
  id: string;
  kind: 'trace';
  mode: TraceMode;
  points: SketchPoint[];
  link: TraceLink;
}

export interface SketchLabel {
  id: string;
  kind: 'label';
  at: SketchPoint;
  text: string;
}

export interface SketchWater {
  id: string;
  kind: 'water';
  at: SketchPoint;
  state: WaterState;
  /** Inflow at this spot, l/min (flowing water only; null: not measured). */
  inflowLpm: number | null;
}

/** An overbreak beyond the excavation line, outlined as a closed ring. */
export interface SketchOverbreak {
  id: string;
  kind: 'overbreak';
  points: SketchPoint[];
}

export type SketchElement = SketchTrace | SketchLabel | SketchWater | SketchOverbreak;
export type SketchElementKind = SketchElement['kind'];

export interface SketchDocument {
  schemaVersion: typeof SKETCH_SCHEMA_VERSION;
  /** Always 'face-m': metres in the face frame, looking in the drive direction. */
  frame: 'face-m';
  elements: SketchElement[];
}

/**
 * Version 1 (the first shape, before water, labels and overbreak): traces only, each with an optional
 * joint id. Kept so a document saved then still opens.
 */
export interface SketchDocumentV1 {
  schemaVersion: 1;
  traces: { id: string; points: SketchPoint[]; jointId?: string | null }[];
}

export const emptySketch = (): SketchDocument => ({
  schemaVersion: SKETCH_SCHEMA_VERSION,
  frame: 'face-m',
  elements: [],
});

/** Why a document was refused: the first problem, with where it is. */
export class SketchError extends Error {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(message);
    this.name = 'SketchError';
  }
}

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

const ID = /^[A-Za-z0-9_-]{1,64}$/;

function fail(path: string, message: string): never {
  throw new SketchError(`Sketch ${path}: ${message}`, path);
}

function readId(v: unknown, path: string): string {
  if (typeof v !== 'string' || !ID.test(v))
    fail(path, 'an id is 1 to 64 letters, digits, "-" or "_" (a UUID)');
  return v;
}

function readNumber(v: unknown, path: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) fail(path, 'expected a number of metres');
  if (Math.abs(v) > SKETCH_MAX_COORDINATE_M)
    fail(path, `${v} m is outside the sketch (at most ${SKETCH_MAX_COORDINATE_M} m from the axis or invert)`);
  return v;
}

function readPoint(v: unknown, path: string): SketchPoint {
  if (!Array.isArray(v) || v.length !== 2) fail(path, 'a point is [x, y] in metres');
  return [readNumber(v[0], `${path}[0]`), readNumber(v[1], `${path}[1]`)];
}

function readPoints(v: unknown, path: string, min: number): SketchPoint[] {
  if (!Array.isArray(v)) fail(path, 'expected a list of [x, y] points');
  if (v.length < min) fail(path, `needs at least ${min} points, has ${v.length}`);
  if (v.length > SKETCH_MAX_POINTS) fail(path, `has ${v.length} points, at most ${SKETCH_MAX_POINTS}`);
  return v.map((p, i) => readPoint(p, `${path}[${i}]`));
}

function readText(v: unknown, path: string): string {
  if (typeof v !== 'string') fail(path, 'expected text');
  if (v.length > SKETCH_MAX_TEXT) fail(path, `text of ${v.length} characters, at most ${SKETCH_MAX_TEXT}`);
  return v;
}

function readLink(v: unknown, path: string): TraceLink {
  if (v === null || v === undefined) return null;
  if (isObject(v) && typeof v.jointId === 'string' && v.setLabel === undefined)
    return { jointId: readId(v.jointId, `${path}.jointId`) };
  if (isObject(v) && typeof v.setLabel === 'string' && v.jointId === undefined) {
    if (v.setLabel.length < 1 || v.setLabel.length > 20) fail(`${path}.setLabel`, 'a set label such as S1');
    return { setLabel: v.setLabel };
  }
  return fail(path, 'a link is { jointId } or { setLabel } or null');
}

function readElement(v: unknown, path: string): SketchElement {
  if (!isObject(v)) fail(path, 'expected an element object');
  const id = readId(v.id, `${path}.id`);
  switch (v.kind) {
    case 'trace': {
      if (!(TRACE_MODES as readonly unknown[]).includes(v.mode))
        fail(`${path}.mode`, `one of ${TRACE_MODES.join(', ')}`);
      return {
        id,
        kind: 'trace',
        mode: v.mode as TraceMode,
        points: readPoints(v.points, `${path}.points`, 2),
        link: readLink(v.link, `${path}.link`),
      };
    }
    case 'label': {
      const text = readText(v.text, `${path}.text`);
      if (text.trim() === '') fail(`${path}.text`, 'a label needs some text');
      return { id, kind: 'label', at: readPoint(v.at, `${path}.at`), text };
    }
    case 'water': {
      if (!(WATER_STATES as readonly unknown[]).includes(v.state))
        fail(`${path}.state`, `one of ${WATER_STATES.join(', ')}`);
      let inflow: number | null = null;
      if (v.inflowLpm !== null && v.inflowLpm !== undefined) {
        if (typeof v.inflowLpm !== 'number' || !Number.isFinite(v.inflowLpm) || v.inflowLpm < 0)
          fail(`${path}.inflowLpm`, 'inflow is l/min, 0 or more');
        if (v.state !== 'flowing') fail(`${path}.inflowLpm`, 'only flowing water has an inflow');
        inflow = v.inflowLpm;
      }
      return {
        id,
        kind: 'water',
        at: readPoint(v.at, `${path}.at`),
        state: v.state as WaterState,
        inflowLpm: inflow,
      };
    }
    case 'overbreak':
      return { id, kind: 'overbreak', points: readPoints(v.points, `${path}.points`, 3) };
    default:
      return fail(`${path}.kind`, 'one of trace, label, water, overbreak');
  }
}

function upgradeV1(v: Record<string, unknown>): Record<string, unknown> {
  if (!Array.isArray(v.traces)) fail('traces', 'a version 1 sketch has a list of traces');
  return {
    schemaVersion: SKETCH_SCHEMA_VERSION,
    frame: 'face-m',
    elements: v.traces.map((t: unknown) =>
      isObject(t)
        ? {
            id: t.id,
            kind: 'trace',
            mode: 'freehand',
            points: t.points,
            link: typeof t.jointId === 'string' ? { jointId: t.jointId } : null,
          }
        : t,
    ),
  };
}

/**
 * Reads a stored or received sketch: upgrades older versions to the current one and checks every field.
 * Throws SketchError (with the path of the first problem) for anything that is not a sketch.
 */
export function restoreSketch(input: unknown): SketchDocument {
  if (!isObject(input)) fail('document', 'expected an object with schemaVersion');
  let doc = input;
  if (doc.schemaVersion === 1) doc = upgradeV1(doc);
  if (doc.schemaVersion !== SKETCH_SCHEMA_VERSION) {
    fail(
      'schemaVersion',
      `version ${String(doc.schemaVersion)} is not known (this Roundbook reads 1 to ${SKETCH_SCHEMA_VERSION})`,
    );
  }
  if (doc.frame !== 'face-m') fail('frame', 'expected "face-m" (metres in the face frame)');
  if (!Array.isArray(doc.elements)) fail('elements', 'expected a list');
  if (doc.elements.length > SKETCH_MAX_ELEMENTS)
    fail('elements', `has ${doc.elements.length} elements, at most ${SKETCH_MAX_ELEMENTS}`);
  const elements = doc.elements.map((e, i) => readElement(e, `elements[${i}]`));
  const seen = new Set<string>();
  let total = 0;
  elements.forEach((e, i) => {
    if (seen.has(e.id)) fail(`elements[${i}].id`, `the id ${e.id} is used twice`);
    seen.add(e.id);
    total += 'points' in e ? e.points.length : 1;
  });
  if (total > SKETCH_MAX_TOTAL_POINTS)
    fail('elements', `has ${total} points in all, at most ${SKETCH_MAX_TOTAL_POINTS}`);
  return { schemaVersion: SKETCH_SCHEMA_VERSION, frame: 'face-m', elements };
}

/** Length of a trace along its points, metres (a persistence the geologist may take into the joint). */
export function traceLength(points: readonly SketchPoint[]): number {
  let sum = 0;
  for (let i = 1; i < points.length; i++)
    sum += Math.hypot(points[i][0] - points[i - 1][0], points[i][1] - points[i - 1][1]);
  return sum;
}

/**
 * Where a trace lies on the face for the look-ahead: the point halfway along its length, relative to the
 * tunnel axis (right of the centre line, up from the axis), the offset geomath planeCrossings takes. Every
 * point of a trace lies on its plane; the middle one is the least sensitive to a stroke's loose ends.
 */
export function tracePosition(
  points: readonly SketchPoint[],
  axisHeight: number,
): { right: number; up: number } {
  if (points.length === 0) throw new RangeError('A trace needs at least one point.');
  const half = traceLength(points) / 2;
  let walked = 0;
  for (let i = 1; i < points.length; i++) {
    const [a, b] = [points[i - 1], points[i]];
    const step = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (walked + step >= half && step > 0) {
      const t = (half - walked) / step;
      return { right: a[0] + t * (b[0] - a[0]), up: a[1] + t * (b[1] - a[1]) - axisHeight };
    }
    walked += step;
  }
  return { right: points[0][0], up: points[0][1] - axisHeight };
}

/**
 * The face position each joint's trace gives (tracePosition), by joint id: traces linked to the joint
 * itself (a set link names no one joint); the longest trace when a joint has several.
 */
export function jointPositionsOf(
  doc: SketchDocument | null | undefined,
  axisHeight: number,
): Map<string, { right: number; up: number }> {
  const best = new Map<string, { length: number; at: { right: number; up: number } }>();
  for (const e of doc?.elements ?? []) {
    if (e.kind !== 'trace' || e.link === null || !('jointId' in e.link)) continue;
    const length = traceLength(e.points);
    const had = best.get(e.link.jointId);
    if (had === undefined || length > had.length)
      best.set(e.link.jointId, { length, at: tracePosition(e.points, axisHeight) });
  }
  return new Map([...best].map(([id, v]) => [id, v.at]));
}

/** Area inside an overbreak outline, m² (shoelace, either winding). */
export const overbreakArea = (points: readonly SketchPoint[]): number => Math.abs(polygonArea(points));

/** The traces linked to a joint record, directly or through its set. */
export function tracesOfJoint(
  doc: SketchDocument,
  joint: { id: string; setLabel?: string | null },
): SketchTrace[] {
  return doc.elements.filter(
    (e): e is SketchTrace =>
      e.kind === 'trace' &&
      e.link !== null &&
      (('jointId' in e.link && e.link.jointId === joint.id) ||
        ('setLabel' in e.link && !!joint.setLabel && e.link.setLabel === joint.setLabel)),
  );
}

// ---- Actions: every edit of the document, registered by name ----

export interface ActionResult {
  document: SketchDocument;
  /** False for an edit that changes nothing (or must not be undone on its own). */
  recordUndo: boolean;
}

interface ActionPayloads {
  add: { element: SketchElement };
  move: { ids: string[]; dx: number; dy: number };
  remove: { ids: string[] };
  link: { id: string; link: TraceLink };
  editLabel: { id: string; text: string };
  editWater: { id: string; state: WaterState; inflowLpm: number | null };
  clear: Record<string, never>;
}
export type SketchActionName = keyof ActionPayloads;
export type SketchActionPayload<N extends SketchActionName> = ActionPayloads[N];

type Perform<N extends SketchActionName> = (doc: SketchDocument, payload: ActionPayloads[N]) => ActionResult;

const unchanged = (document: SketchDocument): ActionResult => ({ document, recordUndo: false });
const changed = (doc: SketchDocument, elements: SketchElement[]): ActionResult => ({
  document: restoreSketch({ ...doc, elements }),
  recordUndo: true,
});

const shift = (p: SketchPoint, dx: number, dy: number): SketchPoint => [p[0] + dx, p[1] + dy];

/** The registered actions; each checks its result with restoreSketch, so an edit cannot break the document. */
export const sketchActions: { [N in SketchActionName]: Perform<N> } = {
  add: (doc, { element }) => changed(doc, [...doc.elements, element]),
  move: (doc, { ids, dx, dy }) => {
    if ((dx === 0 && dy === 0) || ids.length === 0) return unchanged(doc);
    const set = new Set(ids);
    return changed(
      doc,
      doc.elements.map((e) => {
        if (!set.has(e.id)) return e;
        return 'points' in e
          ? { ...e, points: e.points.map((p) => shift(p, dx, dy)) }
          : { ...e, at: shift(e.at, dx, dy) };
      }),
    );
  },
  remove: (doc, { ids }) => {
    const set = new Set(ids);
    const elements = doc.elements.filter((e) => !set.has(e.id));
    return elements.length === doc.elements.length ? unchanged(doc) : changed(doc, elements);
  },
  link: (doc, { id, link }) =>
    changed(
      doc,
      doc.elements.map((e) => (e.id === id && e.kind === 'trace' ? { ...e, link } : e)),
    ),
  editLabel: (doc, { id, text }) =>
    changed(
      doc,
      doc.elements.map((e) => (e.id === id && e.kind === 'label' ? { ...e, text } : e)),
    ),
  editWater: (doc, { id, state, inflowLpm }) =>
    changed(
      doc,
      doc.elements.map((e) =>
        e.id === id && e.kind === 'water'
          ? { ...e, state, inflowLpm: state === 'flowing' ? inflowLpm : null }
          : e,
      ),
    ),
  clear: (doc) => (doc.elements.length === 0 ? unchanged(doc) : changed(doc, [])),
};

/** The document with its undo and redo stacks (kept in the browser, never stored). */
export interface SketchHistory {
  past: SketchDocument[];
  present: SketchDocument;
  future: SketchDocument[];
}

export const SKETCH_UNDO_DEPTH = 100;

export const historyOf = (present: SketchDocument): SketchHistory => ({ past: [], present, future: [] });

/** Runs a registered action; a recorded one can be undone and clears the redo stack. */
export function perform<N extends SketchActionName>(
  history: SketchHistory,
  name: N,
  payload: ActionPayloads[N],
): SketchHistory {
  const action = sketchActions[name] as Perform<N>;
  const result = action(history.present, payload);
  if (!result.recordUndo) return { ...history, present: result.document };
  return {
    past: [...history.past, history.present].slice(-SKETCH_UNDO_DEPTH),
    present: result.document,
    future: [],
  };
}

export function undo(history: SketchHistory): SketchHistory {
  const previous = history.past[history.past.length - 1];
  if (previous === undefined) return history;
  return {
    past: history.past.slice(0, -1),
    present: previous,
    future: [history.present, ...history.future],
  };
}

export function redo(history: SketchHistory): SketchHistory {
  const next = history.future[0];
  if (next === undefined) return history;
  return { past: [...history.past, history.present], present: next, future: history.future.slice(1) };
}
