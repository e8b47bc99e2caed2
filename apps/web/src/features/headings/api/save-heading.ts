import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateHeadingRequest, Heading, UpdateHeadingRequest } from '@/api/contract';
import { headingKeys } from '@/features/headings/api/get-headings';
import { apiClient, unwrap } from '@/lib/api-client';

export function createHeading(projectId: string, body: CreateHeadingRequest): Promise<Heading> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings', { params: { path: { projectId } }, body }),
  );
}

export function updateHeading(
  projectId: string,
  headingId: string,
  body: UpdateHeadingRequest,
): Promise<Heading> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/headings/{headingId}', {
      params: { path: { projectId, headingId } },
      body,
    }),
  );
}

export function getHeading(projectId: string, headingId: string): Promise<Heading> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}', {
      params: { path: { projectId, headingId } },
    }),
  );
}

export type SaveHeadingInput =
  | { kind: 'create'; body: CreateHeadingRequest }
  | { kind: 'update'; headingId: string; body: UpdateHeadingRequest };

export function useSaveHeading(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...headingKeys.all, projectId, 'save'],
    mutationFn: (input: SaveHeadingInput) =>
      input.kind === 'create'
        ? createHeading(projectId, input.body)
        : updateHeading(projectId, input.headingId, input.body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: headingKeys.list(projectId) }),
  });
}
