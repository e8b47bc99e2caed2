import fc from 'fast-check';
import { OrientationError, formatPlane, parseLine, parsePlane } from '../src/index.js';
import type { Plane, PlaneNotation } from '../src/index.js';
import { expectAzimuthClose } from './asserts.js';

const wholePlane = fc.record({
  dipDirection: fc.integer({ min: 0, max: 359 }),
  dip: fc.integer({ min: 1, max: 90 }),
});
const anyPlane = fc.record({
  dipDirection: fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
  dip: fc.double({ min: 0.05, max: 90, noNaN: true }),
});

/** Same plane: dips equal, dip directions equal (any dip direction when horizontal). */
function expectSamePlane(actual: Plane, expected: Plane, tolerance: number): void {
  expect(Math.abs(actual.dip - expected.dip)).toBeLessThanOrEqual(tolerance);
  expectAzimuthClose(actual.dipDirection, expected.dipDirection, tolerance + 1e-9);
}

describe('round trips for every notation: parsePlane(formatPlane(p, n), n) ≈ p', () => {
  const notations: PlaneNotation[] = ['dip-direction/dip', 'dip/dip-direction', 'strike/dip-rhr'];

  it.each(notations)('%s, whole degrees exactly', (notation) => {
    fc.assert(
      fc.property(wholePlane, (p) => {
        expectSamePlane(parsePlane(formatPlane(p, notation), { notation }), p, 0);
      }),
    );
  });

  it('quadrant, whole degrees exactly (read by any two-number notation)', () => {
    fc.assert(
      fc.property(wholePlane, fc.constantFrom(...notations), (p, notation) => {
        expectSamePlane(parsePlane(formatPlane(p, 'quadrant'), { notation }), p, 0);
      }),
    );
  });

  it.each([...notations, 'quadrant' as const])(
    '%s, any plane to the 0.05° of display rounding',
    (notation) => {
      fc.assert(
        fc.property(anyPlane, (p) => {
          const options = notation === 'quadrant' ? undefined : { notation };
          expectSamePlane(parsePlane(formatPlane(p, notation), options), p, 0.05 + 1e-9);
        }),
      );
    },
  );
});

describe('parsePlane and parseLine on arbitrary text', () => {
  /** A valid plane or an OrientationError, never another error, never NaN or out of range. */
  function checkPlaneOrOrientationError(text: string): void {
    let plane: Plane;
    try {
      plane = parsePlane(text);
    } catch (e) {
      expect(e).toBeInstanceOf(OrientationError);
      expect((e as Error).message.length).toBeGreaterThan(10);
      return;
    }
    expect(Number.isFinite(plane.dipDirection)).toBe(true);
    expect(Number.isFinite(plane.dip)).toBe(true);
    expect(plane.dipDirection).toBeGreaterThanOrEqual(0);
    expect(plane.dipDirection).toBeLessThan(360);
    expect(plane.dip).toBeGreaterThanOrEqual(0);
    expect(plane.dip).toBeLessThanOrEqual(90);
  }

  it('10,000 arbitrary strings: a valid plane or an OrientationError', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 30 }), checkPlaneOrOrientationError), {
      numRuns: 10_000,
    });
  });

  it('10,000 strings from the characters of the notations: a valid plane or an OrientationError', () => {
    const piece = fc.constantFrom(
      ...'0123456789.NESWnesw /,-°'.split(''),
      '90',
      '360',
      '45',
      'SE',
      'NW',
      '999',
    );
    const text = fc.array(piece, { maxLength: 14 }).map((a) => a.join(''));
    let valid = 0;
    fc.assert(
      fc.property(text, (t) => {
        try {
          parsePlane(t);
          valid++;
        } catch {
          /* checked below */
        }
        checkPlaneOrOrientationError(t);
      }),
      { numRuns: 10_000 },
    );
    expect(valid).toBeGreaterThan(0); // the generator reaches the accepting paths too
  });

  it('parseLine on arbitrary strings: a valid line or an OrientationError', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 20 }), (t) => {
        try {
          const l = parseLine(t);
          expect(l.plunge >= 0 && l.plunge <= 90 && l.trend >= 0 && l.trend < 360).toBe(true);
        } catch (e) {
          expect(e).toBeInstanceOf(OrientationError);
        }
      }),
      { numRuns: 2_000 },
    );
  });
});
