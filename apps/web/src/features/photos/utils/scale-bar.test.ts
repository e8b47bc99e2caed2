import { BAR_MAX, BAR_MIN, chooseScaleBar, formatLength, photoWidthM, scaleBarOf } from './scale-bar';

// The bar steps (1, 2, 5 times a power of ten) and the 10–30 % span are the task's rule (common practice
// for a drawn scale); the widths below are worked by hand.
describe('photoWidthM', () => {
  it('reads a horizontal mark straight: 1.2 m over half the width is a 2.4 m wide photo', () => {
    expect(photoWidthM({ a: { x: 0.1, y: 0.5 }, b: { x: 0.6, y: 0.5 }, distanceM: 1.2 }, 4 / 3)).toBeCloseTo(
      2.4,
      9,
    );
  });

  it('shortens a vertical mark by the aspect: 0.6 of the height of a 4:3 photo is 0.45 of its width', () => {
    // 0.9 m / 0.45 = 2 m
    expect(photoWidthM({ a: { x: 0.5, y: 0.2 }, b: { x: 0.5, y: 0.8 }, distanceM: 0.9 }, 4 / 3)).toBeCloseTo(
      2,
      9,
    );
  });

  it('has no width for coinciding points or no distance', () => {
    expect(photoWidthM({ a: { x: 0.3, y: 0.3 }, b: { x: 0.3, y: 0.3 }, distanceM: 1 }, 1)).toBeNull();
    expect(photoWidthM({ a: { x: 0.1, y: 0.3 }, b: { x: 0.3, y: 0.3 }, distanceM: 0 }, 1)).toBeNull();
  });
});

describe('chooseScaleBar', () => {
  it.each([
    // photo width (m), bar (m), label
    [2.4, 0.5, '0.5 m'], // 0.5 / 2.4 = 21 %
    [5, 1, '1 m'], // 20 %
    [1.2, 0.2, '0.2 m'], // 17 % (0.5 m would be 42 %)
    [12, 2, '2 m'], // 17 %
    [0.3, 0.05, '5 cm'], // 17 %
    [30, 5, '5 m'], // 17 %
    [8, 2, '2 m'], // 25 % beats 1 m at 12.5 % (nearer a fifth)
  ])('a photo %p m wide gets a %p m bar', (width, length, label) => {
    expect(chooseScaleBar(width)).toEqual({ lengthM: length, fraction: length / width, label });
  });

  it('always finds a 1-2-5 length spanning 10–30 % of the width, for widths from 1 cm to 1 km', () => {
    for (let w = 0.01; w <= 1000; w *= 1.037) {
      const bar = chooseScaleBar(w);
      expect(bar).not.toBeNull();
      expect(bar!.fraction).toBeGreaterThanOrEqual(BAR_MIN);
      expect(bar!.fraction).toBeLessThanOrEqual(BAR_MAX);
      const mantissa = bar!.lengthM / 10 ** Math.floor(Math.log10(bar!.lengthM) + 1e-9);
      expect([1, 2, 5]).toContainEqual(Number(mantissa.toPrecision(6)));
    }
  });

  it('gives nothing for a width that is not a positive number', () => {
    expect(chooseScaleBar(0)).toBeNull();
    expect(chooseScaleBar(Number.NaN)).toBeNull();
  });
});

describe('scaleBarOf and formatLength', () => {
  it('goes from the marked scale to the bar, and labels centimetres below 0.1 m', () => {
    expect(scaleBarOf({ a: { x: 0.1, y: 0.5 }, b: { x: 0.6, y: 0.5 }, distanceM: 1.2 }, 4 / 3)?.label).toBe(
      '0.5 m',
    );
    expect(scaleBarOf(null, 1)).toBeNull();
    expect(formatLength(0.02)).toBe('2 cm');
    expect(formatLength(10)).toBe('10 m');
  });
});
