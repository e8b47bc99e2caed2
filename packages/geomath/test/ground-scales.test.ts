import { isGrade, STRENGTH_GRADES, WEATHERING_GRADES } from '../src/index.js';

describe('ground description scales', () => {
  it('has six weathering grades and seven strength grades on each scale (ISRM 1981; ISO 14689:2017 — from memory)', () => {
    for (const scale of ['isrm', 'iso-14689'] as const) {
      expect(WEATHERING_GRADES[scale]).toHaveLength(6);
      expect(STRENGTH_GRADES[scale]).toHaveLength(7);
    }
  });

  it('uses contiguous strength bands from 0.25 MPa up, ending open (from memory)', () => {
    const bands = STRENGTH_GRADES.isrm.map((r) => r.ucsMPa!);
    expect(bands[0][0]).toBe(0.25);
    for (let i = 1; i < bands.length; i++) expect(bands[i][0]).toBe(bands[i - 1][1]);
    expect(bands.at(-1)![1]).toBe(Infinity);
    expect(STRENGTH_GRADES.isrm.find((r) => r.code === 'R3')!.ucsMPa).toEqual([25, 50]);
  });

  it('keeps the scales apart: a code of one scale is not a code of the other', () => {
    expect(isGrade('isrm', 'weathering', 'WII')).toBe(true);
    expect(isGrade('iso-14689', 'weathering', 'WII')).toBe(false);
    expect(isGrade('iso-14689', 'strength', 'strong')).toBe(true);
    expect(isGrade('isrm', 'strength', 'strong')).toBe(false);
  });
});
