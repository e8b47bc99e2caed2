import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { AddRegular } from '@fluentui/react-icons';
import { EmptyState, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { useNavigate } from 'react-router-dom';
import { projectsQueryOptions } from '@/api/resources/projects';
import { guarded } from '@/app/routes/session-guard';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { useProjects } from '@/features/projects/api/get-project';
import { ProjectBoard } from '@/features/projects/components/project-board';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      await queryClient.ensureQueryData(projectsQueryOptions());
      return null;
    });

const useStyles = makeStyles({
  toolbar: { display: 'flex', justifyContent: 'flex-end', marginBottom: tokens.spacingVerticalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

function NewProjectButton() {
  const styles = useStyles();
  const navigate = useNavigate();
  return (
    <Button
      className={styles.button}
      size="large"
      appearance="secondary"
      icon={<AddRegular />}
      onClick={() => void navigate('/projects/new')}
    >
      New project
    </Button>
  );
}

/**
 * Board: every project the person belongs to, one card per heading. New project is offered to those the
 * instance lets create one (PROJECT_CREATION: anyone, or its operators only; /api/auth/me says which).
 */
export function BoardRoute() {
  const styles = useStyles();
  const { data: projects } = useProjects();
  const { data: me } = useCurrentUser();
  const canCreate = me.canCreateProjects;
  if (projects.length === 0) {
    return (
      <EmptyState
        title="You are not on a project yet"
        message={
          canCreate
            ? "A project admin adds people to a project with a role. Once you are added, the project's headings show here. Or start a project of your own and set it up."
            : "A project admin adds people to a project with a role. Once you are added, the project's headings show here. On this Roundbook the people who run it create projects."
        }
        action={canCreate ? <NewProjectButton /> : undefined}
      />
    );
  }
  return (
    <>
      {canCreate && (
        <div className={styles.toolbar}>
          <NewProjectButton />
        </div>
      )}
      {projects.map((project) => (
        <ProjectBoard
          key={project.id}
          project={project}
          // The engineer's count leads to their queue, filtered to the heading (issue 19 item 13); the queue
          // holds only what the caller reviews, so everyone else sees the heading's rounds handed in.
          reviewHref={(headingId) =>
            project.role === 'engineer'
              ? `/to-confirm?heading=${encodeURIComponent(headingId)}`
              : `/projects/${project.id}/headings/${headingId}?status=submitted`
          }
        />
      ))}
    </>
  );
}
