import { isCalendarDate } from './calendar-date';

describe('isCalendarDate (issue 18, item 4: impossible dates were stored and read back as 1899-11-30)', () => {
  it('takes real dates and refuses impossible ones', () => {
    expect(['2026-11-30', '2028-02-29', '1900-01-01'].map(isCalendarDate)).toEqual([true, true, true]);
    expect(
      ['2026-02-30', '0000-00-00', '2027-02-29', '2026-13-01', '26-11-30', '2026-11-30T00:00', 20261130].map(
        isCalendarDate,
      ),
    ).toEqual([false, false, false, false, false, false, false]);
  });
});
