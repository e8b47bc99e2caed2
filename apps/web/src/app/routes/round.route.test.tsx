import { QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactNode } from 'react';
import type { SupportClassLibrary } from '@/api/contract';
import { shouldRevalidate } from '@/app/routes/round.route';
import { draftRound, heading, project, supportClasses } from '@/features/rounds/testing/round-fixtures';
import { useChangeSupportClasses } from '@/features/support-classes/api/support-classes';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, localConfig } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

const ROUND = 'GET /api/projects/p-1/rounds/r-1';
const CLASSES = 'GET /api/projects/p-1/support-classes';

describe('Round screen and Setup share one copy of the project data', () => {
  it('shows a support class changed in Setup in the open round, and reads the round again for its suggestion', async () => {
    // Before the change the server suggests B for this round; with B's lower bound raised to 2 it
    // suggests A (the server decides; the screen only shows what it is told).
    let changed = false;
    const library = (): SupportClassLibrary => ({
      classes: supportClasses.map((c) => (changed && c.code === 'B' ? { ...c, qMin: 2, version: 2 } : c)),
      warnings: [],
    });
    const api = mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects/p-1': project,
      'GET /api/projects/p-1/headings/h-1': heading,
      'GET /api/projects/p-1/headings/h-1/joints': [],
      [CLASSES]: () => jsonResponse(library()),
      [ROUND]: () => jsonResponse({ ...draftRound, suggestedClassIds: changed ? ['c-A'] : ['c-B'] }),
      'PATCH /api/projects/p-1/support-classes/c-B': () => {
        changed = true;
        return jsonResponse(library());
      },
    });
    const { queryClient } = renderApp('/projects/p-1/rounds/r-1');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('tab', { name: 'Support' }));
    const classB = () => screen.getAllByTestId('support-class').find((c) => c.textContent?.startsWith('B'));
    expect(classB()).toHaveTextContent('1 ≤ Q < 10'); // as the band is applied (issue 19 item 1)
    expect(classB()).toHaveTextContent('Fits the ratings');
    const roundReads = requestedRoutes(api).filter((r) => r === ROUND).length;

    // The admin's change, through Setup's own mutation, on the same query client.
    const wrapper = ({ children }: { children: ReactNode }) => (
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    );
    const { result } = renderHook(() => useChangeSupportClasses('p-1'), { wrapper });
    await act(() =>
      result.current.mutateAsync({ kind: 'update', classId: 'c-B', body: { qMin: 2, version: 1 } }),
    );

    await waitFor(() => expect(classB()).toHaveTextContent('2 ≤ Q < 10'));
    await waitFor(() => expect(requestedRoutes(api).filter((r) => r === ROUND)).toHaveLength(roundReads + 1));
    const classA = () => screen.getAllByTestId('support-class').find((c) => c.textContent?.startsWith('A'));
    await waitFor(() => expect(classA()).toHaveTextContent('Fits the ratings'));
    expect(classB()).not.toHaveTextContent('Fits the ratings');
    // One library entry: the answer of the change replaced it; nobody keeps a second copy to refresh.
    expect(queryClient.getQueryData(['projects', 'p-1', 'support-classes'])).toEqual(library());
    expect(
      queryClient
        .getQueryCache()
        .findAll({ queryKey: ['projects', 'p-1'] })
        .map((q) => q.queryKey),
    ).toEqual(
      expect.arrayContaining([
        ['projects', 'p-1'],
        ['projects', 'p-1', 'support-classes'],
        ['projects', 'p-1', 'headings', 'h-1'],
        ['projects', 'p-1', 'rounds', 'r-1'],
      ]),
    );
  });
});

const args = (current: string, next: string) =>
  ({
    currentUrl: new URL(current, 'http://127.0.0.1'),
    nextUrl: new URL(next, 'http://127.0.0.1'),
    defaultShouldRevalidate: true,
  }) as Parameters<typeof shouldRevalidate>[0];

describe('round route revalidation', () => {
  it('does not load the round again when only the section in the address changes', () => {
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/r?section=rating'))).toBe(false);
    expect(shouldRevalidate(args('/projects/p/rounds/r?section=rating', '/projects/p/rounds/r'))).toBe(false);
  });

  it('follows the default for another round or another query', () => {
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/s?section=rating'))).toBe(true);
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/r?revision=2'))).toBe(true);
  });
});
