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
  /** With state 'error': the server named fields to fix. */
  invalid?: boolean;
  readOnly: boolean;
}

const texts: Record<SaveState, string> = {
  saved: 'Saved',
  waiting: 'Not saved yet',
  saving: 'Saving…',
  offline: 'Not saved yet — will retry',
  error: 'Not saved',
  conflict: 'Not saved — changed by someone else',
};

/** Where the typing is: on the server, on its way, or kept on this device only. */
export function SaveStateBadge({ state, invalid = false, readOnly }: SaveStateBadgeProps) {
  if (readOnly) {
    return (
      <Badge size="extra-large" appearance="outline" color="informative" shape="rounded">
        Read only
      </Badge>
    );
  }
  const colour =
    state === 'saved' ? 'success' : state === 'saving' || state === 'waiting' ? 'informative' : 'danger';
  const icon =
    state === 'saving' ? (
      <Spinner size="extra-tiny" />
    ) : state === 'saved' ? (
      <CheckmarkCircleRegular />
    ) : state === 'offline' ? (
      <CloudOffRegular />
    ) : state === 'waiting' ? (
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
        {state === 'error' && invalid ? 'Not saved — see the marked fields' : texts[state]}
      </Badge>
    </span>
  );
}
