import {
  Button,
  Caption1,
  Dialog,
  DialogBody,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  Text,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  ChevronLeftRegular,
  ChevronRightRegular,
  DismissRegular,
  RulerRegular,
  ZoomInRegular,
  ZoomOutRegular,
} from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import type { PhotoPoint } from '../utils/scale-bar';
import { scaleBarOf } from '../utils/scale-bar';
import type { Pt, View } from '../utils/viewer-gestures';
import {
  FIT,
  TAP_PX,
  clampView,
  doubleTap,
  isDoubleTap,
  pinch,
  swipeStep,
  zoomAbout,
} from '../utils/viewer-gestures';
import type { FacePart, Photo } from '@/api/resources/photos';
import { photoKeys, photoUrlQueryOptions, updatePhoto } from '@/api/resources/photos';

const useStyles = makeStyles({
  surface: {
    maxWidth: '100vw',
    width: '100vw',
    height: '100vh',
    maxHeight: '100vh',
    padding: '8px',
    borderRadius: 0,
  },
  body: { display: 'flex', flexDirection: 'column', height: '100%', gap: '8px' },
  touch: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  row: { display: 'flex', alignItems: 'center', gap: '8px', flexWrap: 'wrap' },
  head: { display: 'flex', alignItems: 'center', gap: '8px' },
  title: { flexGrow: 1, overflow: 'hidden', textOverflow: 'ellipsis', whiteSpace: 'nowrap' },
  stage: {
    position: 'relative',
    flexGrow: 1,
    minHeight: 0,
    overflow: 'hidden',
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: tokens.colorNeutralBackground3,
    // The viewer handles every gesture itself: no page scroll or browser zoom on the photo.
    touchAction: 'none',
    userSelect: 'none',
  },
  marking: { cursor: 'crosshair' },
  frame: { position: 'relative', lineHeight: 0, transformOrigin: 'center center' },
  image: {
    display: 'block',
    maxWidth: 'calc(100vw - 16px)',
    maxHeight: 'calc(100vh - 190px)',
    pointerEvents: 'none',
  },
  mark: {
    position: 'absolute',
    width: '14px',
    height: '14px',
    marginLeft: '-7px',
    marginTop: '-7px',
    borderRadius: '50%',
    border: `2px solid ${tokens.colorNeutralForegroundInverted}`,
    backgroundColor: tokens.colorPaletteRedBackground3,
    boxSizing: 'border-box',
  },
  bar: {
    position: 'absolute',
    left: '4%',
    bottom: '4%',
    display: 'flex',
    flexDirection: 'column',
    gap: '2px',
  },
  barLine: {
    height: '8px',
    backgroundColor: tokens.colorNeutralForegroundInverted,
    border: `2px solid ${tokens.colorNeutralForeground1}`,
  },
  barLabel: {
    lineHeight: '20px',
    alignSelf: 'flex-start',
    padding: '0 4px',
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorNeutralForeground1,
  },
});

/** Labels of the parts of the face, from the section. */
export type FacePartLabels = Record<FacePart, string>;

export interface PhotoViewerProps {
  at: { projectId: string; roundId: string };
  photos: Photo[];
  index: number;
  onIndex: (i: number) => void;
  onClose: () => void;
  /** The geologist of an editable round may mark a scale. */
  canEdit: boolean;
  facePartLabels: FacePartLabels;
}

type Marking = { points: PhotoPoint[]; distance: string } | null;

/** The full-screen viewer: swipe or buttons or arrow keys between photos, pinch or double tap to zoom, a scale. */
export function PhotoViewer({
  at,
  photos,
  index,
  onIndex,
  onClose,
  canEdit,
  facePartLabels,
}: PhotoViewerProps) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const photo = photos[index];
  const url = useQuery(
    photoUrlQueryOptions(at.projectId, at.roundId, photo.id, 'display', photo.variantState),
  );
  const stage = useRef<HTMLDivElement>(null);
  const image = useRef<HTMLImageElement>(null);
  const [view, setView] = useState<View>(FIT);
  const [marking, setMarking] = useState<Marking>(null);
  const [natural, setNatural] = useState<{ w: number; h: number } | null>(null);
  const pointers = useRef(new Map<number, Pt>());
  const gesture = useRef<{ start: View; from: Map<number, Pt>; pinched: boolean } | null>(null);
  const lastTap = useRef<{ t: number; at: Pt } | null>(null);

  // A new photo opens at fit, with no marks (state adjusted while rendering, as React advises).
  const [shown, setShown] = useState(photo.id);
  if (shown !== photo.id) {
    setShown(photo.id);
    setView(FIT);
    setMarking(null);
    setNatural(null);
  }

  const save = useMutation({
    mutationFn: (scale: Parameters<typeof updatePhoto>[2]['scale']) => updatePhoto(at, photo.id, { scale }),
    onSuccess: async () => {
      endMarking();
      await queryClient.invalidateQueries({ queryKey: photoKeys.ofRound(at.projectId, at.roundId) });
    },
  });

  // The buttons of the marking go away with it: the focus goes to the photo, so the keys (Escape, arrows) still reach the viewer.
  const endMarking = () => {
    setMarking(null);
    stage.current?.focus();
  };

  const go = (step: number) => {
    if (photos.length > 1) onIndex((index + step + photos.length) % photos.length);
  };
  const stageSize = () => {
    const r = stage.current?.getBoundingClientRect();
    return { width: r?.width ?? 0, height: r?.height ?? 0 };
  };
  const fromCentre = (p: Pt): Pt => {
    const r = stage.current?.getBoundingClientRect();
    return r ? { x: p.x - (r.left + r.width / 2), y: p.y - (r.top + r.height / 2) } : p;
  };
  const apply = (v: View) => setView(clampView(v, stageSize()));

  /** A tap on the photo while marking: the point as fractions of the (zoomed) photo's box. */
  function markAt(p: Pt) {
    const r = image.current?.getBoundingClientRect();
    if (!r || !r.width || !r.height || !marking || marking.points.length >= 2) return;
    const x = (p.x - r.left) / r.width;
    const y = (p.y - r.top) / r.height;
    if (x < 0 || x > 1 || y < 0 || y > 1) return;
    const round = (v: number) => Math.round(v * 10000) / 10000;
    setMarking({ ...marking, points: [...marking.points, { x: round(x), y: round(y) }] });
  }

  function onPointerDown(e: React.PointerEvent) {
    pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
    try {
      stage.current?.setPointerCapture(e.pointerId);
    } catch {
      // a synthetic pointer cannot be captured; the stage still gets its moves
    }
    gesture.current = {
      start: view,
      from: new Map(pointers.current),
      pinched: (gesture.current?.pinched ?? false) || pointers.current.size > 1,
    };
  }

  function onPointerMove(e: React.PointerEvent) {
    if (!pointers.current.has(e.pointerId) || !gesture.current) return;
    pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
    const g = gesture.current;
    const ids = [...g.from.keys()];
    if (ids.length >= 2 && pointers.current.size >= 2) {
      const [a, b] = ids;
      const from: [Pt, Pt] = [fromCentre(g.from.get(a)!), fromCentre(g.from.get(b)!)];
      const to: [Pt, Pt] = [fromCentre(pointers.current.get(a)!), fromCentre(pointers.current.get(b)!)];
      apply(pinch(g.start, from, to));
    } else if (ids.length === 1 && g.start.zoom > 1.01) {
      const start = g.from.get(ids[0])!;
      apply({ ...g.start, x: g.start.x + e.clientX - start.x, y: g.start.y + e.clientY - start.y });
    }
  }

  function onPointerUp(e: React.PointerEvent) {
    const g = gesture.current;
    const start = g?.from.get(e.pointerId);
    pointers.current.delete(e.pointerId);
    if (pointers.current.size > 0) {
      // one finger of a pinch lifted: the other carries on as a pan from here
      gesture.current = { start: view, from: new Map(pointers.current), pinched: true };
      return;
    }
    gesture.current = null;
    if (!g || !start || g.pinched) return;
    const dx = e.clientX - start.x;
    const dy = e.clientY - start.y;
    if (Math.hypot(dx, dy) < TAP_PX) {
      const p = { x: e.clientX, y: e.clientY };
      if (marking) return markAt(p);
      const now = e.timeStamp || Date.now();
      if (isDoubleTap(lastTap.current, now, p)) {
        lastTap.current = null;
        apply(doubleTap(view, fromCentre(p)));
      } else lastTap.current = { t: now, at: p };
      return;
    }
    const step = swipeStep(dx, dy, view.zoom);
    if (step !== 0) go(step);
  }

  const aspect =
    photo.width && photo.height ? photo.width / photo.height : natural ? natural.w / natural.h : null;
  const bar = aspect ? scaleBarOf(photo.scale, aspect) : null;
  const label = photo.caption || photo.originalName;
  const distance = marking ? Number(marking.distance.replace(',', '.')) : NaN;

  return (
    <Dialog open onOpenChange={(_e, d) => !d.open && onClose()}>
      <DialogSurface
        className={styles.surface}
        onKeyDown={(e) => {
          if ((e.target as HTMLElement).tagName === 'INPUT') return;
          if (e.key === 'ArrowRight') go(1);
          if (e.key === 'ArrowLeft') go(-1);
          if (e.key === '+' || e.key === '=') apply(zoomAbout(view, view.zoom * 1.5, { x: 0, y: 0 }));
          if (e.key === '-') apply(zoomAbout(view, view.zoom / 1.5, { x: 0, y: 0 }));
        }}
      >
        <DialogBody className={styles.body}>
          {/* Title and Close on one row (the body is a column here, not the dialog's own grid). */}
          <div className={styles.head}>
            <DialogTitle className={styles.title}>{label}</DialogTitle>
            <Button
              className={styles.touch}
              appearance="subtle"
              aria-label="Close"
              icon={<DismissRegular />}
              onClick={onClose}
            />
          </div>
          <div
            ref={stage}
            className={`${styles.stage} ${marking ? styles.marking : ''}`}
            data-testid="photo-stage"
            tabIndex={-1}
            onPointerDown={onPointerDown}
            onPointerMove={onPointerMove}
            onPointerUp={onPointerUp}
            onPointerCancel={(e) => {
              pointers.current.delete(e.pointerId);
              gesture.current = null;
            }}
          >
            <div
              className={styles.frame}
              style={{ transform: `translate(${view.x}px, ${view.y}px) scale(${view.zoom})` }}
            >
              {url.data && (
                <img
                  ref={image}
                  className={styles.image}
                  src={url.data.url}
                  alt={label}
                  draggable={false}
                  onLoad={(e) =>
                    setNatural({ w: e.currentTarget.naturalWidth, h: e.currentTarget.naturalHeight })
                  }
                />
              )}
              {marking?.points.map((p, i) => (
                <span
                  key={i}
                  className={styles.mark}
                  style={{ left: `${p.x * 100}%`, top: `${p.y * 100}%` }}
                  aria-label={`Scale point ${i + 1}`}
                  role="img"
                />
              ))}
              {bar && !marking && (
                <div
                  className={styles.bar}
                  style={{ width: `${bar.fraction * 100}%` }}
                  aria-label={`Scale bar ${bar.label}`}
                  role="img"
                >
                  <Caption1 className={styles.barLabel}>{bar.label}</Caption1>
                  <div className={styles.barLine} />
                </div>
              )}
            </div>
          </div>
          <div className={styles.row}>
            <Button
              className={styles.touch}
              aria-label="Previous photo"
              icon={<ChevronLeftRegular />}
              disabled={photos.length < 2}
              onClick={() => go(-1)}
            />
            <Text>{`${index + 1} of ${photos.length}`}</Text>
            <Button
              className={styles.touch}
              aria-label="Next photo"
              icon={<ChevronRightRegular />}
              disabled={photos.length < 2}
              onClick={() => go(1)}
            />
            <Button
              className={styles.touch}
              aria-label="Zoom in"
              icon={<ZoomInRegular />}
              onClick={() => apply(zoomAbout(view, view.zoom * 1.5, { x: 0, y: 0 }))}
            />
            <Button
              className={styles.touch}
              aria-label="Zoom out"
              icon={<ZoomOutRegular />}
              disabled={view.zoom <= 1}
              onClick={() => apply(zoomAbout(view, view.zoom / 1.5, { x: 0, y: 0 }))}
            />
            {photo.facePart && <Text>{facePartLabels[photo.facePart]}</Text>}
            {!photo.scale && !marking && <Caption1>No scale marked</Caption1>}
            {canEdit && !marking && (
              <Button
                className={styles.touch}
                icon={<RulerRegular />}
                onClick={() => {
                  setView(FIT);
                  setMarking({ points: [], distance: '' });
                  stage.current?.focus();
                }}
              >
                {photo.scale ? 'Mark the scale again' : 'Mark a scale'}
              </Button>
            )}
            {canEdit && !marking && photo.scale && (
              <Button className={styles.touch} appearance="subtle" onClick={() => save.mutate(null)}>
                Remove the scale
              </Button>
            )}
          </div>
          {marking && (
            <div className={styles.row}>
              {marking.points.length < 2 ? (
                <Text role="status">
                  {marking.points.length === 0
                    ? 'Tap one end of a length you know on the photo.'
                    : 'Now tap the other end.'}
                </Text>
              ) : (
                <>
                  <Field
                    label="Distance between the two points (m)"
                    validationState={save.isError ? 'error' : 'none'}
                    validationMessage={save.isError ? save.error.message : undefined}
                  >
                    <Input
                      className={styles.touch}
                      type="number"
                      inputMode="decimal"
                      min={0}
                      step="any"
                      autoFocus
                      value={marking.distance}
                      onChange={(_e, d) => setMarking({ ...marking, distance: d.value })}
                    />
                  </Field>
                  <Button
                    className={styles.touch}
                    appearance="primary"
                    disabled={!(distance > 0) || save.isPending}
                    onClick={() =>
                      save.mutate({ a: marking.points[0], b: marking.points[1], distanceM: distance })
                    }
                  >
                    Save the scale
                  </Button>
                </>
              )}
              <Button className={styles.touch} appearance="subtle" onClick={endMarking}>
                Cancel
              </Button>
            </div>
          )}
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
