import { makeStyles, tokens } from '@fluentui/react-components';
import { EmptyState, PageHeader, RoleBadge } from '@roundbook/ui';
import type { ProjectSummary } from '@/api/contract';
import { HeadingCard } from '@/features/projects/components/heading-card';

export interface ProjectBoardProps {
  project: ProjectSummary;
  /**
   * Where a heading's "waiting for review" count leads (composed by the app: the engineer's To confirm
   * queue, or the heading's rounds that were handed in).
   */
  reviewHref?: (headingId: string) => string;
}

const useStyles = makeStyles({
  section: { marginBottom: tokens.spacingVerticalXXXL },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(min(100%, 26rem), 1fr))',
    gap: tokens.spacingHorizontalL,
  },
});

/** The Board for one project: a header and one card per heading. */
export function ProjectBoard({ project, reviewHref }: ProjectBoardProps) {
  const styles = useStyles();
  return (
    <section className={styles.section} aria-label={project.name} data-testid="project-board">
      <PageHeader
        title={project.name}
        subtitle={`${project.code} · for ${project.client} · times in ${project.timeZone}`}
        actions={<RoleBadge role={project.role} />}
      />
      {project.headings.length === 0 ? (
        <EmptyState
          title="No headings in this project yet"
          message="A project admin adds headings in Setup; they appear here as soon as they exist."
        />
      ) : (
        <div className={styles.grid}>
          {project.headings.map((heading) => {
            const to = `/projects/${project.id}/headings/${heading.id}`;
            return (
              <HeadingCard
                key={heading.id}
                heading={heading}
                timeZone={project.timeZone}
                to={to}
                reviewTo={reviewHref?.(heading.id)}
                handoversTo={`${to}?view=handovers`}
              />
            );
          })}
        </div>
      )}
    </section>
  );
}
