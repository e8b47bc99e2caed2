import { useOutletContext } from 'react-router-dom';
import type { Membership } from '@/api/contract';

/** What the signed-in shell passes to its pages: the project the person is looking at. */
export interface ShellContext {
  membership: Membership | null;
  /** Makes another of the person's projects the current one (e.g. a project just created). */
  chooseProject?: (projectId: string) => void;
}

export function useShellContext(): ShellContext {
  return useOutletContext<ShellContext | undefined>() ?? { membership: null };
}
