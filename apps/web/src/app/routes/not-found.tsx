import { EmptyState } from '@roundbook/ui';
import { Link } from 'react-router-dom';

export function NotFound() {
  return (
    <EmptyState
      title="No such page"
      message="The address does not lead to anything in Roundbook."
      action={<Link to="/">Back to the Board</Link>}
    />
  );
}
