import { lineToVector, planeNormal, vectorToLine } from '../src/index.js';
import { expectClose } from './asserts.js';

describe('vectors in the north-east-down frame', () => {
  it('line 219/68 has direction cosines (−0.2911, −0.2357, 0.9272)', () => {
    // methods.md §1.2 [computed here]; Hudson & Harrison 1997, Engineering Rock Mechanics, App. B p.434
    // defines N = cos α cos β, E = sin α cos β, D = sin β [source, seen].
    expectClose(lineToVector({ trend: 219, plunge: 68 }), [-0.2911, -0.2357, 0.9272], 1e-4);
  });

  it('the pole of plane 130/50 is (0.4924, −0.5868, 0.6428), trend 310 plunge 40', () => {
    // Brady & Brown 2004, Rock Mechanics for Underground Mining 3rd ed., App. A.2 p.569: pole 310/40
    // [source, seen]; vector methods.md §1.2 [computed here].
    const n = planeNormal({ dipDirection: 130, dip: 50 });
    expectClose(n, [0.4924, -0.5868, 0.6428], 1e-4);
    expectClose(vectorToLine(n), { trend: 310, plunge: 40 }, 1e-9);
  });

  it('an upward vector is flipped into the lower hemisphere', () => {
    expectClose(vectorToLine([0, 0, -1]), { plunge: 90 }, 1e-12);
    expectClose(vectorToLine([-1, 0, -1e-3]), { trend: 0 }, 1e-9);
  });
});
