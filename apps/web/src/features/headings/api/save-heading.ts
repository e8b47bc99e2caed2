import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateHeadingRequest, UpdateHeadingRequest } from '@/api/contract';
import { createHeading, headingSaved, updateHeading } from '@/api/resources/headings';
import { resourceKeys } from '@/api/resources/keys';

export type SaveHeadingInput =
  | { kind: 'create'; body: CreateHeadingRequest }
  | { kind: 'update'; headingId: string; body: UpdateHeadingRequest };

export function useSaveHeading(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.headings(projectId), 'save'],
    mutationFn: (input: SaveHeadingInput) =>
      input.kind === 'create'
        ? createHeading(projectId, input.body)
        : updateHeading(projectId, input.headingId, input.body),
    onSuccess: (heading) => headingSaved(queryClient, projectId, heading),
  });
}
