import type { AppConfig, CurrentUser, LoginResponse, MailMessage, ProjectSummary } from '@/api/contract';
import type { Session } from '@/lib/session';

// Invented test data: no real project, place, company or person.

export const localConfig: AppConfig = { localMode: true, version: '0.1.0-test' };

export const adminUser: CurrentUser = {
  id: 'u-admin',
  email: 'admin@roundbook.test',
  name: 'Ada Quarrington',
  memberships: [{ projectId: 'p-1', projectName: 'Harrowdale Headrace', role: 'admin' }],
  canCreateProjects: true,
};

export const viewerUser: CurrentUser = {
  id: 'u-viewer',
  email: 'viewer@roundbook.test',
  name: 'Vic Stonebridge',
  memberships: [{ projectId: 'p-1', projectName: 'Harrowdale Headrace', role: 'viewer' }],
  canCreateProjects: true,
};

export const loginAnswer: LoginResponse = {
  accessToken: 'token-admin',
  expiresAt: '2099-01-01T00:00:00.000Z',
  user: { id: adminUser.id, email: adminUser.email, name: adminUser.name },
};

export const adminSession: Session = {
  accessToken: 'token-admin',
  expiresAt: '2099-01-01T00:00:00.000Z',
  user: { id: adminUser.id, email: adminUser.email, name: adminUser.name },
};

export const harrowdale: ProjectSummary = {
  id: 'p-1',
  code: 'HHR',
  name: 'Harrowdale Headrace',
  client: 'Lowmere Water Board',
  timeZone: 'UTC',
  role: 'admin',
  defaultNotation: 'dip-direction/dip',
  qTableEdition: '2015',
  groundScale: 'isrm',
  distributionList: ['site-office@roundbook.test'],
  coordinateGrid: 'Harrowdale site grid',
  handoverAckMinutes: 60,
  separationOfDuties: true,
  version: 3,
  headings: [
    {
      id: 'h-1',
      code: 'HR-U',
      name: 'Upstream drive from Adit 2',
      driveTrend: 47,
      gradientPercent: 0.4,
      startChainage: 1000,
      chainageStyle: 'km+m',
      chainageDecimals: 1,
      stages: ['top-heading', 'bench'],
      profileShape: 'horseshoe',
      profileWidth: 6.2,
      profileHeight: 6.4,
      plannedRoundLength: 3,
      faceChainage: 1250,
      draftFaceChainage: 1253.5,
      lastRoundAt: '2026-11-30T21:40:00Z',
      roundsToConfirm: 2,
      triggerLevel: 'amber',
      lastHandover: {
        sentAt: '2026-11-30T18:05:00Z',
        acknowledgedAt: null,
        ackDueAt: '2026-11-30T19:05:00Z',
        overdue: false,
      },
      supportOutstanding: true,
      confirmedClass: {
        code: 'B',
        roundNumber: 41,
        stage: 'top-heading',
        confirmedAt: '2026-11-30T16:10:00Z',
      },
    },
    {
      id: 'h-2',
      code: 'HR-D',
      name: 'Downstream drive from Adit 2',
      driveTrend: 227,
      gradientPercent: -0.4,
      startChainage: 1000,
      chainageStyle: 'metres',
      chainageDecimals: 1,
      stages: ['full-face'],
      profileShape: 'horseshoe',
      profileWidth: 6.2,
      profileHeight: 6.4,
      plannedRoundLength: 3,
      faceChainage: null,
      draftFaceChainage: null,
      lastRoundAt: null,
      roundsToConfirm: 0,
      triggerLevel: null,
      lastHandover: null,
      supportOutstanding: false,
      confirmedClass: null,
    },
  ],
};

export const mailbox: MailMessage[] = [
  {
    id: 'm-old',
    from: 'roundbook@roundbook.test',
    to: ['night-shift@roundbook.test'],
    subject: 'Handover HR-U, day shift',
    date: '2026-11-30T18:05:00Z',
    text: 'Face at 1+250.0. Two rounds waiting for review.',
    html: null,
    attachments: [],
  },
  {
    id: 'm-new',
    from: 'roundbook@roundbook.test',
    to: ['engineer@roundbook.test', 'site-office@roundbook.test'],
    subject: 'Round 42 submitted on HR-U',
    date: '2026-12-01T06:10:00Z',
    text: 'Round 42 at 1+253.5 is waiting for your review.',
    html: '<p>Round <b>42</b> is waiting.</p><script>parent.alert(1)</script>',
    attachments: [{ index: 0, filename: 'round-42.pdf', contentType: 'application/pdf', size: 48213 }],
  },
];
