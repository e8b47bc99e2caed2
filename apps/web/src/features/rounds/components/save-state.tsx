import { Badge, Spinner } from '@fluentui/react-components';
import {
  CheckmarkCircleRegular,
  CloudOffRegular,
  ErrorCircleRegular,
  EditRegular,
} from '@fluentui/react-icons';
import type { SaveState } from '@/features/rounds/hooks/use-round-autosave';

export interface SaveStateBadgeProps {
  state: SaveState;
  readOnly: boolean;
}

const texts: Record<SaveState, string> = {
  saved: 'Saved',
  pending: 'Not saved yet',
  saving: 'Saving…',
  offline: 'Not saved yet — will retry',
  invalid: 'Not saved — see the marked fields',
  stale: 'Not saved — changed by someone else',
  refused: 'Not saved',
};

/** Where the typing is: on the server, on its way, or kept on this device only. */
export function SaveStateBadge({ state, readOnly }: SaveStateBadgeProps) {
  if (readOnly) {
    return (
      <Badge size="extra-large" appearance="outline" color="informative" shape="rounded">
        Read only
      </Badge>
    );
  }
  const colour =
    state === 'saved' ? 'success' : state === 'saving' || state === 'pending' ? 'informative' : 'danger';
  const icon =
    state === 'saving' ? (
      <Spinner size="extra-tiny" />
    ) : state === 'saved' ? (
      <CheckmarkCircleRegular />
    ) : state === 'offline' ? (
      <CloudOffRegular />
    ) : state === 'pending' ? (
      <EditRegular />
    ) : (
      <ErrorCircleRegular />
    );
  return (
    <span role="status" aria-live="polite" data-testid="save-state">
      <Badge
        size="extra-large"
        appearance={state === 'saved' ? 'tint' : 'filled'}
        color={colour}
        shape="rounded"
        icon={icon}
      >
        {texts[state]}
      </Badge>
    </span>
  );
}
