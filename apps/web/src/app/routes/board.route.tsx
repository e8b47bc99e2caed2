import { EmptyState } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { guarded } from '@/app/routes/session-guard';
import { projectsQueryOptions, useProjects } from '@/features/projects/api/get-projects';
import { ProjectBoard } from '@/features/projects/components/project-board';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      await queryClient.ensureQueryData(projectsQueryOptions());
      return null;
    });

/** Board: every project the person belongs to, one card per heading. */
export function BoardRoute() {
  const { data: projects } = useProjects();
  if (projects.length === 0) {
    return (
      <EmptyState
        title="You are not on a project yet"
        message="A project admin adds people to a project with a role. Once you are added, the project's headings show here."
      />
    );
  }
  return (
    <>
      {projects.map((project) => (
        <ProjectBoard key={project.id} project={project} />
      ))}
    </>
  );
}
