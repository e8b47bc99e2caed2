import { roundChanges, SAME_PLANE_WITHIN_DEG, type FrozenRoundView } from '../src/index.js';

const view = (
  over: Partial<FrozenRoundView['assessment']> = {},
  top: Partial<FrozenRoundView> = {},
): FrozenRoundView => ({
  roundNumber: 7,
  classCode: 'SC2',
  classConfirmed: true,
  assessment: {
    ratings: { q: { value: 4 }, rmr: { value: 55 } },
    sets: {
      sets: [
        { label: 'A', mean: { dipDirection: 120, dip: 60 } },
        { label: 'B', mean: { dipDirection: 300, dip: 30 } },
      ],
    },
    features: [],
    inflowPer10m: 5,
    ...over,
  },
  ...top,
});

const byAspect = (changes: ReturnType<typeof roundChanges>, aspect: string) =>
  changes.filter((c) => c.aspect === aspect);

describe('roundChanges', () => {
  it('lists class, Q, RMR89 and water as unchanged when nothing changed, and no sets or features', () => {
    const c = roundChanges(view(), view({}, { roundNumber: 8 }));
    expect(c.map((x) => [x.aspect, x.trend])).toEqual([
      ['class', 'same'],
      ['q', 'same'],
      ['rmr89', 'same'],
      ['water', 'same'],
    ]);
    expect(c[1].text).toBe('Q unchanged at 4');
  });

  it('reads a fall in Q and RMR89 and a rise in water as worse, and names the class change', () => {
    const c = roundChanges(
      view(),
      view(
        { ratings: { q: { value: 0.8 }, rmr: { value: 41 } }, inflowPer10m: 22.44 },
        { classCode: 'SC4', classConfirmed: false },
      ),
    );
    expect(byAspect(c, 'class')[0]).toMatchObject({
      trend: 'changed',
      before: 'SC2 (confirmed)',
      after: 'SC4 (recommended)',
      text: 'Support class SC2 → SC4',
    });
    expect(byAspect(c, 'q')[0]).toMatchObject({ trend: 'worse', text: 'Q fell from 4 to 0.8' });
    expect(byAspect(c, 'rmr89')[0]).toMatchObject({ trend: 'worse', text: 'RMR89 fell from 55 to 41' });
    expect(byAspect(c, 'water')[0]).toMatchObject({
      trend: 'worse',
      text: 'Inflow per 10 m rose from 5 l/min to 22.4 l/min',
    });
  });

  it('reads better ground as better, and a value missing on one side as unknown', () => {
    const c = roundChanges(
      view({ inflowPer10m: null }),
      view({ ratings: { q: { value: 10 }, rmr: { value: 55 } }, inflowPer10m: 3 }),
    );
    expect(byAspect(c, 'q')[0].trend).toBe('better');
    expect(byAspect(c, 'water')[0]).toMatchObject({
      trend: 'unknown',
      before: 'not recorded',
      after: '3 l/min',
    });
  });

  it('compares Q as printed: 4.02 and 3.98 both print 4 and are unchanged', () => {
    const c = roundChanges(
      view({ ratings: { q: { value: 4.02 }, rmr: { value: 55 } } }),
      view({ ratings: { q: { value: 3.98 }, rmr: { value: 55 } } }),
    );
    expect(byAspect(c, 'q')[0].trend).toBe('same');
  });

  it('matches sets by orientation, not by label, and names a new set and one no longer seen', () => {
    const c = roundChanges(
      view(),
      view({
        sets: {
          sets: [
            // A relabelled and turned 10°: the same set.
            { label: 'B', mean: { dipDirection: 130, dip: 62 } },
            // Near-vertical, striking across: new.
            { label: 'A', mean: { dipDirection: 30, dip: 85 } },
          ],
        },
      }),
    );
    const sets = byAspect(c, 'set');
    expect(sets).toHaveLength(2);
    expect(sets[0]).toMatchObject({ trend: 'new', label: 'Set A', after: '030/85' });
    expect(sets[1]).toMatchObject({ trend: 'gone', before: '300/30' });
  });

  it('takes a set just past the matching angle as new', () => {
    // Same dip direction, dips 60° and 60 - (limit + 1)°: the poles are limit + 1 apart.
    const c = roundChanges(
      view({ sets: { sets: [{ label: 'A', mean: { dipDirection: 120, dip: 60 } }] } }),
      view({
        sets: { sets: [{ label: 'A', mean: { dipDirection: 120, dip: 60 - SAME_PLANE_WITHIN_DEG - 1 } }] },
      }),
    );
    expect(byAspect(c, 'set').map((s) => s.trend)).toEqual(['new', 'gone']);
  });

  it('names a new fault and keeps one that continues', () => {
    const fault = { jointId: 'f1', kind: 'fault' as const, plane: { dipDirection: 200, dip: 70 } };
    const c = roundChanges(
      view({ features: [fault] }),
      view({
        features: [
          { ...fault, jointId: 'f2', plane: { dipDirection: 205, dip: 72 } },
          { jointId: 's1', kind: 'shear-zone', plane: { dipDirection: 90, dip: 45 } },
        ],
      }),
    );
    const f = byAspect(c, 'feature');
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ trend: 'new', text: 'New shear zone (090/45)' });
  });
});
