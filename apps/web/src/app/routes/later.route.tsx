import { EmptyState, PageHeader } from '@roundbook/ui';

export interface LaterPageProps {
  title: string;
  purpose: string;
}

/** A page the navigation already offers to its role, whose content arrives in a later release. */
export function LaterPage({ title, purpose }: LaterPageProps) {
  return (
    <>
      <PageHeader title={title} />
      <EmptyState title={`${title} is being built`} message={purpose} />
    </>
  );
}
