import { buildStereonetScene, insidePolygon, polesInLasso } from './stereonet-scene';

// A "U" drawn as a lasso: two arms joined at the bottom (y grows downwards, as on screen), with the hollow
// between the arms outside it. Points and answers computed here.
const U = [
  { x: 0, y: 0 },
  { x: 30, y: 0 },
  { x: 30, y: 30 },
  { x: 20, y: 30 },
  { x: 20, y: 10 },
  { x: 10, y: 10 },
  { x: 10, y: 30 },
  { x: 0, y: 30 },
];

describe('insidePolygon (the lasso hit test)', () => {
  it('holds the points in both arms and in the base of a concave polygon', () => {
    expect(insidePolygon({ x: 5, y: 20 }, U)).toBe(true);
    expect(insidePolygon({ x: 25, y: 20 }, U)).toBe(true);
    expect(insidePolygon({ x: 15, y: 5 }, U)).toBe(true);
    expect(insidePolygon({ x: 29.5, y: 29.5 }, U)).toBe(true);
  });

  it('leaves out the hollow between the arms and everything around the polygon', () => {
    expect(insidePolygon({ x: 15, y: 20 }, U)).toBe(false);
    expect(insidePolygon({ x: 15, y: 29 }, U)).toBe(false);
    expect(insidePolygon({ x: -1, y: 20 }, U)).toBe(false);
    expect(insidePolygon({ x: 31, y: 5 }, U)).toBe(false);
    expect(insidePolygon({ x: 15, y: 31 }, U)).toBe(false);
  });

  it('holds nothing with fewer than three points', () => {
    expect(insidePolygon({ x: 0, y: 0 }, U.slice(0, 2))).toBe(false);
  });
});

describe('polesInLasso', () => {
  // Poles west of, at and east of the centre on one row, and one south of the centre: planes dipping 60°
  // east and west have their poles at plunge 30° due west and east; a level plane's pole is the centre.
  const scene = buildStereonetScene(
    [
      { id: 'west', kind: 'joint', plane: { dipDirection: 90, dip: 60 }, set: null },
      { id: 'centre', kind: 'joint', plane: { dipDirection: 0, dip: 0 }, set: null },
      { id: 'east', kind: 'joint', plane: { dipDirection: 270, dip: 60 }, set: 'S1' },
      { id: 'south', kind: 'joint', plane: { dipDirection: 0, dip: 60 }, set: null },
    ],
    [],
    { size: 400 },
  );
  const at = (id: string) => scene.poles.find((p) => p.id === id)!;

  it('takes the poles inside a concave lasso and leaves the one in its hollow', () => {
    const w = at('west');
    const c = at('centre');
    const e = at('east');
    expect(Math.abs(w.y - c.y)).toBeLessThan(0.01);
    expect(Math.abs(e.y - c.y)).toBeLessThan(0.01);
    // A band around the row with a notch cut from the top down past the centre pole.
    const top = c.y - 12;
    const bottom = c.y + 12;
    const lasso = [
      { x: w.x - 12, y: top },
      { x: c.x - 8, y: top },
      { x: c.x - 8, y: c.y + 6 },
      { x: c.x + 8, y: c.y + 6 },
      { x: c.x + 8, y: top },
      { x: e.x + 12, y: top },
      { x: e.x + 12, y: bottom },
      { x: w.x - 12, y: bottom },
    ];
    expect(polesInLasso(scene, lasso).map((p) => p.id)).toEqual(['west', 'east']);
    // Without the notch the same band takes the centre pole too, and never the south one.
    const band = [lasso[0], lasso[5], lasso[6], lasso[7]];
    expect(polesInLasso(scene, band).map((p) => p.id)).toEqual(['west', 'centre', 'east']);
  });

  it('takes nothing from a lasso of one or two points', () => {
    const c = at('centre');
    expect(polesInLasso(scene, [c, { x: c.x + 1, y: c.y + 1 }])).toEqual([]);
  });
});
