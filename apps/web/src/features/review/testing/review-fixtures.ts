import type { RoundReview, SupportClassOption } from '@/features/review/api/review';

// Invented classes and people of an invented project.

export const classes: SupportClassOption[] = [
  { id: 'c-A', code: 'A', name: 'Spot bolts', maxRoundLength: 4, retired: false },
  { id: 'c-B', code: 'B', name: 'Pattern bolts and mesh', maxRoundLength: 3, retired: false },
  { id: 'c-C', code: 'C', name: 'Sprayed concrete and bolts', maxRoundLength: 2, retired: false },
];

export const CAUTION =
  'Roundbook computes and records; the responsible engineer decides under the project’s design and local regulations.';

const allowed = { allowed: true, reason: '' };
const refused = (reason: string) => ({ allowed: false, reason });

/** A submitted round's review as an engineer of the project reads it. */
export function submittedReview(extra: Partial<RoundReview> = {}): RoundReview {
  return {
    roundId: 'r-1',
    status: 'submitted',
    revision: 2,
    version: 7,
    recommendedClassId: 'c-B',
    recommendedRoundLength: 3,
    confirmedClassId: null,
    confirmedRoundLength: null,
    confirmedAt: null,
    confirmation: null,
    decisions: [],
    openComments: [],
    returnComments: [],
    rules: [],
    acceptedRules: [],
    lapsedAcceptances: [],
    canConfirm: allowed,
    canReturn: allowed,
    canCorrect: refused('Only a confirmed round is corrected.'),
    canResolve: true,
    canAcceptConditions: true,
    separationOfDuties: true,
    sincePrevious: null,
    caution: CAUTION,
    ...extra,
  };
}

/** The same round as its geologist reads it, returned with one comment. */
export function returnedReview(): RoundReview {
  return submittedReview({
    status: 'returned',
    revision: 3,
    canConfirm: refused('Only an engineer of the project confirms or returns a round.'),
    canReturn: refused('Only an engineer of the project confirms or returns a round.'),
    openComments: [
      {
        id: 'cm-1',
        section: 'ground',
        text: 'Say where the water comes from.',
        revision: 2,
        authorName: 'Edda Ravenshaw',
        createdAt: '2026-11-30T10:00:00.000Z',
        resolvedAt: null,
        resolvedByName: null,
      },
    ],
  });
}

/** Confirmed with another class than recommended. */
export function confirmedReview(): RoundReview {
  const confirmation = {
    id: 'd-1',
    decision: 'confirm' as const,
    revision: 2,
    classId: 'c-C',
    classCode: 'C',
    roundLength: 2,
    recommendedClassId: 'c-B',
    reason: 'Crown joints open on the left',
    comments: 'Bolt the left shoulder first.',
    signedByName: 'Edda Ravenshaw',
    signedRole: 'engineer',
    signedAt: '2026-11-30T11:15:00.000Z',
  };
  return submittedReview({
    status: 'confirmed',
    confirmedClassId: 'c-C',
    confirmedRoundLength: 2,
    confirmedAt: confirmation.signedAt,
    confirmation,
    decisions: [confirmation],
    canConfirm: refused('Only a submitted round can be confirmed; this one is confirmed.'),
    canReturn: refused('Only a submitted round can be returned; this one is confirmed.'),
    canCorrect: allowed,
  });
}
