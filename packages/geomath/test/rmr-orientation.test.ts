import {
  RMR_ORIENTATION_RULE,
  RMR_TUNNEL_ORIENTATION_CASES,
  rmrOrientationInTunnel,
} from '../src/rock-mass.js';
import { RatingError } from '../src/types.js';
import { expectClose } from './asserts.js';

const drive = { trend: 0, plunge: 0 };
/** A set whose dip direction is `fromDrive` degrees clockwise from the drive (drive 000). */
const set = (fromDrive: number, dip: number) => ({ dipDirection: (fromDrive + 360) % 360, dip });

describe('RMR89 orientation against the drive: worked examples', () => {
  it('drive 060, set 240/60: strike ⟂ axis, drive against dip, dip 60 → fair −5', () => {
    // methods.md §4.2 [computed here] from Bieniawski 1989 Table 4.1 F (as in Brady & Brown 2004 p.98 Table 3.6).
    const r = rmrOrientationInTunnel({ dipDirection: 240, dip: 60 }, { trend: 60, plunge: 0 });
    expect([r.assessment, r.adjustment, r.driveSense, r.relation]).toEqual([
      'fair',
      -5,
      'against dip',
      'perpendicular',
    ]);
    expectClose(r.strikeToAxis, 90, 1e-9);
  });

  it('drive 060, set 060/45: drive with dip, dip 45 → very favourable 0', () => {
    // methods.md §4.2 [computed here].
    const r = rmrOrientationInTunnel({ dipDirection: 60, dip: 45 }, { trend: 60, plunge: 0 });
    expect([r.assessment, r.adjustment]).toEqual(['very favourable', 0]);
  });
});

describe('Table F rows at exact perpendicular and parallel', () => {
  // Bieniawski 1989 Table 4.1 F [from memory; widely reproduced], Brady & Brown 2004 Table 3.6 [source, seen].
  const rows: [string, number, number, string, number][] = [
    ['perpendicular, with dip, 45–90', 0, 60, 'very favourable', 0],
    ['perpendicular, with dip, 20–45', 0, 30, 'favourable', -2],
    ['perpendicular, against dip, 45–90', 180, 60, 'fair', -5],
    ['perpendicular, against dip, 20–45', 180, 30, 'unfavourable', -10],
    ['parallel, 45–90', 90, 60, 'very unfavourable', -12],
    ['parallel, 20–45', 270, 30, 'fair', -5],
    ['any strike, 0–20', 45, 10, 'fair', -5],
  ];
  it.each(rows)('%s', (_name, fromDrive, dip, assessment, adjustment) => {
    const r = rmrOrientationInTunnel(set(fromDrive, dip), drive);
    expect([r.assessment, r.adjustment]).toEqual([assessment, adjustment]);
  });

  it('the data table lists the same seven cases', () => {
    expect(RMR_TUNNEL_ORIENTATION_CASES.map((c) => c.assessment)).toEqual(rows.map((r) => r[3]));
  });
});

describe('the 30°/60° rule (a Roundbook choice; Bieniawski gives no tolerance)', () => {
  it('is stated in words for the UI', () => {
    expect(RMR_ORIENTATION_RULE).toMatch(/within 30° .*30° included.*60° or more.*worse/);
  });

  it('strike exactly 30° from the axis counts as parallel; just over 30° is oblique and takes the worse', () => {
    // Against the dip, dip 30: parallel → fair −5, perpendicular → unfavourable −10.
    const at30 = rmrOrientationInTunnel(set(120, 30), drive);
    expect([at30.relation, at30.adjustment]).toEqual(['parallel', -5]);
    const past30 = rmrOrientationInTunnel(set(120.01, 30), drive);
    expect([past30.relation, past30.adjustment]).toEqual(['oblique', -10]);
    expect(past30.reason).toMatch(/worse of fair \(parallel\) and unfavourable \(perpendicular/);
  });

  it('strike exactly 60° from the axis counts as perpendicular; just under is oblique', () => {
    // With the dip, dip 50: perpendicular → very favourable 0, parallel → very unfavourable −12.
    const at60 = rmrOrientationInTunnel(set(30, 50), drive);
    expect([at60.relation, at60.adjustment]).toEqual(['perpendicular', 0]);
    const below60 = rmrOrientationInTunnel(set(30.01, 50), drive);
    expect([below60.relation, below60.adjustment]).toEqual(['oblique', -12]);
  });

  it('with dip means the dip direction is less than 90° from the drive', () => {
    expect(rmrOrientationInTunnel(set(89.9, 60), drive).driveSense).toBe('with dip');
    expect(rmrOrientationInTunnel(set(-89.9, 60), drive).driveSense).toBe('with dip');
    expect(rmrOrientationInTunnel(set(90.1, 60), drive).driveSense).toBe('against dip');
  });

  it('ignores the gradient of the drive', () => {
    const level = rmrOrientationInTunnel(set(180, 60), drive);
    const steep = rmrOrientationInTunnel(set(180, 60), { trend: 0, plunge: 12 });
    expect(steep).toEqual(level);
  });
});

describe('dip bands [0, 20), [20, 45), [45, 90]', () => {
  const cases: [number, number][] = [
    // dip, adjustment for a set perpendicular to the axis with the drive against the dip
    [0, -5],
    [19.99, -5],
    [20, -10],
    [44.99, -10],
    [45, -5],
    [90, -5],
  ];
  it.each(cases)('dip %p against the drive → %p', (dip, adjustment) => {
    expect(rmrOrientationInTunnel(set(180, dip), drive).adjustment).toBe(adjustment);
  });

  it('rejects a dip outside 0–90', () => {
    expect(() => rmrOrientationInTunnel(set(0, 95), drive)).toThrow(RatingError);
    expect(() => rmrOrientationInTunnel(set(0, -1), drive)).toThrow(/expected 0 to 90/);
  });
});
