import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import type { Photo } from '@/api/resources/photos';
import { photoKeys, photosQueryOptions, updatePhoto } from '@/api/resources/photos';

/** A photo's pin as the sketch draws it: its gallery number, its spot (metres on the face) and a label. */
export interface PhotoPin {
  photoId: string;
  number: number;
  at: [number, number];
  label: string;
}

/** The pins of a round's photos, numbered as in the gallery (oldest first). */
export function pinsOf(photos: Photo[]): PhotoPin[] {
  return photos.flatMap((p, i) =>
    p.pinX !== null && p.pinY !== null
      ? [
          {
            photoId: p.id,
            number: i + 1,
            at: [p.pinX, p.pinY] as [number, number],
            label: p.caption || p.originalName,
          },
        ]
      : [],
  );
}

/**
 * The link between the Photos section and the Sketch: the photos' pins, the photo waiting for one, and
 * placing it (saved on the photo, so the sketch document itself does not change).
 */
export function usePhotoPins(projectId: string, roundId: string) {
  const queryClient = useQueryClient();
  const photos = useQuery(photosQueryOptions(projectId, roundId));
  const [pinning, setPinning] = useState<{ photoId: string; label: string } | null>(null);
  const pins = useMemo(() => pinsOf(photos.data ?? []), [photos.data]);
  const place = useMutation({
    mutationFn: ({ photoId, at }: { photoId: string; at: [number, number] }) =>
      updatePhoto({ projectId, roundId }, photoId, { pinX: at[0], pinY: at[1] }),
    onSuccess: async () => {
      setPinning(null);
      await queryClient.invalidateQueries({ queryKey: photoKeys.ofRound(projectId, roundId) });
    },
  });
  return {
    pins,
    pinning,
    start: (photo: Photo, label: string) => setPinning({ photoId: photo.id, label }),
    cancel: () => setPinning(null),
    place: (photoId: string, at: [number, number]) => place.mutate({ photoId, at }),
    error: place.isError ? place.error.message : null,
  };
}
