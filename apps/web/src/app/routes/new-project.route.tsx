import { PageHeader } from '@roundbook/ui';
import { useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { ProjectSummary } from '@/api/contract';
import { currentUserQueryOptions } from '@/api/resources/auth';
import { rememberCurrentProject } from '@/app/navigation';
import { useShellContext } from '@/app/shell-context';
import { NewProjectForm } from '@/features/projects/components/new-project-form';

/** What Setup is told when it opens on a project just created. */
export interface CreatedProjectState {
  createdProject: string;
}

/** New project: anyone signed in may start one and becomes its admin; Setup follows. */
export function NewProjectRoute() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const { chooseProject } = useShellContext();

  const created = async (project: ProjectSummary) => {
    // The person's memberships now include the project: read them again before it becomes current.
    await queryClient.fetchQuery({ ...currentUserQueryOptions(), staleTime: 0 });
    rememberCurrentProject(project.id);
    chooseProject?.(project.id);
    await navigate('/setup/headings', {
      state: { createdProject: project.name } satisfies CreatedProjectState,
    });
  };

  return (
    <>
      <PageHeader
        title="New project"
        subtitle="You become its project admin. Headings, support classes, triggers and the team follow in its Setup."
      />
      <NewProjectForm onCreated={created} onCancel={() => void navigate('/')} />
    </>
  );
}
