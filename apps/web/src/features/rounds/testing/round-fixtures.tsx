import { FluentProvider } from '@fluentui/react-components';
import { emptyGround } from '@roundbook/domain';
import { roundbookLightTheme } from '@roundbook/ui';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';
import type { HeadingDetail, ProjectDetail, Round, SupportClass } from '@/features/rounds/api/types';

// Invented test data for the Round screens: no real project, place or person.

// jsdom has no ResizeObserver; Fluent's MessageBar measures itself with one.
class NoResizeObserver {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
}
if (typeof window !== 'undefined' && !('ResizeObserver' in window)) {
  Object.assign(window, { ResizeObserver: NoResizeObserver });
}

export const project: ProjectDetail = {
  id: 'p-1',
  code: 'HHR',
  name: 'Harrowdale Headrace',
  client: 'Lowmere Water Board',
  timeZone: 'UTC',
  role: 'geologist',
  defaultNotation: 'dip-direction/dip',
  qTableEdition: '2015',
  groundScale: 'isrm',
  distributionList: [],
  handoverAckMinutes: 60,
  separationOfDuties: true,
  coordinateGrid: 'Harrowdale site grid',
  version: 1,
  headings: [],
};

export const heading: HeadingDetail = {
  id: 'h-1',
  projectId: 'p-1',
  code: 'HR-U',
  name: 'Upstream drive from Adit 2',
  chainageStyle: 'km+m',
  chainageDecimals: 1,
  startChainage: 1000,
  driveTrend: 47,
  gradientPercent: 0.4,
  profileShape: 'horseshoe',
  profileWidth: 6.2,
  profileHeight: 6.4,
  axisHeight: 3.2,
  plannedRoundLength: 3,
  stages: ['full-face'],
  startEasting: null,
  startNorthing: null,
  startElevation: null,
  version: 1,
};

const supportClass = (code: string, sortOrder: number, extra: Partial<SupportClass>): SupportClass => ({
  id: `c-${code}`,
  code,
  name: `Class ${code}`,
  sortOrder,
  qMin: null,
  qMax: null,
  rmrMin: null,
  rmrMax: null,
  maxRoundLength: 3,
  boltType: 'Grouted rebar',
  boltLength: 3,
  boltPattern: '1.5 × 1.5 m',
  shotcreteMm: 50,
  steelSupport: '',
  probingRequired: false,
  notes: '',
  retired: false,
  version: 1,
  ...extra,
});

export const supportClasses: SupportClass[] = [
  supportClass('A', 1, { qMin: 10, rmrMin: 65, maxRoundLength: 4 }),
  supportClass('B', 2, { qMin: 1, qMax: 10, rmrMin: 44, rmrMax: 64, maxRoundLength: 3.5 }),
  supportClass('C', 3, { qMin: 0.1, qMax: 1, maxRoundLength: 2.5 }),
  supportClass('OLD', 4, { retired: true }),
];

const emptyRating = { value: null, label: null, error: null, parts: {} };

export const draftRound: Round = {
  id: 'r-1',
  headingId: 'h-1',
  stage: 'full-face',
  roundNumber: 42,
  faceChainage: 1253.5,
  previousChainage: 1250,
  roundLength: 3.5,
  shiftDate: '2026-12-01',
  shift: 'day',
  sketch: null,
  mappedBy: 'u-geo',
  mappedByName: 'Gale Tremlow',
  mappedAt: '2026-12-01T08:15:00Z',
  distantParts: '',
  ground: emptyGround(),
  joints: [],
  qInput: null,
  rmrInput: null,
  gsiObserved: null,
  recommendedClassId: null,
  nextRoundLength: null,
  recommendationReason: '',
  status: 'draft',
  triggerLevel: null,
  triggerFirings: [],
  submittedAt: null,
  confirmedClassId: null,
  confirmedRoundLength: null,
  inflowPer10m: null,
  revision: 1,
  ratings: { q: emptyRating, rmr: emptyRating, gsi: emptyRating },
  suggestedClassIds: [],
  warnings: ['The round length 3.5 m is over the planned 3 m.'],
  plannedRoundLength: 3,
  setParameters: { windowM: 25, count: null },
  triggersNotEvaluated: [],
  triggersWaiting: [],
  assessment: {},
  assessmentVersion: 'domain-1',
  version: 3,
};

export function renderWithProviders(ui: ReactElement) {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });
  return render(
    <FluentProvider theme={roundbookLightTheme}>
      <QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>
    </FluentProvider>,
  );
}
