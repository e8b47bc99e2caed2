import { JOINT_KINDS } from '@roundbook/domain';
import { greatCircle, poleOf, project } from '@roundbook/geomath';
import type { Net, Plane } from '@roundbook/geomath';
import { daylightsOn, surfacesOf } from './daylight';
import { PRINT_HIGH_CONTRAST_PALETTE, PRINT_PALETTE } from './palette';
import { sceneToSvg } from './scene-svg';
import type { SceneNode, StereonetScene } from './stereonet-scene';
import {
  buildStereonetScene,
  lineNotations,
  nearestLine,
  nearestPole,
  poleNotations,
  setOrder,
} from './stereonet-scene';
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

  describe('overlays on request: friction circle, daylight envelopes, intersections', () => {
    const threeSets = [
      { label: 'S1', mean: { dipDirection: 130, dip: 50 }, alpha95: 6 },
      { label: 'S2', mean: { dipDirection: 230, dip: 60 }, alpha95: 8 },
      { label: 'S3', mean: { dipDirection: 20, dip: 80 }, alpha95: 5 },
    ];
    /** n1 × n2 by hand (north-east-down normals), in the lower hemisphere (methods.md §1.3, computed here). */
    const ownIntersection = (a: Plane, b: Plane) => {
      const n = (p: Plane) => {
        const [dd, d] = [(p.dipDirection * Math.PI) / 180, (p.dip * Math.PI) / 180];
        return [-Math.sin(d) * Math.cos(dd), -Math.sin(d) * Math.sin(dd), Math.cos(d)];
      };
      const [u, v] = [n(a), n(b)];
      let c = [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
      if (c[2] < 0) c = c.map((x) => -x);
      const len = Math.hypot(c[0], c[1], c[2]);
      return {
        trend: ((Math.atan2(c[1], c[0]) * 180) / Math.PI + 360) % 360,
        plunge: (Math.asin(c[2] / len) * 180) / Math.PI,
      };
    };

    it.each([
      [340, 'equal-area'],
      [900, 'equal-angle'],
    ] as const)(
      'draws each intersection line where project puts it, within half a pixel (%i px, %s)',
      (size, net) => {
        const scene = buildStereonetScene([], threeSets, { size, net, intersections: true });
        expect(scene.lines.map((l) => l.label)).toEqual(['S1×S2', 'S1×S3', 'S2×S3']);
        for (const l of scene.lines) {
          const [a, b] = l.label.split('×').map((x) => threeSets.find((s) => s.label === x)!.mean);
          const own = ownIntersection(a, b);
          const g = project(own, net, scene.radius);
          // The star's 12 vertices are symmetric about the point: their mean is the drawn position.
          const v = points(pathOf(scene, `intersection-${l.label}`));
          expect(v).toHaveLength(12);
          const x = v.reduce((s, c) => s + c[0], 0) / 12;
          const y = v.reduce((s, c) => s + c[1], 0) / 12;
          expect(Math.abs(x - (scene.centre.x + g.x))).toBeLessThanOrEqual(0.5);
          expect(Math.abs(y - (scene.centre.y - g.y))).toBeLessThanOrEqual(0.5);
          expect(Math.abs(l.x - (scene.centre.x + g.x))).toBeLessThanOrEqual(0.5);
          expect(find(scene.nodes, `intersection-label-${l.label}`)).toMatchObject({ text: l.label });
        }
      },
    );

    it('reads an intersection by trend and plunge when tapped near it', () => {
      const scene = buildStereonetScene([], threeSets.slice(0, 2), { size: 400, intersections: true });
      const l = scene.lines[0];
      expect(nearestLine(scene, l.x + 8, l.y, 22)?.label).toBe('S1×S2');
      expect(nearestLine(scene, l.x + 40, l.y, 22)).toBeNull();
      const own = ownIntersection(threeSets[0].mean, threeSets[1].mean);
      const text = `${String(Math.round(own.trend)).padStart(3, '0')}/${String(Math.round(own.plunge)).padStart(2, '0')}`;
      expect(lineNotations(l)).toEqual([
        { label: 'Trend / plunge', value: text },
        { label: 'Planes', value: '130/50 and 230/60' },
      ]);
    });

    it.each([
      ['equal-area', 30],
      ['equal-angle', 35],
    ] as const)('draws the friction circle at the projection of φ (%s, φ = %i°)', (net, phi) => {
      for (const size of [360, 800]) {
        const scene = buildStereonetScene([], [], { size, net, frictionAngle: phi });
        const pts = points(pathOf(scene, 'friction-circle'));
        expect(pts.length).toBeGreaterThan(100);
        // φ from the centre: equal-area R·√2·sin(φ/2), equal-angle R·tan(φ/2) (projection definition).
        const h = (phi * Math.PI) / 360;
        const own =
          net === 'equal-area' ? scene.radius * Math.SQRT2 * Math.sin(h) : scene.radius * Math.tan(h);
        const g = Math.hypot(
          project({ trend: 0, plunge: 90 - phi }, net, scene.radius).x,
          project({ trend: 0, plunge: 90 - phi }, net, scene.radius).y,
        );
        expect(Math.abs(g - own)).toBeLessThan(1e-6);
        for (const [x, y] of pts) {
          expect(Math.abs(Math.hypot(x - scene.centre.x, y - scene.centre.y) - own)).toBeLessThanOrEqual(0.5);
        }
        // Poles of planes gentler than φ fall inside it, steeper ones outside.
        const poles = buildStereonetScene(
          [
            { id: 'gentle', kind: 'joint', plane: { dipDirection: 75, dip: phi - 3 }, set: null },
            { id: 'steep', kind: 'joint', plane: { dipDirection: 75, dip: phi + 3 }, set: null },
          ],
          [],
          { size, net, frictionAngle: phi },
        ).poles;
        const d = (p: { x: number; y: number }) => Math.hypot(p.x - scene.centre.x, p.y - scene.centre.y);
        expect(d(poles[0])).toBeLessThan(own);
        expect(d(poles[1])).toBeGreaterThan(own);
      }
    });

    /** Even-odd point-in-path for M/L/Z paths (every subpath closed). */
    const insidePath = (d: string, x: number, y: number): boolean => {
      let inside = false;
      for (const sub of d.split('M').filter((t) => t.trim())) {
        const ring = points(sub);
        for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
          const [xi, yi] = ring[i];
          const [xj, yj] = ring[j];
          if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
        }
      }
      return inside;
    };

    it.each([[{ trend: 0, plunge: 0 }], [{ trend: 212, plunge: 6 }], [{ trend: 75, plunge: -8 }]])(
      'draws each daylight envelope around exactly the poles that daylight (drive %o)',
      (drive) => {
        const surfaces = ['left wall', 'right wall', 'crown', 'face'] as const;
        const scene = buildStereonetScene([], [], { size: 500, drive, daylight: surfaces });
        let inside = 0;
        let outside = 0;
        for (const s of surfacesOf(drive)) {
          const d = pathOf(scene, `daylight-${s.surface.replace(' ', '-')}`);
          for (let dd = 3; dd < 360; dd += 11) {
            for (const dip of [8, 27, 46, 64, 83]) {
              const plane = { dipDirection: dd, dip };
              const p = scene.centre;
              const g = project(poleOf(plane), 'equal-area', scene.radius);
              const expected = daylightsOn(plane, s);
              // Skip poles within 3 px of the envelope's edge (sampling of the curve).
              const near = [-3, 3].some(
                (e) =>
                  insidePath(d, p.x + g.x + e, p.y - g.y) !== expected ||
                  insidePath(d, p.x + g.x, p.y - g.y + e) !== expected,
              );
              if (near) continue;
              expect(insidePath(d, p.x + g.x, p.y - g.y)).toBe(expected);
              if (expected) inside++;
              else outside++;
            }
          }
        }
        expect(inside).toBeGreaterThan(100);
        expect(outside).toBeGreaterThan(100);
      },
    );

    it('right-wall envelope of a level drive north is the east half (computed here)', () => {
      const scene = buildStereonetScene([], [], {
        size: 400,
        drive: { trend: 0, plunge: 0 },
        daylight: ['right wall'],
      });
      const d = pathOf(scene, 'daylight-right-wall');
      const { x: cx, y: cy } = scene.centre;
      const R = scene.radius;
      // Pole of 270/40 (dips west out of the east wall) trends 090: inside; its mirror 090/40: outside.
      expect(insidePath(d, cx + R * 0.6, cy)).toBe(true);
      expect(insidePath(d, cx - R * 0.6, cy)).toBe(false);
      expect(insidePath(d, cx + R * 0.3, cy - R * 0.8)).toBe(true);
      expect(insidePath(d, cx - R * 0.05, cy + R * 0.5)).toBe(false);
      // Its name sits in the middle of the half, on the east radius.
      const label = find(scene.nodes, 'daylight-right-wall-label');
      expect(label).toMatchObject({ type: 'text', text: 'right wall' });
      if (label?.type === 'text') {
        expect(label.x - cx).toBeGreaterThan(R * 0.3);
        expect(Math.abs(label.y - cy)).toBeLessThan(label.size);
      }
    });

    it('adds a legend line for each overlay only when it is asked for', () => {
      const joints = [{ id: 'a', kind: 'joint' as const, plane: { dipDirection: 130, dip: 50 }, set: 'S1' }];
      const drive = { trend: 40, plunge: 2 };
      const plain = buildStereonetScene(joints, threeSets, { size: 400, drive, legend: true });
      const text = plain.legendLines.join('\n');
      expect(text).not.toMatch(/friction circle/);
      expect(text).not.toMatch(/daylight/);
      expect(text).not.toMatch(/intersection/);
      for (const role of ['friction-circle', 'daylight', 'intersections', 'overlay-labels'])
        expect(find(plain.nodes, role)).toBeUndefined();
      expect(plain.lines).toEqual([]);

      const asked = buildStereonetScene(joints, threeSets, {
        size: 400,
        drive,
        legend: true,
        frictionAngle: 32,
        daylight: ['face', 'crown'],
        intersections: true,
      });
      const lines = asked.legendLines;
      expect(lines.filter((l) => l.includes('friction circle, φ = 32°'))).toHaveLength(1);
      expect(lines.filter((l) => l.startsWith('Tinted region (face)'))).toHaveLength(1);
      expect(lines.filter((l) => l.startsWith('Tinted region (crown)'))).toHaveLength(1);
      expect(lines.filter((l) => l.startsWith('Tinted region (left wall)'))).toHaveLength(0);
      expect(lines.filter((l) => l.startsWith('Six-pointed star'))).toHaveLength(1);
      // The drawn legend (text nodes below the net) carries them too.
      const drawn = asked.nodes
        .filter((n) => n.type === 'text' && n.role === 'legend')
        .map((n) => (n.type === 'text' ? n.text : ''))
        .join(' ');
      expect(drawn).toContain('φ = 32°');
      expect(drawn).toContain('Six-pointed star');

      // Without a drive there is no envelope, and a note says why.
      const noDrive = buildStereonetScene(joints, threeSets, { size: 400, daylight: ['face'] });
      expect(find(noDrive.nodes, 'daylight')).toBeUndefined();
      expect(noDrive.notes).toContain('Daylight envelopes need the drive at the face.');
    });

    it('keeps the overlay labels inside the primitive, clear of its degree marks', () => {
      // Two steep sets meeting in a nearly horizontal line: its star sits right at the primitive.
      const sets = [
        { label: 'S1', mean: { dipDirection: 0, dip: 88 }, alpha95: null },
        { label: 'S2', mean: { dipDirection: 95, dip: 88 }, alpha95: null },
      ];
      for (const size of [360, 800]) {
        const scene = buildStereonetScene([], sets, {
          size,
          drive: { trend: 10, plunge: 0 },
          daylight: ['left wall', 'right wall', 'crown', 'face'],
          frictionAngle: 85,
          intersections: true,
        });
        const labels: SceneNode[] = [];
        const walk = (ns: SceneNode[]) =>
          ns.forEach((n) => {
            if (n.type === 'group') walk(n.children);
            else if (n.type === 'text' && /label/.test(n.role) && !n.role.startsWith('mean-label'))
              labels.push(n);
          });
        walk(scene.nodes);
        expect(labels.length).toBe(6);
        for (const t of labels) {
          if (t.type !== 'text') continue;
          // Half the text's width at ~0.6 em a character, plus half its height.
          const half = (t.text.length * t.size * 0.6) / 2;
          const far = Math.hypot(
            Math.abs(t.x - scene.centre.x) + half,
            Math.abs(t.y - scene.centre.y) + t.size / 2,
          );
          expect(far).toBeLessThanOrEqual(scene.radius + 1);
        }
      }
    });

    // WCAG 2.1 relative luminance and contrast ratio: 3:1 for lines and marks (1.4.11), 4.5:1 for text (1.4.3).
    const luminance = (hex: string) => {
      const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
      const l = c.map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
      return 0.2126 * l[0] + 0.7152 * l[1] + 0.0722 * l[2];
    };
    const contrast = (a: string, b: string) => {
      const [x, y] = [luminance(a), luminance(b)].sort((p, q) => q - p);
      return (x + 0.05) / (y + 0.05);
    };
    const lab = (hex: string) => {
      const lin = [1, 3, 5].map((i) => {
        const v = parseInt(hex.slice(i, i + 2), 16) / 255;
        return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
      });
      const xyz = [
        (0.4124 * lin[0] + 0.3576 * lin[1] + 0.1805 * lin[2]) / 0.95047,
        0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2],
        (0.0193 * lin[0] + 0.1192 * lin[1] + 0.9505 * lin[2]) / 1.08883,
      ].map((t) => (t > 0.008856 ? Math.cbrt(t) : 7.787 * t + 16 / 116));
      return [116 * xyz[1] - 16, 500 * (xyz[0] - xyz[1]), 200 * (xyz[1] - xyz[2])];
    };
    const deltaE = (a: string, b: string) => {
      const [p, q] = [lab(a), lab(b)];
      return Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
    };
    it.each([
      ['print', PRINT_PALETTE],
      ['high contrast', PRINT_HIGH_CONTRAST_PALETTE],
    ])('draws the overlays in colours that read on the %s paper (WCAG 2.1)', (_, palette) => {
      for (const c of [palette.friction, palette.daylight, palette.intersection]) {
        expect(contrast(c, palette.paper)).toBeGreaterThanOrEqual(4.5);
      }
      // The overlays must not be taken for a set or the axis: CIE 1976 ΔE*ab of at least 25 from each set
      // colour, the axis and each other (the threshold is Roundbook's own; CIELAB from sRGB, D65).
      const others = [...palette.sets, palette.axis];
      const overlays = [palette.friction, palette.daylight, palette.intersection];
      for (const c of overlays) for (const o of others) expect(deltaE(c, o)).toBeGreaterThanOrEqual(25);
      expect(deltaE(palette.friction, palette.daylight)).toBeGreaterThanOrEqual(25);
      expect(deltaE(palette.friction, palette.intersection)).toBeGreaterThanOrEqual(25);
      expect(deltaE(palette.daylight, palette.intersection)).toBeGreaterThanOrEqual(25);
      const scene = buildStereonetScene([], threeSets, {
        size: 400,
        palette,
        drive: { trend: 0, plunge: 0 },
        frictionAngle: 30,
        daylight: ['face'],
        intersections: true,
      });
      expect(find(scene.nodes, 'friction-circle')).toMatchObject({ stroke: palette.friction });
      expect(find(scene.nodes, 'daylight-face')).toMatchObject({ stroke: palette.daylight });
      expect(find(scene.nodes, 'intersection-S1×S2')).toMatchObject({
        fill: palette.intersection,
        stroke: palette.paper,
      });
      expect(find(scene.nodes, 'intersection-label-S1×S2')).toMatchObject({ halo: palette.paper });
    });
  });
});
