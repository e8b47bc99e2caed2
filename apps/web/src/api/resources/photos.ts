import { queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/rounds/{roundId}/photos, POST …/{photoId}/complete, PATCH/DELETE …/{photoId},
// GET …/{photoId}/url, DELETE …/{photoId}/upload. Parts (PUT …/parts/{n}) go by XHR for their progress.

type Schemas = components['schemas'];
export type Photo = Schemas['PhotoDto'];
export type PhotoUpload = Schemas['PhotoUploadDto'];
export type PhotoVariant = Schemas['PhotoVariant'];
export type FacePart = Schemas['FacePart'];

export const photoKeys = {
  ofRound: (projectId: string, roundId: string) =>
    ['projects', projectId, 'rounds', roundId, 'photos'] as const,
  url: (projectId: string, roundId: string, photoId: string, variant: PhotoVariant) =>
    ['projects', projectId, 'rounds', roundId, 'photos', photoId, 'url', variant] as const,
};

interface RoundPath {
  projectId: string;
  roundId: string;
}

export function getPhotos(projectId: string, roundId: string): Promise<Photo[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/photos', {
      params: { path: { projectId, roundId } },
    }),
  );
}

export const photosQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: photoKeys.ofRound(projectId, roundId),
    queryFn: () => getPhotos(projectId, roundId),
    // Poll while a thumbnail is being made, so the gallery swaps the original for it.
    refetchInterval: (query) => (query.state.data?.some((p) => p.variantState === 'pending') ? 3000 : false),
  });

export function getPhotoUrl(
  projectId: string,
  roundId: string,
  photoId: string,
  variant: PhotoVariant,
): Promise<Schemas['PhotoUrlDto']> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/url', {
      params: { path: { projectId, roundId, photoId }, query: { variant } },
    }),
  );
}

export const photoUrlQueryOptions = (
  projectId: string,
  roundId: string,
  photoId: string,
  variant: PhotoVariant,
  variantState: Photo['variantState'],
) =>
  queryOptions({
    // The state is part of the key: once the thumbnail is made, a new address is asked for.
    queryKey: [...photoKeys.url(projectId, roundId, photoId, variant), variantState],
    queryFn: () => getPhotoUrl(projectId, roundId, photoId, variant),
    // Signed addresses live five minutes; ask again before that.
    staleTime: 4 * 60_000,
  });

export function startPhotoUpload(at: RoundPath, body: Schemas['CreatePhotoUploadDto']): Promise<PhotoUpload> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/photos', {
      params: { path: at },
      body,
    }),
  );
}

export function completePhotoUpload(
  at: RoundPath,
  photoId: string,
  body: Schemas['CompletePhotoUploadDto'],
): Promise<Photo> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/complete', {
      params: { path: { ...at, photoId } },
      body,
    }),
  );
}

export function updatePhoto(at: RoundPath, photoId: string, body: Schemas['UpdatePhotoDto']): Promise<Photo> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/rounds/{roundId}/photos/{photoId}', {
      params: { path: { ...at, photoId } },
      body,
    }),
  );
}

export function deletePhoto(at: RoundPath, photoId: string): Promise<void> {
  return unwrap(
    apiClient.DELETE('/api/projects/{projectId}/rounds/{roundId}/photos/{photoId}', {
      params: { path: { ...at, photoId } },
    }),
  );
}

/** The address a part is PUT to (raw bytes, outside the JSON contract). */
export const photoPartPath = (at: RoundPath, photoId: string, partNumber: number): string =>
  `/api/projects/${at.projectId}/rounds/${at.roundId}/photos/${photoId}/parts/${partNumber}`;
