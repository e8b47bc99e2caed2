import { ESR_RANGE, ESR_TABLE, qSupport, qValue } from '../src/rock-mass.js';
import { RatingError } from '../src/types.js';
import { expectClose } from './asserts.js';

describe('Q support relations', () => {
  it("Hoek's crusher chamber: De 9.375, bolts 3.406 m, unsupported span 5.840 m", () => {
    // Hoek, Practical Rock Engineering (2007), ch. "Rock mass classification" [from memory]: Q 4.5, span
    // 15 m, ESR 1.6; relations L = 2 + 0.15·B/ESR and span = 2·ESR·Q^0.4 seen in Maidl, Thewes & Maidl,
    // tunnelling handbook, Table 2-15 text; arithmetic methods.md §4.4 ex. 1 [computed here].
    const q = qValue({ rqd: 90, jn: 4, jr: 3, ja: 1, jw: 1, srf: 15 }).q;
    const s = qSupport({ q, span: 15, esr: 1.6 });
    expectClose(s.equivalentDimension, 9.375, 1e-12);
    expectClose(s.boltLength, 3.40625, 1e-12);
    expectClose(s.maxUnsupportedSpan, 5.84, 1e-3);
  });

  it('the unsupported span grows as Q^0.4: ten times Q gives 10^0.4 times the span', () => {
    const a = qSupport({ q: 1, span: 10, esr: 1 }).maxUnsupportedSpan;
    const b = qSupport({ q: 10, span: 10, esr: 1 }).maxUnsupportedSpan;
    expectClose(a, 2, 1e-12);
    expectClose(b / a, Math.pow(10, 0.4), 1e-12);
  });

  it('accepts ESR from 0.5 to 5 and rejects anything else, and Q or span of 0 or less', () => {
    expect(() => qSupport({ q: 1, span: 10, esr: ESR_RANGE[0] })).not.toThrow();
    expect(() => qSupport({ q: 1, span: 10, esr: ESR_RANGE[1] })).not.toThrow();
    expect(() => qSupport({ q: 1, span: 10, esr: 0.49 })).toThrow(
      /ESR 0.49 is outside its table: expected 0.5 to 5/,
    );
    expect(() => qSupport({ q: 1, span: 10, esr: 5.01 })).toThrow(RatingError);
    expect(() => qSupport({ q: 0, span: 10, esr: 1 })).toThrow(RatingError);
    expect(() => qSupport({ q: 1, span: -1, esr: 1 })).toThrow(/span must be greater than 0 m/);
  });
});

describe('ESR table by excavation category', () => {
  it('carries the published values (1974 values seen in Maidl, Thewes & Maidl Table 2-15; 2015 list from memory)', () => {
    const values = ESR_TABLE.map((r) => [r.category, r.esr]);
    expect(values).toEqual([
      ['A', 3.5],
      ['B', 2.5],
      ['B', 2.0],
      ['C', 1.6],
      ['D', 1.3],
      ['E', 1.0],
      ['F', 0.8],
      ['G', 0.5],
    ]);
    expect(ESR_TABLE[0].range).toEqual([2, 5]);
  });

  it('every row value and range end is accepted by qSupport', () => {
    for (const row of ESR_TABLE) {
      for (const esr of [row.esr, ...(row.range ?? [])]) {
        expectClose(qSupport({ q: 1, span: 10, esr }).equivalentDimension, 10 / esr, 1e-12);
      }
    }
  });
});
