import {
  FIT,
  MAX_ZOOM,
  clampView,
  doubleTap,
  isDoubleTap,
  pinch,
  swipeStep,
  zoomAbout,
} from './viewer-gestures';

// Expected values worked by hand from the transform (translate, then scale about the centre).
describe('swipeStep', () => {
  it('turns to the next photo on a leftward swipe and the previous on a rightward one', () => {
    expect(swipeStep(-120, 10, 1)).toBe(1);
    expect(swipeStep(90, -20, 1)).toBe(-1);
  });

  it('ignores short, mostly vertical and zoomed moves', () => {
    expect(swipeStep(-30, 0, 1)).toBe(0);
    expect(swipeStep(-80, 70, 1)).toBe(0);
    expect(swipeStep(-200, 0, 2)).toBe(0);
  });
});

describe('zoom and pan', () => {
  it('keeps the spot under the zoom point in place', () => {
    const v = zoomAbout(FIT, 2, { x: 100, y: -50 });
    expect(v).toEqual({ zoom: 2, x: -100, y: 50 });
    // the photo point under (100, -50) was (100, -50) at fit; now 2 × 100 + (-100) = 100
    expect(2 * 100 + v.x).toBe(100);
  });

  it('pinches: spreading two fingers to twice their distance doubles the zoom; moving their middle pans', () => {
    const v = pinch(
      FIT,
      [
        { x: -50, y: 0 },
        { x: 50, y: 0 },
      ],
      [
        { x: -90, y: 20 },
        { x: 110, y: 20 },
      ],
    );
    expect(v.zoom).toBeCloseTo(2, 9);
    expect(v.x).toBeCloseTo(10, 9);
    expect(v.y).toBeCloseTo(20, 9);
  });

  it('keeps the zoomed photo over the stage and the zoom between fit and the maximum', () => {
    const stage = { width: 400, height: 300 };
    expect(clampView({ zoom: 2, x: 500, y: -500 }, stage)).toEqual({ zoom: 2, x: 200, y: -150 });
    expect(clampView({ zoom: 0.5, x: 30, y: 0 }, stage)).toEqual({ zoom: 1, x: 0, y: 0 });
    expect(clampView({ zoom: 20, x: 0, y: 0 }, stage).zoom).toBe(MAX_ZOOM);
  });

  it('double tap zooms in at the tap and back to fit', () => {
    const zoomed = doubleTap(FIT, { x: 40, y: 0 });
    expect(zoomed).toEqual({ zoom: 2.5, x: -60, y: 0 });
    expect(doubleTap(zoomed, { x: 0, y: 0 })).toEqual(FIT);
  });

  it('takes two taps close in time and place as a double tap', () => {
    const first = { t: 1000, at: { x: 10, y: 10 } };
    expect(isDoubleTap(first, 1200, { x: 20, y: 15 })).toBe(true);
    expect(isDoubleTap(first, 1400, { x: 10, y: 10 })).toBe(false);
    expect(isDoubleTap(first, 1100, { x: 90, y: 10 })).toBe(false);
    expect(isDoubleTap(null, 1100, { x: 10, y: 10 })).toBe(false);
  });
});
