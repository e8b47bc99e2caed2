import { useQuery } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { nearbyJointsQueryOptions, roundsQueryOptions } from '@/api/resources/rounds';

export type WindowJoint = components['schemas']['NearbyJointDto'];

/** The API answers at most this many joints for one window (the newest faces first). */
export const WINDOW_JOINT_LIMIT = 5000;

/** Readable joints of a heading between two chainages (GET …/headings/{headingId}/joints). */
export function useWindowJoints(
  projectId: string,
  headingId: string,
  window: { fromChainage: number; toChainage: number } | null,
) {
  return useQuery({
    ...nearbyJointsQueryOptions(projectId, headingId, window ?? { fromChainage: 0, toChainage: 0 }),
    enabled: window !== null,
  });
}

/**
 * The chainages of the heading's mapped faces: the lowest and highest face chainage of its rounds (two
 * one-row pages of the rounds list), or null when no round is mapped yet.
 */
export function useMappedExtent(projectId: string, headingId: string) {
  const base = { page: 1, pageSize: 1 } as const;
  const low = useQuery(roundsQueryOptions(projectId, headingId, { ...base, sort: 'faceChainage' }));
  const high = useQuery(roundsQueryOptions(projectId, headingId, { ...base, sort: '-faceChainage' }));
  const a = low.data?.items[0]?.faceChainage;
  const b = high.data?.items[0]?.faceChainage;
  return {
    isPending: low.isPending || high.isPending,
    error: low.error ?? high.error,
    extent: a === undefined || b === undefined ? null : { from: a, to: b },
  };
}
