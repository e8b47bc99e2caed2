import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { AddRegular } from '@fluentui/react-icons';
import { formatChainage } from '@roundbook/geomath';
import { EmptyState, PageHeader, RoleBadge, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { Suspense, useMemo, useState } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import type { ExcavationStage, Heading, ProjectRole } from '@/api/contract';
import { currentUserQueryOptions } from '@/api/resources/auth';
import { headingsQueryOptions } from '@/api/resources/headings';
import { projectQueryOptions } from '@/api/resources/projects';
import { supportClassesQueryOptions } from '@/api/resources/support-classes';
import { teamQueryOptions } from '@/api/resources/team';
import { triggerRulesQueryOptions } from '@/api/resources/trigger-rules';
import { pickCurrentProject } from '@/app/navigation';
import type { CreatedProjectState } from '@/app/routes/new-project.route';
import { PageLoading } from '@/app/routes/page-loading';
import { guarded } from '@/app/routes/session-guard';
import { useShellContext } from '@/app/shell-context';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { useHeadings } from '@/features/headings/api/get-headings';
import { HeadingForm } from '@/features/headings/components/heading-form';
import { HeadingsTable } from '@/features/headings/components/headings-table';
import { stageLabels } from '@/features/headings/utils/labels';
import { useProject } from '@/features/projects/api/get-project';
import { ProjectSettingsForm } from '@/features/projects/components/project-settings-form';
import { SupportClassLibrary } from '@/features/support-classes/components/support-class-library';
import { TeamPanel } from '@/features/team/components/team-panel';
import type { RoundPlaceFormat } from '@/features/trigger-rules/components/trigger-preview';
import { plainPlaceFormat } from '@/features/trigger-rules/components/trigger-preview';
import { TriggerRuleList } from '@/features/trigger-rules/components/trigger-rule-list';

const SECTIONS = [
  { key: 'project', label: 'Project' },
  { key: 'headings', label: 'Headings' },
  { key: 'support-classes', label: 'Support classes' },
  { key: 'triggers', label: 'Triggers' },
  { key: 'team', label: 'Team' },
] as const;

type SectionKey = (typeof SECTIONS)[number]['key'];

function sectionOf(param: string | undefined): SectionKey {
  return SECTIONS.find((s) => s.key === param)?.key ?? 'headings';
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request, params }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      const me = await queryClient.ensureQueryData(currentUserQueryOptions());
      const current = pickCurrentProject(me.memberships);
      if (current === null) return null;
      const id = current.projectId;
      const section = sectionOf(params.section);
      const sectionData = {
        project: null,
        headings: headingsQueryOptions(id),
        'support-classes': supportClassesQueryOptions(id),
        triggers: triggerRulesQueryOptions(id),
        team: teamQueryOptions(id),
      }[section];
      await Promise.all([
        queryClient.ensureQueryData(projectQueryOptions(id)),
        sectionData === null
          ? null
          : queryClient.ensureQueryData(sectionData as ReturnType<typeof headingsQueryOptions>),
      ]);
      return null;
    });

const useStyles = makeStyles({
  tabs: {
    marginBottom: tokens.spacingVerticalL,
    flexWrap: 'wrap',
    '& button': { minHeight: `${TOUCH_TARGET_PX}px` },
  },
  note: { marginBottom: tokens.spacingVerticalL },
  toolbar: { display: 'flex', gap: tokens.spacingHorizontalM, marginBottom: tokens.spacingVerticalL },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/** Who may change what in Setup (issue 5, "Rules"). */
export function setupRights(role: ProjectRole) {
  return { setup: role === 'admin', triggers: role === 'admin' || role === 'engineer' };
}

function ReadOnlyNote({ who }: { who: string }) {
  const styles = useStyles();
  return (
    <div className={styles.note}>
      <MessageBar intent="info">
        <MessageBarBody>{`You can read this section. ${who} change it.`}</MessageBarBody>
      </MessageBar>
    </div>
  );
}

function SectionCaution() {
  const styles = useStyles();
  return (
    <div className={styles.note} data-testid="setup-caution">
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Roundbook flags, people decide</MessageBarTitle>
          Roundbook compares each round with these settings and raises a flag. The responsible engineer and
          the competent person on site decide on support and round length, under the project&apos;s design and
          the local regulations.
        </MessageBarBody>
      </MessageBar>
    </div>
  );
}

function HeadingsSection({
  projectId,
  canEdit,
  coordinateGrid,
}: {
  projectId: string;
  canEdit: boolean;
  coordinateGrid: string;
}) {
  const styles = useStyles();
  const { data: headings } = useHeadings(projectId);
  const [editing, setEditing] = useState<Heading | 'new' | null>(null);
  if (editing !== null) {
    return (
      <HeadingForm
        projectId={projectId}
        heading={editing === 'new' ? undefined : editing}
        coordinateGrid={coordinateGrid}
        onSaved={() => setEditing(null)}
        onCancel={() => setEditing(null)}
      />
    );
  }
  return (
    <>
      {canEdit && (
        <div className={styles.toolbar}>
          <Button
            className={styles.button}
            size="large"
            appearance="primary"
            icon={<AddRegular />}
            onClick={() => setEditing('new')}
          >
            Add heading
          </Button>
        </div>
      )}
      {headings.length === 0 ? (
        <EmptyState
          title="No headings yet"
          message={
            canEdit ? 'Add the headings the project drives.' : 'A project admin adds the headings here.'
          }
        />
      ) : (
        <HeadingsTable headings={headings} onEdit={canEdit ? (h) => setEditing(h) : undefined} />
      )}
    </>
  );
}

/** Trigger rules, with rounds tried on them written in each heading's own chainage format. */
function TriggersSection({ projectId, canEdit }: { projectId: string; canEdit: boolean }) {
  // Not suspended: the rules show at once; the headings only refine how a try's chainages read.
  const { data: headings } = useQuery(headingsQueryOptions(projectId));
  const placeFormat = useMemo<RoundPlaceFormat>(
    () => ({
      chainage: (code, metres) => {
        const heading = headings?.find((h) => h.code === code);
        return heading === undefined
          ? plainPlaceFormat.chainage(code, metres)
          : formatChainage(metres, { style: heading.chainageStyle, decimals: heading.chainageDecimals });
      },
      stage: (stage) => stageLabels[stage as ExcavationStage] ?? plainPlaceFormat.stage(stage),
    }),
    [headings],
  );
  return <TriggerRuleList projectId={projectId} canEdit={canEdit} placeFormat={placeFormat} />;
}

function SetupPage({ projectId, role }: { projectId: string; role: ProjectRole }) {
  const styles = useStyles();
  const navigate = useNavigate();
  const params = useParams();
  const section = sectionOf(params.section);
  const { data: project } = useProject(projectId);
  const { data: me } = useCurrentUser();
  const rights = setupRights(role);
  const canEditSection = section === 'triggers' ? rights.triggers : rights.setup;
  const created = (useLocation().state as Partial<CreatedProjectState> | null)?.createdProject;

  return (
    <>
      <PageHeader
        title="Setup"
        subtitle={`${project.name} · what every round is judged against`}
        actions={<RoleBadge role={role} />}
      />
      <TabList
        className={styles.tabs}
        size="large"
        selectedValue={section}
        onTabSelect={(_e, data) => void navigate(`/setup/${String(data.value)}`)}
        aria-label="Setup sections"
      >
        {SECTIONS.map((s) => (
          <Tab key={s.key} value={s.key}>
            {s.label}
          </Tab>
        ))}
      </TabList>
      {created !== undefined && (
        <div className={styles.note} role="status" data-testid="project-created">
          <MessageBar intent="success" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>{`${created} is ready`}</MessageBarTitle>
              You are its project admin. Next: add the headings it drives, then its support classes, trigger
              rules and team — each has its tab above.
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      {!canEditSection && (
        <ReadOnlyNote who={section === 'triggers' ? 'Project admins and engineers' : 'Project admins'} />
      )}
      {(section === 'support-classes' || section === 'triggers') && <SectionCaution />}
      <Suspense fallback={<PageLoading />}>
        {section === 'project' && (
          <ProjectSettingsForm key={project.id} project={project} canEdit={rights.setup} />
        )}
        {section === 'headings' && (
          <HeadingsSection
            key={project.id}
            projectId={project.id}
            canEdit={rights.setup}
            coordinateGrid={project.coordinateGrid}
          />
        )}
        {section === 'support-classes' && (
          <SupportClassLibrary key={project.id} projectId={project.id} canEdit={rights.setup} />
        )}
        {section === 'triggers' && (
          <TriggersSection key={project.id} projectId={project.id} canEdit={rights.triggers} />
        )}
        {section === 'team' && (
          <TeamPanel
            key={project.id}
            projectId={project.id}
            canEdit={rights.setup}
            myUserId={me.id}
            timeZone={project.timeZone}
          />
        )}
      </Suspense>
    </>
  );
}

/** Setup: the project, its headings, support classes, trigger rules and team. */
export function SetupRoute() {
  const { membership } = useShellContext();
  const { data: me } = useCurrentUser();
  const current = membership ?? pickCurrentProject(me.memberships);
  if (current === null) {
    return (
      <EmptyState
        title="You are not on a project yet"
        message="A project admin adds people to a project with a role; its setup shows here afterwards."
      />
    );
  }
  return <SetupPage key={current.projectId} projectId={current.projectId} role={current.role} />;
}
