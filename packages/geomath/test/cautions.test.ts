import { RATING_CAUTIONS, ratingCaution } from '../src/rock-mass.js';

describe('caution texts for ratings', () => {
  it('cover empirical aids, editions, RQD from Jv and who decides', () => {
    expect(ratingCaution('empirical-aids').text).toMatch(/empirical aids/);
    expect(ratingCaution('editions-differ').text).toMatch(
      /2015 NGI handbook.*Grimstad & Barton 1993.*Bieniawski 1989/,
    );
    expect(ratingCaution('rqd-from-jv').text).toMatch(/correlation/);
    expect(ratingCaution('who-decides').text).toMatch(/responsible engineer and the competent person/);
    expect(ratingCaution('orientation-rule').text).toMatch(/within 30°.*60° or more.*worse/);
  });

  it('have unique ids and non-empty titles', () => {
    const ids = RATING_CAUTIONS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of RATING_CAUTIONS) expect(c.title.length).toBeGreaterThan(5);
  });
});
