import { JOINT_KINDS } from '@roundbook/domain';
import { greatCircle, poleOf, project } from '@roundbook/geomath';
import type { Net, Plane } from '@roundbook/geomath';
import { PRINT_PALETTE } from './palette';
import { sceneToSvg } from './scene-svg';
import type { SceneNode, StereonetScene } from './stereonet-scene';
import { buildStereonetScene, nearestPole, poleNotations, setOrder } from './stereonet-scene';
import { KIND_STYLES, SET_SHAPES, shapePath } from './symbols';

const numbers = (d: string): number[] => (d.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);

function find(nodes: SceneNode[], role: string): SceneNode | undefined {
  for (const x of nodes) {
    if (x.role === role) return x;
    if (x.type === 'group') {
      const inner = find(x.children, role);
      if (inner) return inner;
    }
  }
  return undefined;
}

function pathOf(scene: StereonetScene, role: string): string {
  const x = find(scene.nodes, role);
  if (!x || x.type !== 'path') throw new Error(`no path ${role}`);
  return x.d;
}

/** Points of an M/L polyline. */
const points = (d: string): Array<[number, number]> => {
  const v = numbers(d);
  const out: Array<[number, number]> = [];
  for (let i = 0; i + 1 < v.length; i += 2) out.push([v[i], v[i + 1]]);
  return out;
};

describe('stereonet scene', () => {
  // The projection's definition (lower hemisphere, c = 90° − plunge): equal-area r = R·√2·sin(c/2),
  // equal-angle r = R·tan(c/2); x = r·sin(trend) east, y = r·cos(trend) north (SVG y grows down).
  const byDefinition = (plane: Plane, net: Net, radius: number) => {
    const pole = poleOf(plane);
    const c = ((90 - pole.plunge) * Math.PI) / 180;
    const r = net === 'equal-area' ? radius * Math.SQRT2 * Math.sin(c / 2) : radius * Math.tan(c / 2);
    const t = (pole.trend * Math.PI) / 180;
    return { x: r * Math.sin(t), y: r * Math.cos(t) };
  };
  const planes: Plane[] = [
    { dipDirection: 130, dip: 50 },
    { dipDirection: 0, dip: 0 },
    { dipDirection: 270, dip: 90 },
    { dipDirection: 45.5, dip: 73.2 },
    { dipDirection: 312, dip: 12 },
  ];

  it.each([
    [320, 'equal-area'],
    [800, 'equal-area'],
    [320, 'equal-angle'],
    [800, 'equal-angle'],
  ] as const)(
    'draws each pole where geomath project puts it, within half a pixel (%i px, %s)',
    (size, net) => {
      const joints = planes.map((plane, i) => ({ id: `j${i}`, kind: 'joint' as const, plane, set: 'S1' }));
      const scene = buildStereonetScene(joints, [], { size, net });
      const body = pathOf(scene, 'poles-0|joint');
      // S1 is a square: four vertices per pole, the pole at their mean.
      const v = points(body);
      expect(v).toHaveLength(4 * planes.length);
      planes.forEach((plane, i) => {
        const g = project(poleOf(plane), net, scene.radius);
        const own = byDefinition(plane, net, scene.radius);
        const corners = v.slice(4 * i, 4 * i + 4);
        const x = corners.reduce((s, c) => s + c[0], 0) / 4;
        const y = corners.reduce((s, c) => s + c[1], 0) / 4;
        expect(Math.abs(x - (scene.centre.x + g.x))).toBeLessThanOrEqual(0.5);
        expect(Math.abs(y - (scene.centre.y - g.y))).toBeLessThanOrEqual(0.5);
        expect(Math.abs(x - (scene.centre.x + own.x))).toBeLessThanOrEqual(0.5);
        expect(Math.abs(y - (scene.centre.y - own.y))).toBeLessThanOrEqual(0.5);
        expect(Math.abs(scene.poles[i].x - (scene.centre.x + g.x))).toBeLessThanOrEqual(0.5);
      });
    },
  );

  it('draws a vertical plane as a straight line through the centre (projection definition)', () => {
    const plane = { dipDirection: 120, dip: 90 };
    const scene = buildStereonetScene([{ id: 'v', kind: 'fault', plane, set: null }], [], {
      size: 500,
      greatCircles: 'all',
    });
    const pts = points(pathOf(scene, 'great-circle-v'));
    expect(pts.length).toBe(greatCircle(plane, 90).length);
    const { x: cx, y: cy } = scene.centre;
    // Strike 030/210: every point on the line through the centre along 030° (distance from it ≤ 0.5 px).
    const ux = Math.sin((30 * Math.PI) / 180);
    const uy = -Math.cos((30 * Math.PI) / 180);
    for (const [x, y] of pts) expect(Math.abs((x - cx) * uy - (y - cy) * ux)).toBeLessThanOrEqual(0.5);
    const nearCentre = Math.min(...pts.map(([x, y]) => Math.hypot(x - cx, y - cy)));
    expect(nearCentre).toBeLessThanOrEqual(0.5);
    // …from primitive to primitive.
    expect(Math.hypot(pts[0][0] - cx, pts[0][1] - cy)).toBeCloseTo(scene.radius, 1);
    expect(Math.hypot(pts.at(-1)![0] - cx, pts.at(-1)![1] - cy)).toBeCloseTo(scene.radius, 1);
  });

  it('draws a horizontal plane on the primitive (projection definition)', () => {
    const scene = buildStereonetScene(
      [{ id: 'h', kind: 'bedding', plane: { dipDirection: 0, dip: 0 }, set: null }],
      [],
      { size: 420, net: 'equal-angle', greatCircles: 'all' },
    );
    const pts = points(pathOf(scene, 'great-circle-h'));
    expect(pts.length).toBeGreaterThan(40);
    for (const [x, y] of pts) {
      expect(Math.abs(Math.hypot(x - scene.centre.x, y - scene.centre.y) - scene.radius)).toBeLessThanOrEqual(
        0.5,
      );
    }
  });

  it('contours in Kamb multiples of σ and says so in the legend (Kamb 1959; methods.md §3.2)', () => {
    const joints = Array.from({ length: 40 }, (_, i) => ({
      id: `j${i}`,
      kind: 'joint' as const,
      plane: { dipDirection: 120 + (i % 7) - 3, dip: 60 + (i % 5) - 2 },
      set: 'S1',
    }));
    const scene = buildStereonetScene(joints, [], { size: 400, contours: true, legend: true });
    expect(scene.densityLegend).toBe('multiples of σ, Kamb 1959; uniform = 3σ');
    expect(find(scene.nodes, 'contours')).toMatchObject({ type: 'group', clip: 'primitive' });
    expect(find(scene.nodes, 'contour-2')).toBeDefined();
    expect(scene.legendLines.join(' ')).toContain('multiples of σ, Kamb 1959; uniform = 3σ');
    expect(scene.height).toBeGreaterThan(scene.width);
  });

  it('gives no contours for too few poles, and says why', () => {
    const scene = buildStereonetScene(
      [{ id: 'a', kind: 'joint', plane: { dipDirection: 10, dip: 40 }, set: null }],
      [],
      { size: 300, contours: true },
    );
    expect(find(scene.nodes, 'contours')).toBeUndefined();
    expect(scene.notes[0]).toMatch(/at least 5 poles/);
  });

  it('shades the strike-parallel zone around the axis only with a drive', () => {
    const none = buildStereonetScene([], [], { size: 300 });
    expect(find(none.nodes, 'adverse-steep')).toBeUndefined();
    const scene = buildStereonetScene([], [], {
      size: 300,
      drive: { trend: 60, plunge: 0 },
      adverseTolerance: 25,
    });
    // Poles of planes striking along 060° dipping 45–90° trend 150° or 330° and plunge 0–45°: the
    // sector's corner points lie at 150 ± 25° (common practice: strike ∥ axis rated for the walls).
    const pts = points(pathOf(scene, 'adverse-steep'));
    const { x: cx, y: cy } = scene.centre;
    const trends = pts.map(([x, y]) => ((Math.atan2(x - cx, cy - y) * 180) / Math.PI + 360) % 360);
    const inFirst = trends.filter((t) => t >= 124.9 && t <= 175.1).length;
    const inSecond = trends.filter((t) => t >= 304.9 && t <= 355.1).length;
    expect(inFirst + inSecond).toBe(trends.length);
    expect(inFirst).toBeGreaterThan(0);
    expect(inSecond).toBeGreaterThan(0);
    expect(scene.legendLines[0]).toContain('within 25° of the tunnel axis');
    expect(find(scene.nodes, 'tunnel-axis')).toBeDefined();
    expect(find(scene.nodes, 'drive-arrow')).toBeDefined();
  });

  it('marks N, E, S, W and a degree scale outside the primitive', () => {
    const scene = buildStereonetScene([], [], { size: 360 });
    for (const c of ['N', 'E', 'S', 'W']) {
      const t = find(scene.nodes, `cardinal-${c}`);
      expect(t).toMatchObject({ type: 'text', text: c });
      if (t?.type === 'text') {
        expect(Math.hypot(t.x - scene.centre.x, t.y - scene.centre.y)).toBeGreaterThan(scene.radius + 10);
        expect(t.x).toBeGreaterThan(0);
        expect(t.x).toBeLessThan(scene.width);
      }
    }
    expect(find(scene.nodes, 'degree-030')).toBeUndefined();
    expect(find(scene.nodes, 'degree-30')).toMatchObject({ text: '030' });
  });

  it('draws a set mean with its α95 cone and label', () => {
    const scene = buildStereonetScene(
      [],
      [{ label: 'S2', mean: { dipDirection: 200, dip: 35 }, alpha95: 8 }],
      {
        size: 400,
        greatCircles: 'sets',
      },
    );
    const cone = points(pathOf(scene, 'cone-S2'));
    const mean = poleOf({ dipDirection: 200, dip: 35 });
    const centre = project(mean, 'equal-area', scene.radius);
    // Every point of the cone is 8° from the mean: farther than the mean's own marker, but nearby.
    for (const [x, y] of cone) {
      const d = Math.hypot(x - scene.centre.x - centre.x, y - scene.centre.y + centre.y);
      expect(d).toBeGreaterThan(scene.radius * 0.05);
      expect(d).toBeLessThan(scene.radius * 0.2);
    }
    expect(find(scene.nodes, 'mean-label-S2')).toMatchObject({ text: 'S2' });
    expect(find(scene.nodes, 'great-circle-S2')).toBeDefined();
  });

  it('gives every kind its own style and every set its own shape (Roundbook design)', () => {
    const kinds = new Set(JOINT_KINDS.map((k) => JSON.stringify(KIND_STYLES[k])));
    expect(kinds.size).toBe(JOINT_KINDS.length);
    const shapes = new Set(SET_SHAPES.map((s) => shapePath(s, 0, 0, 10)));
    expect(shapes.size).toBe(SET_SHAPES.length);
    expect(setOrder(['S10', 'S2', 'A', 'S1', 'S2'])).toEqual(['S1', 'S2', 'S10', 'A']);
  });

  it('picks the nearest pole within reach and reads it in every notation', () => {
    const scene = buildStereonetScene(
      [
        { id: 'a', kind: 'joint', plane: { dipDirection: 130, dip: 50 }, set: null },
        { id: 'b', kind: 'vein', plane: { dipDirection: 300, dip: 20 }, set: null },
      ],
      [],
      { size: 400 },
    );
    const a = scene.poles[0];
    expect(nearestPole(scene, a.x + 10, a.y - 5, 22)?.id).toBe('a');
    expect(nearestPole(scene, a.x + 30, a.y, 22)).toBeNull();
    // 130/50: strike (RHR) 040, quadrant N40E 50SE, pole 310/40 (orientation by definition).
    expect(poleNotations({ dipDirection: 130, dip: 50 }).map((n) => n.value)).toEqual([
      '130/50',
      '50/130',
      '040/50',
      'N40E 50SE',
      '310/40',
    ]);
  });

  it('writes a standalone SVG document from the same scene', () => {
    const scene = buildStereonetScene(
      [{ id: 'a', kind: 'fault', plane: { dipDirection: 130, dip: 50 }, set: 'S1' }],
      [{ label: 'S1', mean: { dipDirection: 130, dip: 50 }, alpha95: null }],
      { size: 300, legend: true, drive: { trend: 60, plunge: 0 } },
    );
    const text = sceneToSvg(scene, { background: PRINT_PALETTE.paper });
    const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
    expect(doc.querySelector('parsererror')).toBeNull();
    expect(doc.querySelector('title')?.textContent).toContain('1 pole, 1 set');
    expect(doc.querySelector('clipPath circle')?.getAttribute('r')).toBe(String(scene.radius));
    expect(doc.querySelectorAll('[data-role="legend"]').length).toBeGreaterThan(2);
  });
});
