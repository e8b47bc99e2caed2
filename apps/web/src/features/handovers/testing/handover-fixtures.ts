import type { Handover, HandoverDraft } from '@/features/handovers/api/handovers';

// Invented handovers of an invented project, as the API sends them.

export const CAUTION =
  'This handover supports the face-to-face briefing at shift change and does not replace it. The competent person on site decides whether the ground is safe to enter; nobody enters unsupported ground.';

type DraftHeading = HandoverDraft['headings'][number];

/** One heading as the draft gives it: a face, a confirmed round, a red wedge, bolts outstanding, an alert. */
export const draftHeading = (over: Partial<DraftHeading> = {}): DraftHeading => ({
  headingId: 'h-1',
  code: 'HR-U',
  name: 'Upstream drive from Adit 2',
  chainageStyle: 'km+m',
  chainageDecimals: 1,
  faceChainage: 1006,
  stage: 'full-face',
  lastRoundNumber: 2,
  lastConfirmed: {
    roundId: 'r-1',
    roundNumber: 1,
    stage: 'full-face',
    faceChainage: 1003,
    classId: 'c-1',
    classCode: 'C1',
    className: 'Spot bolts',
    nextRoundLength: 3,
    confirmedAt: '2026-12-03T10:00:00.000Z',
  },
  triggerLevel: 'amber',
  lookAhead: [
    {
      label: 'Fault 1',
      roundNumber: 2,
      crownChainage: 1007.7,
      invertChainage: 1002.3,
      crownAhead: 1.7,
      invertAhead: -3.7,
      firstAt: 'crown',
      nearestAhead: 1.7,
      roundsAhead: 1,
      traceKnown: true,
    },
  ],
  lookAheadRoundLength: 3,
  alerts: [{ level: 'amber', summary: 'Q below 20', action: 'Tell the engineer.', ownerRole: 'engineer' }],
  hazards: [
    {
      id: 'z-1',
      kind: 'wedge',
      fromChainage: 1004,
      toChainage: 1006,
      level: 'red',
      description: 'Invented wedge in the right shoulder',
    },
  ],
  supportOutstanding: ['Round 7 (full face, class C2): Rock bolts — planned 3 m bolts; nothing recorded'],
  cycleStage: null,
  notes: '',
  ...over,
});

export const draft = (over: Partial<HandoverDraft> = {}): HandoverDraft => ({
  headings: [draftHeading()],
  shiftDate: '2026-12-03',
  shift: 'day',
  supervisors: [{ userId: 'u-in', name: 'Invented Incoming', email: 'in@roundbook.test' }],
  distributionList: ['office@roundbook.test'],
  caution: CAUTION,
  ...over,
});

/** A sent handover of HR-U, waiting for the incoming supervisor (due an hour after it was sent). */
export const handover = (over: Partial<Handover> = {}): Handover => ({
  id: 'ho-1',
  projectId: 'p-1',
  projectName: 'Invented headrace',
  timeZone: 'UTC',
  shiftDate: '2026-12-03',
  shift: 'night',
  status: 'sent',
  outgoing: { userId: 'u-out', name: 'Invented Outgoing', email: 'out@roundbook.test' },
  incoming: { userId: 'u-in', name: 'Invented Incoming', email: 'in@roundbook.test' },
  headings: [draftHeading({ cycleStage: 'mucking', notes: 'Scaling done at the crown.' })],
  generalNotes: '',
  recipients: ['in@roundbook.test'],
  emailStatus: 'sent',
  pdfReady: true,
  sentAt: '2026-12-03T17:55:00.000Z',
  ackDueAt: '2026-12-03T18:55:00.000Z',
  overdue: false,
  overdueNotified: false,
  acknowledgedAt: null,
  acknowledgedBy: null,
  acknowledgeComment: null,
  caution: CAUTION,
  ...over,
});

/** The same handover once the incoming supervisor acknowledged it. */
export const acknowledged = (over: Partial<Handover> = {}): Handover =>
  handover({
    status: 'acknowledged',
    acknowledgedAt: '2026-12-03T18:02:00.000Z',
    acknowledgedBy: { userId: 'u-in', name: 'Invented Incoming', email: 'in@roundbook.test' },
    ...over,
  });
