import {
  emptySketch,
  historyOf,
  overbreakArea,
  perform,
  redo,
  restoreSketch,
  SketchError,
  SKETCH_MAX_ELEMENTS,
  SKETCH_SCHEMA_VERSION,
  traceLength,
  tracesOfJoint,
  undo,
  type SketchElement,
} from '../src/index.js';

const trace = (
  id: string,
  link: { jointId: string } | { setLabel: string } | null = null,
): SketchElement => ({
  id,
  kind: 'trace',
  mode: 'polyline',
  points: [
    [-2, 1],
    [1, 5],
  ],
  link,
});

describe('sketch document', () => {
  it('restores the current version unchanged and drops unknown fields', () => {
    const doc = { ...emptySketch(), elements: [trace('t1')], extra: 1 };
    expect(restoreSketch(doc)).toEqual({ schemaVersion: 2, frame: 'face-m', elements: [trace('t1')] });
  });

  it('upgrades a version 1 document: traces become freehand traces, the joint id becomes a link', () => {
    const v1 = {
      schemaVersion: 1,
      traces: [
        {
          id: 'a',
          points: [
            [0, 1],
            [2, 3],
          ],
          jointId: 'j-1',
        },
        {
          id: 'b',
          points: [
            [1, 1],
            [1, 2],
          ],
        },
      ],
    };
    const doc = restoreSketch(v1);
    expect(doc.schemaVersion).toBe(SKETCH_SCHEMA_VERSION);
    expect(doc.elements).toEqual([
      {
        id: 'a',
        kind: 'trace',
        mode: 'freehand',
        points: [
          [0, 1],
          [2, 3],
        ],
        link: { jointId: 'j-1' },
      },
      {
        id: 'b',
        kind: 'trace',
        mode: 'freehand',
        points: [
          [1, 1],
          [1, 2],
        ],
        link: null,
      },
    ]);
  });

  it.each([
    [null, 'document'],
    [{ schemaVersion: 9, frame: 'face-m', elements: [] }, 'schemaVersion'],
    [{ schemaVersion: 2, frame: 'px', elements: [] }, 'frame'],
    [{ schemaVersion: 2, frame: 'face-m', elements: [{ id: 'x', kind: 'blob' }] }, 'elements[0].kind'],
    [
      { schemaVersion: 2, frame: 'face-m', elements: [{ ...trace('x'), points: [[0, 0]] }] },
      'elements[0].points',
    ],
    [
      {
        schemaVersion: 2,
        frame: 'face-m',
        elements: [
          {
            ...trace('x'),
            points: [
              [0, 0],
              [0, 'a'],
            ],
          },
        ],
      },
      'elements[0].points[1][1]',
    ],
    [
      {
        schemaVersion: 2,
        frame: 'face-m',
        elements: [
          {
            ...trace('x'),
            points: [
              [0, 0],
              [0, 500],
            ],
          },
        ],
      },
      'elements[0].points[1][1]',
    ],
    [{ schemaVersion: 2, frame: 'face-m', elements: [trace('x'), trace('x')] }, 'elements[1].id'],
    [
      {
        schemaVersion: 2,
        frame: 'face-m',
        elements: [{ id: 'w', kind: 'water', at: [0, 1], state: 'damp', inflowLpm: 3 }],
      },
      'elements[0].inflowLpm',
    ],
    [
      { schemaVersion: 2, frame: 'face-m', elements: [{ id: 'l', kind: 'label', at: [0, 1], text: '  ' }] },
      'elements[0].text',
    ],
    [{ schemaVersion: 1, traces: 'no' }, 'traces'],
  ])('refuses a bad document with the path of the problem (%#)', (doc, path) => {
    try {
      restoreSketch(doc);
      throw new Error('accepted');
    } catch (error) {
      expect(error).toBeInstanceOf(SketchError);
      expect((error as SketchError).path).toBe(path);
      expect((error as SketchError).message).toMatch(/^Sketch /);
    }
  });

  it('refuses more elements than the limit', () => {
    const elements = Array.from({ length: SKETCH_MAX_ELEMENTS + 1 }, (_, i) => trace(`t${i}`));
    expect(() => restoreSketch({ ...emptySketch(), elements })).toThrow(/at most 2000/);
  });

  it('measures a trace and the area of an overbreak outline', () => {
    expect(
      traceLength([
        [0, 0],
        [3, 4],
        [3, 6],
      ]),
    ).toBeCloseTo(7, 12);
    // a 2 m × 0.5 m box, clockwise or not: 1 m²
    expect(
      overbreakArea([
        [0, 5],
        [2, 5],
        [2, 5.5],
        [0, 5.5],
      ]),
    ).toBeCloseTo(1, 12);
    expect(
      overbreakArea([
        [0, 5],
        [0, 5.5],
        [2, 5.5],
        [2, 5],
      ]),
    ).toBeCloseTo(1, 12);
  });

  it('finds the traces of a joint by its id or by its set', () => {
    const doc = restoreSketch({
      ...emptySketch(),
      elements: [trace('a', { jointId: 'j1' }), trace('b', { setLabel: 'S2' }), trace('c')],
    });
    expect(tracesOfJoint(doc, { id: 'j1', setLabel: 'S1' }).map((t) => t.id)).toEqual(['a']);
    expect(tracesOfJoint(doc, { id: 'j9', setLabel: 'S2' }).map((t) => t.id)).toEqual(['b']);
    expect(tracesOfJoint(doc, { id: 'j9', setLabel: null })).toEqual([]);
  });
});

describe('sketch actions and history', () => {
  it('adds, moves, links and removes, each undoable and redoable', () => {
    let h = historyOf(emptySketch());
    h = perform(h, 'add', { element: trace('t1') });
    h = perform(h, 'add', {
      element: { id: 'w1', kind: 'water', at: [0, 2], state: 'flowing', inflowLpm: 4 },
    });
    h = perform(h, 'move', { ids: ['t1', 'w1'], dx: 0.5, dy: -1 });
    expect(h.present.elements[0]).toMatchObject({
      points: [
        [-1.5, 0],
        [1.5, 4],
      ],
    });
    expect(h.present.elements[1]).toMatchObject({ at: [0.5, 1] });
    h = perform(h, 'link', { id: 't1', link: { jointId: 'j1' } });
    h = perform(h, 'remove', { ids: ['w1'] });
    expect(h.present.elements.map((e) => e.id)).toEqual(['t1']);
    expect(h.past).toHaveLength(5);

    h = undo(h); // the removal
    expect(h.present.elements.map((e) => e.id)).toEqual(['t1', 'w1']);
    h = undo(h); // the link
    expect(h.present.elements[0]).toMatchObject({ link: null });
    h = redo(h);
    expect(h.present.elements[0]).toMatchObject({ link: { jointId: 'j1' } });
    expect(h.future).toHaveLength(1);
    // a new edit clears what could be redone
    h = perform(h, 'editWater', { id: 'w1', state: 'damp', inflowLpm: 9 });
    expect(h.future).toEqual([]);
    expect(h.present.elements[1]).toMatchObject({ state: 'damp', inflowLpm: null });
  });

  it('records nothing for an edit that changes nothing, and undo on an empty history is a no-op', () => {
    const h0 = historyOf(emptySketch());
    const h1 = perform(h0, 'move', { ids: ['none'], dx: 0, dy: 0 });
    expect(h1.past).toEqual([]);
    expect(perform(h0, 'remove', { ids: ['nothing'] }).past).toEqual([]);
    expect(undo(h0)).toBe(h0);
    expect(redo(h0)).toBe(h0);
  });

  it('refuses an action that would break the document (a point off the sketch)', () => {
    const h = perform(historyOf(emptySketch()), 'add', { element: trace('t1') });
    expect(() => perform(h, 'move', { ids: ['t1'], dx: 0, dy: 200 })).toThrow(SketchError);
    expect(() => perform(h, 'add', { element: trace('t1') })).toThrow(/used twice/);
  });
});
