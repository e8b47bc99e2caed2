import { Button, makeStyles } from '@fluentui/react-components';
import { ArrowLeftRegular } from '@fluentui/react-icons';
import { driveTrendAt, formatChainageFor } from '@roundbook/domain';
import { driveOf } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { LoaderFunctionArgs, ShouldRevalidateFunction } from 'react-router-dom';
import { Link, useParams } from 'react-router-dom';
import { headingQueryOptions } from '@/api/resources/headings';
import { projectQueryOptions } from '@/api/resources/projects';
import { roundQueryOptions } from '@/api/resources/rounds';
import { supportClassesQueryOptions } from '@/api/resources/support-classes';
import { guarded } from '@/app/routes/session-guard';
import { useThemePreference } from '@/app/theme-preference';
import { RaiseHazardButton } from '@/features/hazards/components/raise-hazard-button';
import { RoundOrientationPanel } from '@/features/orientation/components/round-orientation-panel';
import { SET_COLOURS_LIGHT } from '@/features/orientation/scene/palette';
import { PhotosSection } from '@/features/photos';
import { usePhotoPins } from '@/features/photos/hooks/use-photo-pins';
import { ReviewPanel } from '@/features/review/components/review-panel';
import { SectionComments } from '@/features/review/components/section-comments';
import {
  useRound,
  useRoundHeading,
  useRoundProject,
  useRoundSupportClasses,
} from '@/features/rounds/api/get-round';
import { ROUND_SECTIONS, RoundEditor, type RoundSection } from '@/features/rounds/components/round-editor';
import { pendingRoundOf, sendPendingRound } from '@/features/rounds/utils/offline-round';
import { SketchSection } from '@/features/sketch';
import { SupportRecordSection } from '@/features/support-records/components/support-record-section';
import { isApiError } from '@/lib/api-client';
import { readSession } from '@/lib/session';
import { useSearchParam } from '@/lib/use-search-param';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request, params }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      const projectId = params.projectId ?? '';
      const roundId = params.roundId ?? '';
      // A round opened with no connection is not on the server yet: created now if the connection is
      // back, otherwise shown from this device's outbox (field mode, issue 17).
      const owner = readSession()?.user.id;
      const pending = owner === undefined ? null : pendingRoundOf(owner, roundId);
      if (owner !== undefined && pending !== null) {
        await sendPendingRound(owner, roundId, queryClient).catch((error: unknown) => {
          if (!isApiError(error) || error.status !== 0) throw error;
          queryClient.setQueryData(roundQueryOptions(projectId, roundId).queryKey, pending.round);
        });
      }
      const [round] = await Promise.all([
        queryClient.ensureQueryData(roundQueryOptions(projectId, roundId)),
        queryClient.ensureQueryData(projectQueryOptions(projectId)),
        queryClient.ensureQueryData(supportClassesQueryOptions(projectId)),
      ]);
      await queryClient.ensureQueryData(headingQueryOptions(projectId, round.headingId));
      return null;
    });

const useStyles = makeStyles({
  back: { minHeight: `${TOUCH_TARGET_PX}px` },
  bar: { display: 'flex', flexWrap: 'wrap', gap: '12px', alignItems: 'center', marginBottom: '8px' },
});

/** Switching sections only rewrites ?section=: nothing to load again. */
export const shouldRevalidate: ShouldRevalidateFunction = ({
  currentUrl,
  nextUrl,
  defaultShouldRevalidate,
}) => {
  if (currentUrl.pathname !== nextUrl.pathname) return defaultShouldRevalidate;
  const strip = (u: URL) => {
    const p = new URLSearchParams(u.search);
    p.delete('section');
    return p.toString();
  };
  return strip(currentUrl) === strip(nextUrl) ? false : defaultShouldRevalidate;
};

/** Round: one mapped face, edited by the geologist while it is a draft; read only otherwise. */
export function RoundRoute() {
  const styles = useStyles();
  const { projectId = '', roundId = '' } = useParams();
  // The section shown is kept in the address (?section=), so a reload or a shared link opens it (issue 19 item 9).
  const [asked, setSection] = useSearchParam('section', 'position');
  const initialSection = [...ROUND_SECTIONS, 'sketch' as const].find((s) => s === asked);
  const { data: round } = useRound(projectId, roundId);
  const { data: project } = useRoundProject(projectId);
  const { data: heading } = useRoundHeading(projectId, round.headingId);
  const { data: library } = useRoundSupportClasses(projectId);
  const { mode } = useThemePreference();
  // "Pin on the sketch" from a photo: the Sketch section opens and its next tap places the pin.
  const photoPins = usePhotoPins(projectId, roundId);
  const [sectionRequest, setSectionRequest] = useState<{ section: RoundSection; seq: number }>();
  // A tap on a photo's pin on the sketch opens that photo in the Photos viewer.
  const [photoRequest, setPhotoRequest] = useState<{ photoId: string; seq: number } | null>(null);
  // The drive at the face: the alignment's tangent there (straights and arcs), the gradient's plunge.
  const driveAt = (faceChainage: number) => {
    try {
      return { trend: driveTrendAt(heading, faceChainage), plunge: driveOf(heading).plunge };
    } catch {
      return driveOf(heading);
    }
  };
  return (
    <>
      <div className={styles.bar}>
        <Link to={`/projects/${projectId}/headings/${heading.id}`}>
          <Button className={styles.back} size="large" appearance="subtle" icon={<ArrowLeftRegular />}>
            {`Rounds of ${heading.code}`}
          </Button>
        </Link>
        {project.role !== 'viewer' && (
          <RaiseHazardButton
            projectId={projectId}
            heading={heading}
            faceChainage={round.faceChainage}
            round={{ id: round.id, roundNumber: round.roundNumber }}
            appearance="secondary"
          />
        )}
      </div>
      <RoundEditor
        key={round.id}
        projectId={projectId}
        round={round}
        project={project}
        heading={heading}
        supportClasses={library.classes}
        canEdit={project.role === 'geologist'}
        initialSection={initialSection}
        sectionRequest={sectionRequest}
        onSectionChange={setSection}
        sectionNoteSlot={
          round.status === 'draft' && round.revision === 1
            ? undefined
            : (place) => <SectionComments projectId={projectId} roundId={round.id} place={place} />
        }
        orientationSlot={({ joints, assessment, faceChainage, assignSets }) => (
          <RoundOrientationPanel
            joints={joints}
            sets={assessment.sets}
            features={assessment.features}
            drive={driveAt(faceChainage)}
            highContrast={mode === 'high-contrast'}
            fileName={`${heading.code}-round-${round.roundNumber}`}
            onAssign={assignSets}
          />
        )}
        sketchSlot={({ sketch, onChange, readOnly, joints, assessment, faceChainage }) => {
          // The sets take the stereonet's colours, in the same order; the sketch is drawn on white paper
          // in both themes (as in its PNG), so always the light-paper colours (the high-contrast ones are
          // made for a dark background and vanish on white).
          const colours = SET_COLOURS_LIGHT;
          return (
            <SketchSection
              document={sketch}
              onChange={onChange}
              readOnly={readOnly}
              heading={heading}
              stage={round.stage}
              chainageText={formatChainageFor(faceChainage, heading)}
              joints={joints.map((j) => ({
                id: j.id,
                label: `Joint ${j.seq}${j.orientationText ? ` · ${j.orientationText}` : ''}`,
                setLabel: j.setLabel,
              }))}
              sets={assessment.sets.sets.map((s, i) => ({
                label: s.label,
                colour: colours[i % colours.length],
              }))}
              photoPins={photoPins.pins}
              pinning={photoPins.pinning}
              pinError={photoPins.error}
              onPin={photoPins.place}
              onCancelPin={photoPins.cancel}
              onOpenPhoto={(photoId) => setPhotoRequest((r) => ({ photoId, seq: (r?.seq ?? 0) + 1 }))}
            />
          );
        }}
      />
      {round.status === 'draft' && round.revision === 1 ? null : (
        <ReviewPanel
          projectId={projectId}
          roundId={round.id}
          supportClasses={library.classes}
          timeZone={project.timeZone}
        />
      )}
      {round.status === 'confirmed' && (
        <SupportRecordSection
          projectId={projectId}
          roundId={round.id}
          canRecord={['supervisor', 'engineer', 'admin'].includes(project.role)}
          timeZone={project.timeZone}
        />
      )}
      <PhotosSection
        projectId={projectId}
        roundId={round.id}
        timeZone={project.timeZone}
        openRequest={photoRequest}
        onPinOnSketch={(photo, label) => {
          photoPins.start(photo, label);
          setSectionRequest((r) => ({ section: 'sketch', seq: (r?.seq ?? 0) + 1 }));
          document
            .querySelector('[role="tablist"][aria-label="Sections of the round"]')
            ?.scrollIntoView({ block: 'start' });
        }}
        canEdit={
          (project.role === 'geologist' || project.role === 'admin') &&
          (round.status === 'draft' || round.status === 'returned')
        }
      />
    </>
  );
}
