import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { headingQueryOptions } from '@/api/resources/headings';
import type { RoundListFilters } from '@/api/resources/keys';
import { projectQueryOptions } from '@/api/resources/projects';
import { nearbyJointsQueryOptions, roundQueryOptions, roundsQueryOptions } from '@/api/resources/rounds';
import { supportClassesQueryOptions } from '@/api/resources/support-classes';
import { triggerRulesQueryOptions } from '@/api/resources/trigger-rules';

// What the Round screens read. Each is the one entry of its resource (the same cache entry Setup and
// the Board use), so a change made elsewhere shows here.

export function useRound(projectId: string, roundId: string) {
  return useSuspenseQuery(roundQueryOptions(projectId, roundId));
}

export function useRounds(projectId: string, headingId: string, filters: RoundListFilters) {
  return useQuery(roundsQueryOptions(projectId, headingId, filters));
}

/** The project a round is read against: notation, ground scale, time zone. */
export function useRoundProject(projectId: string) {
  return useSuspenseQuery(projectQueryOptions(projectId));
}

/** The heading a round is read against: drive, chainage style, planned round length. */
export function useRoundHeading(projectId: string, headingId: string) {
  return useSuspenseQuery(headingQueryOptions(projectId, headingId));
}

/** The project's support classes, as the Support section offers them. */
export function useRoundSupportClasses(projectId: string) {
  return useSuspenseQuery(supportClassesQueryOptions(projectId));
}

/** Readable joints of the heading's earlier rounds within `distance` of the face (none at 0). */
export function useNearbyJoints(
  projectId: string,
  headingId: string,
  window: { fromChainage: number; toChainage: number; excludeRoundId: string },
  enabled: boolean,
) {
  return useQuery({ ...nearbyJointsQueryOptions(projectId, headingId, window), enabled });
}

/** The project's trigger rules, for the trigger level worked out live (the last save's level until read). */
export function useRoundTriggerRules(projectId: string) {
  return useQuery(triggerRulesQueryOptions(projectId));
}
