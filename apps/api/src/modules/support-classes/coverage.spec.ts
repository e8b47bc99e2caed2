import { supportClassWarnings, type CoverageClass } from './coverage';

const c = (
  code: string,
  sortOrder: number,
  q: [number | null, number | null] | null,
  rmr: [number | null, number | null] | null,
): CoverageClass => ({
  code,
  sortOrder,
  qMin: q?.[0] ?? null,
  qMax: q?.[1] ?? null,
  rmrMin: rmr?.[0] ?? null,
  rmrMax: rmr?.[1] ?? null,
});

describe('supportClassWarnings', () => {
  it('finds nothing wrong with a library that tiles Q 0.001–1000 and RMR 0–100 best ground first', () => {
    const sut = supportClassWarnings([
      c('SC1', 1, [10, null], [61, 100]),
      c('SC2', 2, [1, 10], [41, 60]),
      c('SC3', 3, [0.1, 1], [21, 40]),
      c('SC4', 4, [null, 0.1], [0, 20]),
    ]);
    expect(sut).toEqual([]);
  });

  it('reports a gap between two Q ranges and an RMR value no class covers', () => {
    const sut = supportClassWarnings([c('SC1', 1, [10, null], [61, 100]), c('SC2', 2, [null, 4], [0, 59])]);
    expect(sut).toEqual([
      { kind: 'gap', system: 'Q', classes: ['SC2', 'SC1'], message: 'No class covers Q from 4 to 10.' },
      { kind: 'gap', system: 'RMR89', classes: ['SC2', 'SC1'], message: 'No class covers RMR89 60.' },
    ]);
  });

  it('reports overlaps, naming both classes and the shared range', () => {
    const sut = supportClassWarnings([c('SC1', 1, [4, null], [55, 100]), c('SC2', 2, [null, 10], [0, 60])]);
    expect(sut).toEqual([
      { kind: 'overlap', system: 'Q', classes: ['SC2', 'SC1'], message: 'SC2 and SC1 both cover Q 4 to 10.' },
      {
        kind: 'overlap',
        system: 'RMR89',
        classes: ['SC2', 'SC1'],
        message: 'SC2 and SC1 both cover RMR89 55–60.',
      },
    ]);
  });

  it('reports uncovered ends of the scale', () => {
    const sut = supportClassWarnings([c('SC1', 1, [1, 40], null)]);
    expect(sut.map((w) => w.message)).toEqual([
      'No class covers Q from 0.001 to 1.',
      'No class covers Q from 40 to 1000.',
    ]);
  });

  it('warns when a class later in the list covers better ground than an earlier one', () => {
    const sut = supportClassWarnings([c('SC1', 1, null, [0, 50]), c('SC2', 2, null, [51, 100])]);
    expect(sut).toEqual([expect.objectContaining({ kind: 'order', classes: ['SC1', 'SC2'] })]);
  });

  it('leaves retired classes and classes without a range in a system out of that system', () => {
    const sut = supportClassWarnings([
      { ...c('OLD', 1, [0.5, 50], [0, 100]), retired: true },
      c('SC1', 2, null, [0, 100]),
    ]);
    expect(sut).toEqual([]);
  });
});
