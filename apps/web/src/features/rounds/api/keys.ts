import type { RoundSort, RoundStatus, Stage } from '@/features/rounds/api/types';

export interface RoundListFilters {
  page: number;
  pageSize: number;
  sort: RoundSort;
  status?: RoundStatus;
  stage?: Stage;
  fromChainage?: number;
  toChainage?: number;
}

/** Hierarchical keys of the Round screens: one parent key refreshes a whole branch. */
export const roundKeys = {
  all: ['rounds'] as const,
  project: (projectId: string) => [...roundKeys.all, 'project', projectId] as const,
  heading: (projectId: string, headingId: string) =>
    [...roundKeys.project(projectId), 'heading', headingId] as const,
  list: (projectId: string, headingId: string, filters: RoundListFilters) =>
    [...roundKeys.heading(projectId, headingId), 'list', filters] as const,
  next: (projectId: string, headingId: string, stage: Stage) =>
    [...roundKeys.heading(projectId, headingId), 'next', stage] as const,
  nearbyJoints: (projectId: string, headingId: string, from: number, to: number, excludeRoundId: string) =>
    [...roundKeys.heading(projectId, headingId), 'joints', { from, to, excludeRoundId }] as const,
  detail: (projectId: string, roundId: string) =>
    [...roundKeys.project(projectId), 'round', roundId] as const,
  supportClasses: (projectId: string) => [...roundKeys.project(projectId), 'support-classes'] as const,
  projectDetail: (projectId: string) => [...roundKeys.project(projectId), 'detail'] as const,
};
