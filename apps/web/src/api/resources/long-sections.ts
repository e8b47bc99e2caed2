import { queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /projects/{projectId}/headings/{headingId}/long-section.

export type LongSection = components['schemas']['LongSectionDto'];

export function getLongSection(projectId: string, headingId: string): Promise<LongSection> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/long-section', {
      params: { path: { projectId, headingId } },
    }),
  );
}

/** The heading's rounds along chainage, its hazards and the traces of its faults and shear zones. */
export const longSectionQueryOptions = (projectId: string, headingId: string) =>
  queryOptions({
    queryKey: resourceKeys.headingLongSection(projectId, headingId),
    queryFn: () => getLongSection(projectId, headingId),
  });
