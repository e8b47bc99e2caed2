import { Button, makeStyles, Tab, TabList, tokens } from '@fluentui/react-components';
import { ArrowLeftRegular } from '@fluentui/react-icons';
import { formatAzimuth } from '@roundbook/domain';
import { PageHeader, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { headingQueryOptions } from '@/api/resources/headings';
import { projectQueryOptions } from '@/api/resources/projects';
import { supportClassesQueryOptions } from '@/api/resources/support-classes';
import { triggerRulesQueryOptions } from '@/api/resources/trigger-rules';
import { guarded } from '@/app/routes/session-guard';
import { useThemePreference } from '@/app/theme-preference';
import { HeadingHandovers } from '@/features/handovers/components/heading-handovers';
import { HazardRegister } from '@/features/hazards/components/hazard-register';
import { HeadingLongSection } from '@/features/long-section/components/heading-long-section';
import { HeadingOrientation } from '@/features/orientation/components/heading-orientation';
import { useRoundHeading, useRoundProject } from '@/features/rounds/api/get-round';
import { NewRoundPanel } from '@/features/rounds/components/new-round-panel';
import { RoundsTable } from '@/features/rounds/components/rounds-table';
import { useSearchParam } from '@/lib/use-search-param';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request, params }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      const projectId = params.projectId ?? '';
      const headingId = params.headingId ?? '';
      await Promise.all([
        queryClient.ensureQueryData(projectQueryOptions(projectId)),
        queryClient.ensureQueryData(headingQueryOptions(projectId, headingId)),
      ]);
      // What a round of this heading needs, read now while there is a connection, so the service worker
      // has it when a round is opened underground (field mode, issue 17). Not awaited.
      void queryClient.prefetchQuery(supportClassesQueryOptions(projectId));
      void queryClient.prefetchQuery(triggerRulesQueryOptions(projectId));
      return null;
    });

const useStyles = makeStyles({
  tabs: { marginBottom: tokens.spacingVerticalL },
  tab: { minHeight: '56px', fontSize: tokens.fontSizeBase500 },
  back: { minHeight: `${TOUCH_TARGET_PX}px` },
});

const VIEWS = ['rounds', 'long-section', 'orientation', 'hazards', 'handovers'] as const;
type HeadingView = (typeof VIEWS)[number];
const viewOf = (v: string | null): HeadingView =>
  VIEWS.includes(v as HeadingView) ? (v as HeadingView) : 'rounds';

/**
 * Heading: its rounds, orientation, hazards and handovers. The view is kept in the address (`?view=`), so a
 * reload, a shared link or the back button returns to it (issue 19 item 9).
 */
export function HeadingRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const { projectId = '', headingId = '' } = useParams();
  const { data: project } = useRoundProject(projectId);
  const { data: heading } = useRoundHeading(projectId, headingId);
  const [view, setTab] = useSearchParam('view', 'rounds');
  const tab = viewOf(view);
  const { mode } = useThemePreference();
  const drive = formatAzimuth(heading.driveTrend, 1);
  return (
    <>
      <PageHeader
        title={`${heading.code} · ${heading.name}`}
        subtitle={`${project.name} · drive ${drive} · planned round ${heading.plannedRoundLength} m`}
        actions={
          <>
            <Link to="/">
              <Button className={styles.back} size="large" appearance="subtle" icon={<ArrowLeftRegular />}>
                Board
              </Button>
            </Link>
            {project.role === 'geologist' && (
              <NewRoundPanel
                projectId={projectId}
                heading={heading}
                onCreated={(round) => void navigate(`/projects/${projectId}/rounds/${round.id}`)}
              />
            )}
          </>
        }
      />
      <TabList
        className={styles.tabs}
        size="large"
        selectedValue={tab}
        onTabSelect={(_, d) => setTab(String(d.value))}
        aria-label="Heading views"
      >
        <Tab className={styles.tab} value="rounds">
          Rounds
        </Tab>
        <Tab className={styles.tab} value="long-section">
          Long section
        </Tab>
        <Tab className={styles.tab} value="orientation">
          Orientation
        </Tab>
        <Tab className={styles.tab} value="hazards">
          Hazards
        </Tab>
        <Tab className={styles.tab} value="handovers">
          Handovers
        </Tab>
      </TabList>
      {tab === 'long-section' ? (
        <HeadingLongSection projectId={projectId} headingId={headingId} />
      ) : tab === 'orientation' ? (
        <HeadingOrientation projectId={projectId} heading={heading} highContrast={mode === 'high-contrast'} />
      ) : tab === 'handovers' ? (
        <HeadingHandovers
          projectId={projectId}
          heading={heading}
          headings={project.headings}
          role={project.role}
        />
      ) : tab === 'hazards' ? (
        <HazardRegister
          projectId={projectId}
          heading={heading}
          role={project.role}
          timeZone={project.timeZone}
        />
      ) : (
        <RoundsTable projectId={projectId} heading={heading} />
      )}
    </>
  );
}
