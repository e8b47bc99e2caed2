import { OrientationError, formatPlane, parseLine, parsePlane, rightHandStrike } from '../src/index.js';
import { expectClose } from './asserts.js';

const errorOf = (fn: () => unknown): OrientationError => {
  try {
    fn();
  } catch (e) {
    if (e instanceof OrientationError) return e;
    throw e;
  }
  throw new Error('expected an OrientationError');
};

describe('parsePlane: dip direction/dip and the other two-number notations', () => {
  it('reads 130/50 as dip direction 130, dip 50 by default', () => {
    // Brady & Brown 2004, Rock Mechanics for Underground Mining 3rd ed., App. A (α/δ written 130/50) [source, seen]
    expect(parsePlane('130/50')).toEqual({ dipDirection: 130, dip: 50 });
  });

  it.each(['130/50', '130 50', '130-50', '130,50', ' 130 / 50 ', '130°/50°', '130, 50'])(
    'accepts the separators people type: %s',
    (text) => {
      expect(parsePlane(text)).toEqual({ dipDirection: 130, dip: 50 });
    },
  );

  it('reads dip/dip direction when told to', () => {
    expect(parsePlane('50/130', { notation: 'dip/dip-direction' })).toEqual({ dipDirection: 130, dip: 50 });
  });

  it('reads right-hand-rule strike/dip: 040/50 is 130/50 (methods.md §1.1, common practice)', () => {
    expect(parsePlane('040/50', { notation: 'strike/dip-rhr' })).toEqual({ dipDirection: 130, dip: 50 });
    expect(parsePlane('210/40', { notation: 'strike/dip-rhr' })).toEqual({ dipDirection: 300, dip: 40 });
    expect(parsePlane('300/10', { notation: 'strike/dip-rhr' })).toEqual({ dipDirection: 30, dip: 10 });
  });

  it('keeps three-digit azimuths and decimals: 005/08, 030.5/40.25, 360/20 → 000/20', () => {
    expect(parsePlane('005/08')).toEqual({ dipDirection: 5, dip: 8 });
    expect(parsePlane('030.5/40.25')).toEqual({ dipDirection: 30.5, dip: 40.25 });
    expect(parsePlane('360/20')).toEqual({ dipDirection: 0, dip: 20 });
  });

  it('handles horizontal and vertical planes exactly', () => {
    expect(parsePlane('000/00')).toEqual({ dipDirection: 0, dip: 0 });
    expect(parsePlane('270/90')).toEqual({ dipDirection: 270, dip: 90 });
  });
});

describe('parsePlane: quadrant strike with dip quadrant (methods.md §1.1, rule computed here)', () => {
  it.each([
    ['N30E 40SE', 120],
    ['N30E 40NW', 300],
    ['N30E/40SE', 120],
    ['030/40SE', 120],
    ['030 40 SE', 120],
    ['n30e 40se', 120],
    ['N30E-40-SE', 120],
    ['210/40SE', 120], // the other end of the same strike line
    ['N40E 50SE', 130],
    ['S30W 40SE', 120],
    ['N60W 40SW', 210],
    ['S60E 40NE', 30],
  ])('%s has dip direction %d', (text, dd) => {
    expect(parsePlane(text)).toEqual({ dipDirection: dd, dip: text.includes('50') ? 50 : 40 });
  });

  it('strike N–S takes only E or W; strike E–W takes only N or S', () => {
    expect(parsePlane('N0E 40E').dipDirection).toBe(90);
    expect(parsePlane('N00E 40W').dipDirection).toBe(270);
    expect(parsePlane('N90E 30S').dipDirection).toBe(180);
    expect(parsePlane('N90W 30N').dipDirection).toBe(0);
    expect(() => parsePlane('N0E 40SE')).toThrow(OrientationError);
    expect(() => parsePlane('N0E 40N')).toThrow(OrientationError);
    expect(() => parsePlane('N90E 40E')).toThrow(OrientationError);
    expect(() => parsePlane('N90E 40NE')).toThrow(OrientationError);
  });

  it('a diagonal strike N45E takes SE or NW; a single letter only when it lies within 90° of one side', () => {
    expect(parsePlane('N45E 40SE').dipDirection).toBe(135);
    expect(parsePlane('N45E 40NW').dipDirection).toBe(315);
    expect(parsePlane('N45E 40S').dipDirection).toBe(135);
    expect(() => parsePlane('N45E 40NE')).toThrow(OrientationError);
    expect(() => parsePlane('N45E 40SW')).toThrow(OrientationError);
  });

  // Common practice: a single dip letter names a dip direction only within 67.5° of it (issue 10).
  it('a single dip letter must lie within 67.5° of the dip direction it selects (common practice)', () => {
    const e = errorOf(() => parsePlane('N89E 40E')); // read as 179/40 before this rule
    expect(e).toBeInstanceOf(OrientationError);
    expect(e.message).toContain('within 67.5°');
    expect(e.message).toContain('Valid readings: N89E 40S (179/40) or N89E 40N (359/40)');
    expect(() => parsePlane('N70E 40E')).toThrow(OrientationError); // E is 70° from 160
    expect(() => parsePlane('080 40 E')).toThrow('Valid readings: 080 40S (170/40) or 080 40N (350/40)');
    expect(parsePlane('030 40 N').dipDirection).toBe(300); // N is 60° from 300
    // 67.5° itself is within: strike N22.5E, dip direction 112.5, E is 22.5° away, S 67.5° away.
    expect(parsePlane('N22.5E 40S').dipDirection).toBe(112.5);
    expect(parsePlane('N22.5E 40E').dipDirection).toBe(112.5);
    expect(() => parsePlane('N22E 40S')).toThrow(OrientationError); // S is 68° from 112
    expect(parsePlane('N30E 40E').dipDirection).toBe(120); // 30° away
    expect(parsePlane('N60E 40S').dipDirection).toBe(150); // 30° away
  });

  it('rejects a dip quadrant along the strike (N30E 40NE, N30E 40SW) and says which sides are possible', () => {
    const e = errorOf(() => parsePlane('N30E 40NE'));
    expect(e.message).toContain('NE does not fit the strike');
    expect(e.message).toContain('120°');
    expect(e.message).toContain('300°');
    expect(() => parsePlane('N30E 40SW')).toThrow(OrientationError);
  });
});

describe('parsePlane: clear errors for the field', () => {
  it.each([
    ['', 'No plane given'],
    ['   ', 'No plane given'],
    ['130/95', 'Dip 95 is out of range: dip must be 0–90°.'],
    ['400/50', 'Dip direction 400 is out of range'],
    ['50/130', 'looks like dip/dip direction'],
    ['130/50/20', 'not a recognised orientation'],
    ['130', 'is incomplete'],
    ['N30E', 'is incomplete'],
    ['N30E 40', 'is incomplete'],
    ['N95E 40SE', 'angle of a quadrant bearing is 0–90°'],
    ['E30N 40SE', 'must start with N or S'],
    ['N30S 40SE', 'must end with E or W'],
    ['N30E 40SEE', 'is not a compass quadrant'],
    ['130/5O', 'contains “O”'],
    ['13.5.1/40', 'not a number or a compass direction'],
    ['1.2.3/40', 'not a number or a compass direction'],
    ['130;50', 'contains “;”'],
    ['-130/50', 'negative angles are not used'],
    ['130/50/', 'starts or ends with a separator'],
    ['x'.repeat(60), 'too long'],
  ])('%s → %s', (text, message) => {
    expect(errorOf(() => parsePlane(text)).message).toContain(message);
  });

  it('in dip/dip-direction mode a swapped entry gets a hint', () => {
    expect(errorOf(() => parsePlane('130/50', { notation: 'dip/dip-direction' })).message).toContain(
      'looks like dip direction/dip',
    );
  });
});

describe('parseLine', () => {
  it('reads trend/plunge, quadrant bearing and plunge, and plunge→trend', () => {
    expect(parseLine('124/50')).toEqual({ trend: 124, plunge: 50 });
    expect(parseLine('S56E 50')).toEqual({ trend: 124, plunge: 50 });
    expect(parseLine('50→124')).toEqual({ trend: 124, plunge: 50 });
    expect(parseLine('50->124')).toEqual({ trend: 124, plunge: 50 });
    expect(parseLine('219/68')).toEqual({ trend: 219, plunge: 68 });
  });

  it.each([
    // Quadrant bearing → azimuth: N a E = a, S a E = 180 − a, S a W = 180 + a, N a W = 360 − a;
    // N0E = 0, S90W = 270 (methods.md §1.1, computed here).
    ['N30E 10', 30],
    ['S30E 10', 150],
    ['S30W 10', 210],
    ['N30W 10', 330],
    ['N0E 10', 0],
    ['S90W 10', 270],
    ['N0W 10', 0],
    ['S0E 10', 180],
  ])('bearing %s has trend %d', (text, trend) => {
    expectClose(parseLine(text), { trend, plunge: 10 }, 1e-12);
  });

  it('says what is wrong with a line', () => {
    expect(errorOf(() => parseLine('124/95')).message).toContain('Plunge 95 is out of range');
    expect(errorOf(() => parseLine('S56E')).message).toContain('no plunge');
    expect(errorOf(() => parseLine('50→')).message).toContain('No trend given');
    expect(errorOf(() => parseLine('50/130')).message).toContain('trend/plunge, such as 130/50');
  });
});

describe('formatPlane', () => {
  const p = { dipDirection: 130, dip: 50 };
  it('writes every notation', () => {
    expect(formatPlane(p)).toBe('130/50');
    expect(formatPlane(p, 'dip/dip-direction')).toBe('50/130');
    expect(formatPlane(p, 'strike/dip-rhr')).toBe('040/50');
    expect(formatPlane(p, 'quadrant')).toBe('N40E 50SE');
    expect(formatPlane({ dipDirection: 300, dip: 40 }, 'strike/dip-rhr')).toBe('210/40'); // methods.md §1.1
    expect(formatPlane({ dipDirection: 210, dip: 40 }, 'quadrant')).toBe('N60W 40SW');
  });

  it('names a cardinal dip direction by one letter and pads azimuths to three digits', () => {
    expect(formatPlane({ dipDirection: 90, dip: 5 }, 'quadrant')).toBe('N00E 05E');
    expect(formatPlane({ dipDirection: 0, dip: 5 }, 'quadrant')).toBe('N90E 05N');
    expect(formatPlane({ dipDirection: 5, dip: 8 })).toBe('005/08');
    expect(formatPlane({ dipDirection: 359.97, dip: 30.04 })).toBe('000/30');
    expect(formatPlane({ dipDirection: 210.25, dip: 45.5 })).toBe('210.3/45.5');
  });

  it('rightHandStrike: 130/50 → 040, 300/40 → 210 (methods.md §1.1, computed here)', () => {
    expect(rightHandStrike(p)).toBe(40);
    expect(rightHandStrike({ dipDirection: 300, dip: 40 })).toBe(210);
    expect(rightHandStrike({ dipDirection: 45, dip: 40 })).toBe(315);
  });
});
