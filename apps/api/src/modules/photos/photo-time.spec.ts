import { exifTakenAt } from './photo-time';

describe('exifTakenAt (EXIF 2.32 DateTimeOriginal / OffsetTimeOriginal)', () => {
  it('uses the offset the camera wrote', () => {
    expect(exifTakenAt('2026:11:30 07:45:12', '+01:00', 'UTC')?.toISOString()).toBe(
      '2026-11-30T06:45:12.000Z',
    );
  });
  it("reads a time without offset in the project's zone, winter and summer", () => {
    expect(exifTakenAt('2026:11:30 07:45:12', undefined, 'Europe/Zurich')?.toISOString()).toBe(
      '2026-11-30T06:45:12.000Z',
    );
    expect(exifTakenAt('2026:07:01 07:45:12', undefined, 'Europe/Zurich')?.toISOString()).toBe(
      '2026-07-01T05:45:12.000Z',
    );
  });
  it('gives null for a blank or impossible value', () => {
    expect(exifTakenAt('0000:00:00 00:00:00', undefined, 'UTC')).toBeNull();
    expect(exifTakenAt('yesterday', undefined, 'UTC')).toBeNull();
    expect(exifTakenAt(undefined, undefined, 'UTC')).toBeNull();
  });
});
