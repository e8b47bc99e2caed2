// The sketch's tool logic without Konva: pointer pixels ↔ face-frame metres, what each tool makes of the
// pointer, and select / move / delete / undo / redo through the domain's registered actions. Every
// expected number below was worked out by hand from the inputs (shown in the comments), not read back
// from the code.
import {
  emptySketch,
  historyOf,
  overbreakArea,
  perform,
  redo,
  traceLength,
  undo,
  type SketchElement,
  type SketchPoint,
} from '@roundbook/domain';
import {
  centreOf,
  dragDelta,
  faceFrameOf,
  fitView,
  flatPx,
  gridLines,
  toMetres,
  toPx,
  zoomAbout,
} from '@/features/sketch/utils/face-frame';
import {
  finishLine,
  pointerDown,
  pointerMove,
  pointerUp,
  snap,
  type DraftLine,
  type ToolSettings,
} from '@/features/sketch/utils/tools';

// An 8 m wide, 6 m high rectangular heading, axis 3 m and bench line 3.5 m above the invert.
const heading = {
  profileShape: 'rectangular' as const,
  profileWidth: 8,
  profileHeight: 6,
  axisHeight: 3,
  benchHeight: 3.5,
};

const settings = (over: Partial<ToolSettings> = {}): ToolSettings => {
  let n = 0;
  return {
    newId: () => `el-${++n}`,
    link: null,
    water: { state: 'damp', inflowLpm: null },
    labelText: '',
    ...over,
  };
};

describe('face frame of a heading', () => {
  it('top heading: the part above the bench line, springline at the widest highest point', () => {
    const frame = faceFrameOf(heading, 'top-heading');
    expect(frame).not.toBeNull();
    // a rectangle's corners; the walls are widest all the way up, so the springline is the top corner, 6 m
    expect(frame!.outline).toEqual([
      [-4, 0],
      [4, 0],
      [4, 6],
      [-4, 6],
    ]);
    expect(frame!.springline).toBe(6);
    // clipped at y ≥ 3.5: the right wall is cut at 3.5 first, then the top, then the left wall at 3.5
    expect(frame!.part).toEqual([
      [4, 3.5],
      [4, 6],
      [-4, 6],
      [-4, 3.5],
    ]);
    expect(frame!.benchLine).toBe(3.5);
    expect([frame!.bottom, frame!.top]).toEqual([3.5, 6]);
  });

  it('bench has the bench line at its top, full face has none; a profile that cannot be drawn is null', () => {
    const bench = faceFrameOf(heading, 'bench')!;
    expect([bench.bottom, bench.top, bench.benchLine]).toEqual([0, 3.5, 3.5]);
    const full = faceFrameOf(heading, 'full-face')!;
    expect([full.bottom, full.top, full.benchLine]).toEqual([0, 6, null]);
    expect(faceFrameOf({ ...heading, profileWidth: 0 }, 'full-face')).toBeNull();
    expect(faceFrameOf({ ...heading, benchHeight: 7 }, 'top-heading')).toBeNull();
  });
});

describe('pointer pixels ↔ face-frame metres', () => {
  const frame = faceFrameOf(heading, 'full-face')!;
  // spans (8 + 3) m by (6 + 2.5) m into 1100 × 850 px: 100 px/m either way;
  // origin (centre line, invert) at x = 1100/2 = 550, y = 850/2 + 3 m × 100 = 725
  const view = fitView(frame, 1100, 850);

  it('fits the profile into the canvas', () => {
    expect(view).toEqual({ scale: 100, ox: 550, oy: 725 });
    // a tiny canvas still gets the least scale of 4 px/m
    expect(fitView(frame, 20, 20).scale).toBe(4);
  });

  it('maps metres to pixels (y up becomes y down) and back', () => {
    expect(toPx(view, [0, 0])).toEqual([550, 725]);
    // right top corner: 550 + 4 × 100 = 950, 725 − 6 × 100 = 125
    expect(toPx(view, [4, 6])).toEqual([950, 125]);
    expect(toMetres(view, { x: 950, y: 125 })).toEqual([4, 6]);
    // a pointer at (300, 500) px: x = (300 − 550)/100 = −2.5 m, y = (725 − 500)/100 = 2.25 m
    expect(toMetres(view, { x: 300, y: 500 })).toEqual([-2.5, 2.25]);
    expect(
      flatPx(view, [
        [-1, 1],
        [1, 2],
      ]),
    ).toEqual([450, 625, 650, 525]);
  });

  it('zooms about the pointer: the point under it stays where it was', () => {
    const zoomed = zoomAbout(view, 2, { x: 950, y: 125 });
    // scale 200; ox = 950 − (950 − 550) × 2 = 150; oy = 125 − (125 − 725) × 2 = 1325
    expect(zoomed).toEqual({ scale: 200, ox: 150, oy: 1325 });
    expect(toMetres(zoomed, { x: 950, y: 125 })).toEqual([4, 6]);
    expect(zoomAbout(view, 10, { x: 0, y: 0 }).scale).toBe(400);
    expect(zoomAbout(view, 0.001, { x: 0, y: 0 }).scale).toBe(4);
  });

  it('a drag of pixels is a move in metres, y up', () => {
    // 50 px right, 25 px down at 100 px/m: 0.5 m right, 0.25 m down
    expect(dragDelta(view, { x: 50, y: 25 })).toEqual({ dx: 0.5, dy: -0.25 });
    // kept to the millimetre: 33 px / 100 = 0.33 m; 1 px / 300 px/m = 0.00333… → 0.003
    expect(dragDelta({ scale: 300, ox: 0, oy: 0 }, { x: 1, y: -99 })).toEqual({ dx: 0.003, dy: 0.33 });
  });

  it('grid lines are the whole metres in view; an area label sits at the mean of its points', () => {
    expect(gridLines(-4.5, 3.2)).toEqual([-4, -3, -2, -1, 0, 1, 2, 3]);
    expect(gridLines(0, 6)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(centreOf(faceFrameOf(heading, 'top-heading')!.part)).toEqual([0, 4.75]);
  });
});

describe('drawing tools', () => {
  it('keeps metres to the millimetre', () => {
    // 1.23456 → 1.235; 2.0004 → 2.000
    expect(snap([1.23456, 2.0004])).toEqual([1.235, 2]);
  });

  it('a freehand trace grows in steps of at least 5 cm and is finished on pointer up', () => {
    const s = settings({ link: { setLabel: 'S1' } });
    let step = pointerDown('freehand', null, [-1, 2], s);
    expect(step.draft).toEqual({ tool: 'freehand', points: [[-1, 2]] });
    let draft = step.draft;
    draft = pointerMove(draft, [-0.97, 2]); // 3 cm from the last point: dropped
    expect(draft!.points).toHaveLength(1);
    draft = pointerMove(draft, [-0.94, 2]); // 6 cm: kept
    draft = pointerMove(draft, [-0.5, 2.3]);
    step = pointerUp(draft, [0.1, 2.3], s);
    expect(step.draft).toBeNull();
    expect(step.add).toEqual({
      id: 'el-1',
      kind: 'trace',
      mode: 'freehand',
      points: [
        [-1, 2],
        [-0.94, 2],
        [-0.5, 2.3],
        [0.1, 2.3],
      ],
      link: { setLabel: 'S1' },
    });
    // 0.06 + √(0.44² + 0.3²) + 0.6 = 0.06 + 0.532541… + 0.6 = 1.192541 m
    expect(traceLength((step.add as { points: SketchPoint[] }).points)).toBeCloseTo(1.192541, 6);
  });

  it('a tap with the freehand tool leaves nothing', () => {
    const s = settings();
    const down = pointerDown('freehand', null, [1, 1], s);
    expect(pointerUp(down.draft, [1.01, 1], s)).toEqual({ draft: null });
  });

  it('a straight-segment trace takes a point per tap, ignores a tap on its last point, ends on Finish', () => {
    const s = settings({ link: { jointId: 'j-7' } });
    let draft: DraftLine | null = null;
    for (const p of [
      [-3, 1],
      [0, 3],
      [0.004, 3.003], // within 1 cm of the last point: the same point
      [3, 4],
    ] as SketchPoint[])
      draft = pointerDown('polyline', draft, p, s).draft;
    expect(draft!.points).toEqual([
      [-3, 1],
      [0, 3],
      [3, 4],
    ]);
    // pointer up does not finish a straight-segment line
    expect(pointerUp(draft, [3, 4], s).draft).toBe(draft);
    const done = finishLine(draft, s);
    expect(done.add).toMatchObject({ kind: 'trace', mode: 'polyline', link: { jointId: 'j-7' } });
    // one point is not a trace
    expect(finishLine({ tool: 'polyline', points: [[0, 0]] }, s)).toEqual({ draft: null });
  });

  it('an overbreak outline is closed on Finish once it has three points, and gives its area', () => {
    const s = settings();
    let draft: DraftLine | null = null;
    draft = pointerDown('overbreak', draft, [0, 6], s).draft;
    draft = pointerDown('overbreak', draft, [2, 6], s).draft;
    expect(finishLine(draft, s)).toEqual({ draft: null }); // two points: no area
    draft = pointerDown('overbreak', draft, [1, 7], s).draft;
    const done = finishLine(draft, s);
    expect(done.add).toEqual({
      id: 'el-1',
      kind: 'overbreak',
      points: [
        [0, 6],
        [2, 6],
        [1, 7],
      ],
    });
    // a triangle of base 2 m and height 1 m: ½ × 2 × 1 = 1 m²
    expect(overbreakArea((done.add as { points: SketchPoint[] }).points)).toBeCloseTo(1, 12);
  });

  it('switching tool starts a new line instead of carrying the old one on', () => {
    const s = settings();
    const poly = pointerDown('polyline', null, [0, 1], s).draft;
    expect(pointerDown('overbreak', poly, [2, 2], s).draft).toEqual({ tool: 'overbreak', points: [[2, 2]] });
    expect(pointerDown('select', poly, [2, 2], s)).toEqual({ draft: null });
  });

  it('water marks keep an inflow only when flowing; a label needs text', () => {
    const flowing = pointerDown(
      'water',
      null,
      [1.5, 2],
      settings({ water: { state: 'flowing', inflowLpm: 12 } }),
    );
    expect(flowing.add).toEqual({ id: 'el-1', kind: 'water', at: [1.5, 2], state: 'flowing', inflowLpm: 12 });
    const dripping = pointerDown(
      'water',
      null,
      [1.5, 2],
      settings({ water: { state: 'dripping', inflowLpm: 12 } }),
    );
    expect(dripping.add).toMatchObject({ state: 'dripping', inflowLpm: null });
    expect(pointerDown('label', null, [0, 0], settings({ labelText: '   ' }))).toEqual({ draft: null });
    expect(pointerDown('label', null, [0, 0], settings({ labelText: ' Shear zone ' })).add).toEqual({
      id: 'el-1',
      kind: 'label',
      at: [0, 0],
      text: 'Shear zone',
    });
  });
});

describe('select, move, delete, undo and redo through the domain actions', () => {
  const traceA: SketchElement = {
    id: 'a',
    kind: 'trace',
    mode: 'polyline',
    points: [
      [-2, 1],
      [1, 3],
    ],
    link: null,
  };
  const water: SketchElement = { id: 'w', kind: 'water', at: [2, 2], state: 'damp', inflowLpm: null };

  it('moves the picked element by the drag, deletes it, and undo / redo walk back and forth', () => {
    const s = settings();
    let h = historyOf(emptySketch());
    h = perform(h, 'add', { element: traceA });
    h = perform(h, 'add', { element: water });
    // the drawing tool's own result goes through the same action
    const label = pointerDown('label', null, [0.5, 5], { ...s, labelText: 'Crown wet' }).add!;
    h = perform(h, 'add', { element: label });
    expect(h.present.elements.map((e) => e.id)).toEqual(['a', 'w', 'el-1']);

    // the picked trace dragged 50 px right and 100 px up at 100 px/m: +0.5 m, +1 m
    const { dx, dy } = dragDelta({ scale: 100, ox: 0, oy: 0 }, { x: 50, y: -100 });
    h = perform(h, 'move', { ids: ['a'], dx, dy });
    expect(h.present.elements[0]).toMatchObject({
      points: [
        [-1.5, 2],
        [1.5, 4],
      ],
    });
    expect(h.present.elements[1]).toEqual(water); // the others stay

    // a drag of nothing records nothing
    const still = perform(h, 'move', { ids: ['a'], dx: 0, dy: 0 });
    expect(still.past).toHaveLength(h.past.length);

    h = perform(h, 'remove', { ids: ['w'] });
    expect(h.present.elements.map((e) => e.id)).toEqual(['a', 'el-1']);
    expect(h.past).toHaveLength(5);

    h = undo(h); // the delete
    expect(h.present.elements.map((e) => e.id)).toEqual(['a', 'w', 'el-1']);
    h = undo(h); // the move
    expect(h.present.elements[0]).toEqual(traceA);
    h = redo(h);
    expect(h.present.elements[0]).toMatchObject({
      points: [
        [-1.5, 2],
        [1.5, 4],
      ],
    });
    // a new edit after an undo drops the redo
    h = perform(h, 'link', { id: 'a', link: { jointId: 'j-1' } });
    expect(h.future).toEqual([]);
    expect(redo(h)).toBe(h);
    expect(h.present.elements[0]).toMatchObject({ link: { jointId: 'j-1' } });
  });

  it('refuses an element the document would not accept, leaving the history as it was', () => {
    const h = perform(historyOf(emptySketch()), 'add', { element: traceA });
    expect(() => perform(h, 'add', { element: { ...traceA } })).toThrow(/the id a is used twice/);
    expect(() => perform(h, 'move', { ids: ['a'], dx: 200, dy: 0 })).toThrow(/outside the sketch/);
    expect(h.present.elements).toEqual([traceA]);
  });
});
