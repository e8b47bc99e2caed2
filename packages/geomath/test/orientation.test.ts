import { OrientationError, planeOfPole, poleOf } from '../src/index.js';
import { expectClose } from './asserts.js';

describe('pole ⇄ plane', () => {
  it('the pole of 130/50 is 310/40', () => {
    // Brady & Brown 2004, Rock Mechanics for Underground Mining 3rd ed., App. A.2 p.569 [source, seen]
    expect(poleOf({ dipDirection: 130, dip: 50 })).toEqual({ trend: 310, plunge: 40 });
    expect(planeOfPole({ trend: 310, plunge: 40 })).toEqual({ dipDirection: 130, dip: 50 });
  });

  it('a horizontal plane has a vertical pole, exactly, and back', () => {
    expect(poleOf({ dipDirection: 0, dip: 0 })).toEqual({ trend: 180, plunge: 90 });
    expect(planeOfPole({ trend: 0, plunge: 90 })).toEqual({ dipDirection: 180, dip: 0 });
    expect(planeOfPole(poleOf({ dipDirection: 77, dip: 0 }))).toEqual({ dipDirection: 77, dip: 0 });
  });

  it('a vertical plane: of the two horizontal normals, the one opposite the dip direction (stated rule)', () => {
    expect(poleOf({ dipDirection: 60, dip: 90 })).toEqual({ trend: 240, plunge: 0 });
    expect(poleOf({ dipDirection: 240, dip: 90 })).toEqual({ trend: 60, plunge: 0 });
    expect(planeOfPole({ trend: 240, plunge: 0 })).toEqual({ dipDirection: 60, dip: 90 });
  });

  it('wraps azimuths at 360', () => {
    expect(poleOf({ dipDirection: 180, dip: 10 })).toEqual({ trend: 0, plunge: 80 });
    expectClose(poleOf({ dipDirection: 359.5, dip: 10 }), { trend: 179.5, plunge: 80 }, 1e-12);
  });

  it('rejects dips and plunges outside 0–90 with a plain message', () => {
    expect(() => poleOf({ dipDirection: 10, dip: 95 })).toThrow(OrientationError);
    expect(() => poleOf({ dipDirection: 10, dip: 95 })).toThrow('dip 0–90°');
    expect(() => planeOfPole({ trend: 10, plunge: -5 })).toThrow('plunge 0–90°');
    expect(() => poleOf({ dipDirection: Number.NaN, dip: 5 })).toThrow(OrientationError);
  });
});
