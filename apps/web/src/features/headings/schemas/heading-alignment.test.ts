import { emptyHeadingValues, parseSegments, segmentsText, toHeadingRequest } from './heading.schema';

const filled = {
  ...emptyHeadingValues,
  code: 'KT-S',
  name: 'Southern drive',
  startChainage: '0+980.0',
  driveTrend: '227',
  profileWidth: '6.2',
  profileHeight: '6.4',
  axisHeight: '3.2',
  plannedRoundLength: '3',
};

describe('heading alignment fields (issue 10, items 9–10)', () => {
  it('reads one segment a line: a straight by its length, an arc by length, radius and side [common practice of route surveying]', () => {
    expect(parseSegments('120\n80 300 right\n\n 40,5 150 LEFT ')).toEqual([
      { length: 120, radius: null, side: null },
      { length: 80, radius: 300, side: 'right' },
      { length: 40.5, radius: 150, side: 'left' },
    ]);
    expect(() => parseSegments('80 300')).toThrow('Line 1: an arc is its length, radius');
    expect(segmentsText(parseSegments('120\n80 300 right'))).toBe('120\n80 300 right');
  });

  it('sends the chainage sense, the segments and the bench line with the heading', () => {
    const body = toHeadingRequest({
      ...filled,
      chainageSense: 'decreasing',
      alignmentSegments: '120\n80 300 right',
      benchHeight: '3.5',
    });
    expect(body).toMatchObject({
      chainageSense: 'decreasing',
      initialBearing: null,
      benchHeight: 3.5,
      alignmentSegments: [
        { length: 120, radius: null, side: null },
        { length: 80, radius: 300, side: 'right' },
      ],
    });
  });

  it('refuses a bench line at or above the crown', () => {
    expect(() => toHeadingRequest({ ...filled, benchHeight: '6.4' })).toThrow('must lie below the crown');
  });
});
