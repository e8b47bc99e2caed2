/*
 * Query keys of every server resource, written as the resource's path under /api: a project is
 * `['projects', id]`, its support classes `['projects', id, 'support-classes']`. A key is the prefix of
 * everything below it, so invalidating `['projects', id, 'rounds']` reaches every round of the project.
 * Each resource has one key; no feature keeps keys of its own.
 */
import type { components } from '@/api/generated/schema';

type Schemas = components['schemas'];

/** The query of a heading's round page (GET …/headings/{headingId}/rounds). */
export interface RoundListFilters {
  page: number;
  pageSize: number;
  sort: Schemas['RoundSort'];
  status?: Schemas['RoundStatus'];
  stage?: Schemas['Stage'];
  fromChainage?: number;
  toChainage?: number;
}

export interface JointWindow {
  fromChainage: number;
  toChainage: number;
  /** Leave this round out (a round's own set analysis); absent on the heading's Orientation tab. */
  excludeRoundId?: string;
}

export const resourceKeys = {
  currentUser: () => ['auth', 'me'] as const,
  config: () => ['config'] as const,
  /** The person's projects (GET /projects); also the parent of every project's resources. */
  projects: () => ['projects'] as const,
  project: (projectId: string) => ['projects', projectId] as const,
  headings: (projectId: string) => [...resourceKeys.project(projectId), 'headings'] as const,
  heading: (projectId: string, headingId: string) =>
    [...resourceKeys.headings(projectId), headingId] as const,
  /** Parent of a heading's round pages and of its next-round proposals. */
  headingRounds: (projectId: string, headingId: string) =>
    [...resourceKeys.heading(projectId, headingId), 'rounds'] as const,
  roundPage: (projectId: string, headingId: string, filters: RoundListFilters) =>
    [...resourceKeys.headingRounds(projectId, headingId), filters] as const,
  nextRound: (projectId: string, headingId: string, stage: string) =>
    [...resourceKeys.headingRounds(projectId, headingId), 'next', { stage }] as const,
  /** The heading's hazard register (GET …/headings/{headingId}/hazards). */
  headingHazards: (projectId: string, headingId: string) =>
    [...resourceKeys.heading(projectId, headingId), 'hazards'] as const,
  /** The heading's long section (GET …/headings/{headingId}/long-section). */
  headingLongSection: (projectId: string, headingId: string) =>
    [...resourceKeys.heading(projectId, headingId), 'long-section'] as const,
  nearbyJoints: (projectId: string, headingId: string, window: JointWindow) =>
    [...resourceKeys.heading(projectId, headingId), 'joints', window] as const,
  /** Parent of every round of the project (GET /projects/{id}/rounds/{roundId}). */
  rounds: (projectId: string) => [...resourceKeys.project(projectId), 'rounds'] as const,
  round: (projectId: string, roundId: string) => [...resourceKeys.rounds(projectId), roundId] as const,
  /** The round's review (GET /projects/{id}/rounds/{roundId}/review): below the round, so it goes with it. */
  roundReview: (projectId: string, roundId: string) =>
    [...resourceKeys.round(projectId, roundId), 'review'] as const,
  /** The round's support as built (GET /projects/{id}/rounds/{roundId}/support-record): below the round. */
  roundSupportRecord: (projectId: string, roundId: string) =>
    [...resourceKeys.round(projectId, roundId), 'support-record'] as const,
  /** Every frozen revision of a round (GET /projects/{id}/rounds/{roundId}/revisions). */
  roundRevisions: (projectId: string, roundId: string) =>
    [...resourceKeys.round(projectId, roundId), 'revisions'] as const,
  /** The engineer's queue across projects (GET /review/queue), optionally one heading's. */
  reviewQueueAll: () => ['review', 'queue'] as const,
  reviewQueue: (headingId: string | null) => [...resourceKeys.reviewQueueAll(), { headingId }] as const,
  supportClasses: (projectId: string) => [...resourceKeys.project(projectId), 'support-classes'] as const,
  triggerRules: (projectId: string) => [...resourceKeys.project(projectId), 'trigger-rules'] as const,
  team: (projectId: string) => [...resourceKeys.project(projectId), 'team'] as const,
  /** The signed-in person's notice choice in a project (GET /projects/{id}/notice-settings). */
  noticeSettings: (projectId: string) => [...resourceKeys.project(projectId), 'notice-settings'] as const,
  invitation: (token: string) => ['invitations', token] as const,
  /** Handovers addressed to the signed-in person, across projects (GET /handovers/received). */
  receivedHandovers: () => ['handovers', 'received'] as const,
  /** A heading's handovers (GET …/headings/{headingId}/handovers). */
  headingHandovers: (projectId: string, headingId: string) =>
    [...resourceKeys.heading(projectId, headingId), 'handovers'] as const,
};
