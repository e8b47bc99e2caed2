import { roofWedgesOfSets } from '../src/index.js';

const set = (label: string, dipDirection: number, dip: number) => ({ label, mean: { dipDirection, dip } });

describe('roofWedgesOfSets', () => {
  it('lists the falling wedge of 045/60, 165/60, 285/60 (methods.md §5 [computed here])', () => {
    const r = roofWedgesOfSets([set('S1', 45, 60), set('S2', 165, 60), set('S3', 285, 60)], 30);
    expect(r.combinations).toBe(1);
    expect(r.wedges).toHaveLength(1);
    expect(r.wedges[0].labels).toEqual(['S1', 'S2', 'S3']);
    expect(r.wedges[0].mode).toBe('falls');
    expect(r.wedges[0].sliding).toBeNull();
    // Edges 105/40.9, 225/40.9, 345/40.9 (methods.md §5 [computed here]).
    expect(r.wedges[0].edges.map((e) => Math.round(e.trend))).toEqual([105, 225, 345]);
    r.wedges[0].edges.forEach((e) => expect(e.plunge).toBeCloseTo(40.9, 1));
  });

  it('060/70, 160/70, 110/20 slides along the S1–S2 line 110/60.5 at φ 30° (methods.md §5 [computed here])', () => {
    const r = roofWedgesOfSets([set('S1', 60, 70), set('S2', 160, 70), set('S3', 110, 20)], 30);
    expect(r.wedges).toHaveLength(1);
    const w = r.wedges[0];
    expect(w.mode).toBe('slides');
    expect(w.sliding?.on).toEqual({ kind: 'line', labels: ['S1', 'S2'] });
    expect(w.sliding?.direction.trend).toBeCloseTo(110, 6);
    expect(w.sliding?.direction.plunge).toBeCloseTo(60.5, 1);
  });

  it('the same three sets are left out at φ 70°, steeper than the 60.5° line (methods.md §5 [computed here])', () => {
    const r = roofWedgesOfSets([set('S1', 60, 70), set('S2', 160, 70), set('S3', 110, 20)], 70);
    expect(r.combinations).toBe(1);
    expect(r.wedges).toEqual([]);
  });

  it('a wedge that slides on one plane down its dip: 180/45 between 100/60 and 260/60 [computed here]', () => {
    // Edge of 100/60 and 260/60 trends 180 with plunge atan(tan 60° · cos 80°) = 16.7°, gentler than 180/45,
    // so the steepest way down is the dip line of 180/45 itself, between its edges with the other two
    // [computed here, apparent-dip formula, Hoek & Bray 1981 from memory].
    const r = roofWedgesOfSets([set('A', 180, 45), set('B', 100, 60), set('C', 260, 60)], 30);
    expect(r.wedges).toHaveLength(1);
    expect(r.wedges[0].mode).toBe('slides');
    expect(r.wedges[0].sliding?.on).toEqual({ kind: 'plane', labels: ['A'] });
    expect(r.wedges[0].sliding?.direction.trend).toBeCloseTo(180, 6);
    expect(r.wedges[0].sliding?.direction.plunge).toBeCloseTo(45, 6);
    expect(r.wedges[0].edges[1].plunge).toBeCloseTo(16.74, 2);
  });

  it('looks at every combination of four sets, falls first, and counts those that bound no wedge', () => {
    // S1–S3 fall (methods.md §5); S4 parallel to S1 bounds no wedge with S1; S4 is 045/60 again.
    const r = roofWedgesOfSets(
      [set('S1', 45, 60), set('S2', 165, 60), set('S3', 285, 60), set('S4', 45, 60)],
      30,
    );
    expect(r.combinations).toBe(4);
    expect(r.noWedge).toBe(2); // S1–S2–S4 and S1–S3–S4 hold two parallel planes
    expect(r.wedges.map((w) => w.labels.join('-'))).toEqual(['S1-S2-S3', 'S2-S3-S4']);
  });

  it('has nothing to look at with fewer than three sets', () => {
    const r = roofWedgesOfSets([set('S1', 45, 60), set('S2', 165, 60)], 30);
    expect(r).toEqual({ frictionAngle: 30, setCount: 2, combinations: 0, noWedge: 0, wedges: [] });
  });

  it('puts falling wedges before sliding ones', () => {
    // S1–S2–S3 slides (methods.md §5), S4–S5–S6 falls (methods.md §5, the other case).
    const r = roofWedgesOfSets(
      [
        set('S1', 60, 70),
        set('S2', 160, 70),
        set('S3', 110, 20),
        set('S4', 45, 60),
        set('S5', 165, 60),
        set('S6', 285, 60),
      ],
      30,
    );
    expect(r.combinations).toBe(20);
    expect(r.wedges[0].mode).toBe('falls');
    expect(r.wedges.map((w) => w.mode)).toEqual([...r.wedges].map((w) => w.mode).sort());
    expect(r.wedges.some((w) => w.labels.join('-') === 'S1-S2-S3' && w.mode === 'slides')).toBe(true);
  });
});
