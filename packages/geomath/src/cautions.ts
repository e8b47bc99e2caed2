/**
 * Caution texts that go with every rating, screen and look-ahead result. The UI shows them next to the
 * numbers and on the PDF; they are never hidden (product.md, "Cautions").
 */
export type RatingCautionId =
  | 'empirical-aids'
  | 'editions-differ'
  | 'rqd-from-jv'
  | 'who-decides'
  | 'orientation-rule'
  | 'kinematic-screen'
  | 'look-ahead';

export interface RatingCaution {
  readonly id: RatingCautionId;
  readonly title: string;
  readonly text: string;
}

export const RATING_CAUTIONS: readonly RatingCaution[] = [
  {
    id: 'empirical-aids',
    title: 'Ratings are empirical aids',
    text:
      'Q, RMR89, GSI and the support relations are empirical aids built from case histories. They have known ' +
      'limits, depend on judgement at the face and do not by themselves prove that any support is adequate.',
  },
  {
    id: 'editions-differ',
    title: 'Table editions differ',
    text:
      'The Q and RMR tables have been revised over the years and different editions give different values for ' +
      'some rows. Roundbook uses Q as in the 2015 NGI handbook (following Grimstad & Barton 1993) and RMR89 as in ' +
      'Bieniawski 1989; quote the edition with every rating.',
  },
  {
    id: 'rqd-from-jv',
    title: 'RQD from Jv is a correlation',
    text:
      'An RQD estimated from the volumetric joint count Jv is a correlation (Palmström 1982 or 2005), not a core ' +
      'measurement. It is clipped to 0–100 and should be marked as estimated wherever it is used.',
  },
  {
    id: 'who-decides',
    title: 'The responsible engineer and the competent person decide',
    text:
      'Roundbook computes, records, flags and passes on information. It does not approve ground support or ' +
      'declare ground safe. The responsible engineer and the competent person on site decide, under the ' +
      "project's design, the contract and local regulations and codes of practice. Nobody enters unsupported ground.",
  },
  {
    id: 'orientation-rule',
    title: 'Parallel and perpendicular are a Roundbook choice',
    text:
      "Bieniawski's orientation table gives no angular tolerance. Roundbook treats a set whose strike is within 30° " +
      'of the tunnel axis as parallel, 60° or more as perpendicular, and takes the worse of the two ratings in between.',
  },
  {
    id: 'kinematic-screen',
    title: 'Kinematic screens are screens',
    text:
      'A kinematic flag says that the geometry allows a block to move; it does not say that the block exists, how ' +
      'large it is, or that it will move. Persistence, spacing, water and the real friction angle decide that.',
  },
  {
    id: 'look-ahead',
    title: 'Look-ahead assumes a planar feature',
    text:
      'Crossings ahead of the face extend the mapped plane as a flat plane. Real faults and joints bend, split and ' +
      'end; probe ahead where the crossing matters.',
  },
];

/** The caution with the given id. */
export function ratingCaution(id: RatingCautionId): RatingCaution {
  const found = RATING_CAUTIONS.find((c) => c.id === id);
  if (found === undefined) throw new RangeError(`No caution with id ${id}`);
  return found;
}
