import {
  Button,
  Badge,
  Caption1,
  Field,
  Input,
  ProgressBar,
  Select,
  Text,
  Title3,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  ArrowClockwiseRegular,
  CameraAddRegular,
  ImageAddRegular,
  DeleteRegular,
  PinOffRegular,
  PinRegular,
} from '@fluentui/react-icons';
import { formatProjectTime } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import type { UploadProgress } from '../upload/photo-upload';
import { freshProgress, refuseBeforeUpload, uploadPhoto } from '../upload/photo-upload';
import { PhotoViewer } from './photo-viewer';
import type { FacePart, Photo, PhotoVariant } from '@/api/resources/photos';
import {
  deletePhoto,
  photoKeys,
  photosQueryOptions,
  photoUrlQueryOptions,
  updatePhoto,
} from '@/api/resources/photos';
import { isApiError } from '@/lib/api-client';

/** Parts of the face a photo can show (labels of this screen). */
export const facePartLabels: Record<FacePart, string> = {
  face: 'Face',
  crown: 'Crown',
  'left-wall': 'Left wall',
  'right-wall': 'Right wall',
  invert: 'Invert',
  probe: 'Probe hole',
};

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: '12px', marginTop: '24px' },
  row: { display: 'flex', alignItems: 'center', gap: '8px', flexWrap: 'wrap' },
  touch: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  // A card is as narrow as 180 px: its caption and part-of-face controls take its width (Fluent's input has a
  // minimum width of its own that made it stick out of the card).
  fill: { width: '100%', minWidth: 0, maxWidth: '100%', boxSizing: 'border-box' },
  hidden: { display: 'none' },
  badge: { alignSelf: 'flex-start' },
  uploads: { display: 'flex', flexDirection: 'column', gap: '8px' },
  upload: { display: 'grid', gridTemplateColumns: '1fr auto', gap: '4px 8px', alignItems: 'center' },
  gallery: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(180px, 1fr))',
    gap: '12px',
  },
  card: {
    display: 'flex',
    flexDirection: 'column',
    gap: '6px',
    padding: '8px',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
  },
  thumbButton: {
    padding: 0,
    border: 'none',
    background: 'none',
    cursor: 'zoom-in',
    minHeight: `${TOUCH_TARGET_PX}px`,
  },
  thumb: { width: '100%', height: '140px', objectFit: 'cover', display: 'block' },
});

interface FileUpload {
  key: string;
  file: File;
  progress: UploadProgress;
  status: 'waiting' | 'sending' | 'failed' | 'done';
  error?: string;
}

const percent = (u: FileUpload) => (u.file.size ? Math.min(1, u.progress.sentBytes / u.file.size) : 0);

export interface PhotosSectionProps {
  projectId: string;
  roundId: string;
  /** Geologist or admin of the project, and the round is editable */
  canEdit: boolean;
  /** The project's time zone: times taken are shown in it. */
  timeZone?: string;
  /** "Pin on the sketch": the round page opens the sketch and waits for a tap (absent: no pin button). */
  onPinOnSketch?: (photo: Photo, label: string) => void;
  /** A photo to show in the viewer, asked from outside (a tap on its pin on the sketch); a new `seq` each time. */
  openRequest?: { photoId: string; seq: number } | null;
}

/** Photos of a round: add from the camera or files, a gallery with caption and part, a full-screen view. */
export function PhotosSection({
  projectId,
  roundId,
  canEdit,
  timeZone,
  onPinOnSketch,
  openRequest,
}: PhotosSectionProps) {
  const zone = timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  const styles = useStyles();
  const queryClient = useQueryClient();
  const at = { projectId, roundId };
  const input = useRef<HTMLInputElement>(null);
  const camera = useRef<HTMLInputElement>(null);
  const [uploads, setUploads] = useState<FileUpload[]>([]);
  const [refused, setRefused] = useState<string[]>([]);
  const [viewing, setViewing] = useState<number | null>(null);
  const photos = useQuery(photosQueryOptions(projectId, roundId));
  const list = photos.data ?? [];
  // A request from outside opens its photo once per seq, when the photo is in the list (state adjusted while
  // rendering, React's pattern for state derived from a prop).
  const [handled, setHandled] = useState<number | null>(null);
  if (openRequest && openRequest.seq !== handled) {
    const i = list.findIndex((p) => p.id === openRequest.photoId);
    if (i >= 0) {
      setHandled(openRequest.seq);
      setViewing(i);
    }
  }

  const patch = (key: string, change: Partial<FileUpload>) =>
    setUploads((all) => all.map((u) => (u.key === key ? { ...u, ...change } : u)));

  async function send(u: FileUpload) {
    patch(u.key, { status: 'sending', error: undefined });
    try {
      await uploadPhoto(at, u.file, u.progress, (progress) => patch(u.key, { progress }));
      patch(u.key, { status: 'done' });
      await queryClient.invalidateQueries({ queryKey: photoKeys.ofRound(projectId, roundId) });
    } catch (e) {
      const message = isApiError(e) ? e.message : 'The upload stopped.';
      // A refusal by type or size will not change on retry: that file starts over if added again.
      const final = isApiError(e) && [413, 415].includes(e.status);
      if (final) u.progress = freshProgress();
      patch(u.key, { status: 'failed', error: message, progress: u.progress });
    }
  }

  function pick(files: FileList | null) {
    if (!files) return;
    const reasons: string[] = [];
    const added: FileUpload[] = [];
    for (const file of Array.from(files)) {
      const reason = refuseBeforeUpload(file);
      if (reason) reasons.push(reason);
      else
        added.push({
          key: `${file.name}-${file.size}-${Math.random()}`,
          file,
          progress: freshProgress(),
          status: 'waiting',
        });
    }
    setRefused(reasons);
    setUploads((all) => [...all.filter((u) => u.status !== 'done'), ...added]);
    // One after the other: a slow link gives each file the whole bandwidth.
    void added.reduce<Promise<void>>((chain, u) => chain.then(() => send(u)), Promise.resolve());
    if (input.current) input.current.value = '';
    if (camera.current) camera.current.value = '';
  }

  // The files of the last pick stay listed (done ones as added) until the next pick.
  const active = uploads;
  const batchBytes = active.reduce((s, u) => s + u.file.size, 0);
  const batchSent = active.reduce(
    (s, u) => s + (u.status === 'done' ? u.file.size : u.progress.sentBytes),
    0,
  );

  return (
    <section className={styles.section} aria-labelledby="photos-title">
      <Title3 id="photos-title" as="h2">
        Photos
      </Title3>
      {canEdit && (
        <div className={styles.row}>
          {/* Files (several at once) and, on tablets, the camera: capture alone would hide the files. */}
          <input
            ref={input}
            className={styles.hidden}
            type="file"
            accept="image/*"
            multiple
            aria-label="Photo files"
            onChange={(e) => pick(e.target.files)}
          />
          <input
            ref={camera}
            className={styles.hidden}
            type="file"
            accept="image/*"
            capture="environment"
            aria-label="Camera"
            onChange={(e) => pick(e.target.files)}
          />
          <Button
            className={styles.touch}
            size="large"
            icon={<ImageAddRegular />}
            onClick={() => input.current?.click()}
          >
            Add photos
          </Button>
          <Button
            className={styles.touch}
            size="large"
            icon={<CameraAddRegular />}
            onClick={() => camera.current?.click()}
          >
            Take a photo
          </Button>
          <Caption1>JPEG, PNG, WebP or HEIC, up to 25 MB each.</Caption1>
        </div>
      )}
      {refused.length > 0 && (
        <div role="alert" className={styles.uploads}>
          {refused.map((r) => (
            <Text key={r}>{r} Not sent.</Text>
          ))}
        </div>
      )}
      {active.length > 0 && (
        <div className={styles.uploads}>
          <Field label={`All photos: ${Math.round((batchBytes ? batchSent / batchBytes : 0) * 100)} %`}>
            <ProgressBar aria-label="All photos" value={batchBytes ? batchSent / batchBytes : 0} />
          </Field>
          {active.map((u) => (
            <div key={u.key} className={styles.upload}>
              <Field
                label={`${u.file.name}: ${u.status === 'done' ? 'added' : `${Math.round(percent(u) * 100)} %`}`}
                validationState={u.status === 'failed' ? 'error' : 'none'}
                validationMessage={u.error}
              >
                <ProgressBar
                  aria-label={u.file.name}
                  value={percent(u)}
                  color={u.status === 'failed' ? 'error' : undefined}
                />
              </Field>
              {u.status === 'failed' && (
                <Button
                  className={styles.touch}
                  icon={<ArrowClockwiseRegular />}
                  onClick={() => void send(u)}
                >
                  Try again
                </Button>
              )}
            </div>
          ))}
        </div>
      )}
      {photos.isError && <Text role="alert">The photos could not be loaded. {photos.error.message}</Text>}
      {list.length === 0 && photos.isSuccess && <Text>No photos of this round yet.</Text>}
      <div className={styles.gallery}>
        {list.map((photo, i) => (
          <PhotoCard
            key={photo.id}
            at={at}
            photo={photo}
            canEdit={canEdit}
            timeZone={zone}
            number={i + 1}
            onOpen={() => setViewing(i)}
            onPinOnSketch={onPinOnSketch}
          />
        ))}
      </div>
      {viewing !== null && list[viewing] && (
        <PhotoViewer
          at={at}
          photos={list}
          index={viewing}
          onIndex={setViewing}
          onClose={() => setViewing(null)}
          canEdit={canEdit}
          facePartLabels={facePartLabels}
        />
      )}
    </section>
  );
}

function usePhotoUrl(at: { projectId: string; roundId: string }, photo: Photo, variant: PhotoVariant) {
  return useQuery(photoUrlQueryOptions(at.projectId, at.roundId, photo.id, variant, photo.variantState));
}

function PhotoCard({
  at,
  photo,
  canEdit,
  onOpen,
  timeZone,
  number,
  onPinOnSketch,
}: {
  at: { projectId: string; roundId: string };
  photo: Photo;
  canEdit: boolean;
  timeZone: string;
  /** Its place in the gallery: the number of its pin on the sketch. */
  number: number;
  onOpen: () => void;
  onPinOnSketch?: (photo: Photo, label: string) => void;
}) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  // While the thumbnail is being made the API serves the original at this address.
  const url = usePhotoUrl(at, photo, 'thumbnail');
  const [caption, setCaption] = useState(photo.caption);
  const save = useMutation({
    mutationFn: (body: Parameters<typeof updatePhoto>[2]) => updatePhoto(at, photo.id, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: photoKeys.ofRound(at.projectId, at.roundId) }),
  });
  const remove = useMutation({
    mutationFn: () => deletePhoto(at, photo.id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: photoKeys.ofRound(at.projectId, at.roundId) }),
  });
  const label = photo.caption || photo.originalName;
  return (
    <div className={styles.card}>
      <button type="button" className={styles.thumbButton} onClick={onOpen} aria-label={`Open ${label}`}>
        {url.data ? (
          <img className={styles.thumb} src={url.data.url} alt={label} />
        ) : (
          <div className={styles.thumb} />
        )}
      </button>
      <Caption1>
        {photo.takenAt ? `Taken ${formatProjectTime(photo.takenAt, timeZone)}` : 'Time taken unknown'}
        {photo.uploadedByName ? ` · ${photo.uploadedByName}` : ''}
        {photo.variantState === 'pending' ? ' · thumbnail being made' : ''}
      </Caption1>
      {photo.pinX !== null && (
        <Badge appearance="tint" color="brand" className={styles.badge}>
          {`Pinned on the sketch · ${number}`}
        </Badge>
      )}
      {canEdit && onPinOnSketch && (
        <div className={styles.row}>
          <Button
            className={styles.touch}
            icon={<PinRegular />}
            onClick={() => onPinOnSketch(photo, `${number} · ${label}`)}
          >
            {photo.pinX === null ? 'Pin on the sketch' : 'Move the pin'}
          </Button>
          {photo.pinX !== null && (
            <Button
              className={styles.touch}
              appearance="subtle"
              aria-label={`Remove the pin of ${label}`}
              icon={<PinOffRegular />}
              onClick={() => save.mutate({ pinX: null, pinY: null })}
            />
          )}
        </div>
      )}
      {canEdit ? (
        <>
          <Field label="Caption">
            <Input
              className={styles.fill}
              value={caption}
              maxLength={500}
              onChange={(_e, d) => setCaption(d.value)}
              onBlur={() => caption !== photo.caption && save.mutate({ caption })}
            />
          </Field>
          <Field label="Part of the face">
            <Select
              className={styles.fill}
              value={photo.facePart ?? ''}
              onChange={(_e, d) => save.mutate({ facePart: d.value === '' ? null : (d.value as FacePart) })}
            >
              <option value="">Not given</option>
              {Object.entries(facePartLabels).map(([value, text]) => (
                <option key={value} value={value}>
                  {text}
                </option>
              ))}
            </Select>
          </Field>
          {save.isError && <Caption1 role="alert">{save.error.message}</Caption1>}
          <Button
            className={styles.touch}
            appearance="subtle"
            icon={<DeleteRegular />}
            disabled={remove.isPending}
            onClick={() => remove.mutate()}
          >
            Remove
          </Button>
          {remove.isError && <Caption1 role="alert">{remove.error.message}</Caption1>}
        </>
      ) : (
        <Text>
          {photo.caption || 'No caption'}
          {photo.facePart ? ` · ${facePartLabels[photo.facePart]}` : ''}
        </Text>
      )}
    </div>
  );
}
