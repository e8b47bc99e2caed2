import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter } from 'react-router-dom';
import type { RouteObject } from 'react-router-dom';
import { NotFound } from '@/app/routes/not-found';
import { PageLoading } from '@/app/routes/page-loading';
import { RouteError } from '@/app/routes/route-error';
import { signInPath } from '@/features/auth/utils/next-path';
import { setSessionExpiredHandler } from '@/lib/api-client';

/**
 * Every route of the web app. Each page is its own chunk (route `lazy`); loaders warm the
 * TanStack Query cache with the same query options the pages read.
 */
export function createRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: '/',
      errorElement: <RouteError />,
      hydrateFallbackElement: <PageLoading />,
      children: [
        {
          path: 'sign-in',
          lazy: async () => {
            const { clientLoader, SignInRoute } = await import('@/app/routes/sign-in.route');
            return { loader: clientLoader, Component: SignInRoute };
          },
        },
        {
          path: 'invitation/:token',
          lazy: async () => ({
            Component: (await import('@/app/routes/invitation.route')).InvitationRoute,
          }),
        },
        {
          id: 'signed-in',
          lazy: async () => {
            const { clientLoader, AppShellRoute } = await import('@/app/routes/app-shell.route');
            return { loader: clientLoader(queryClient), Component: AppShellRoute };
          },
          children: [
            {
              // Errors of a page show inside the shell, so navigation stays usable.
              errorElement: <RouteError />,
              children: [
                {
                  index: true,
                  lazy: async () => {
                    const { clientLoader, BoardRoute } = await import('@/app/routes/board.route');
                    return { loader: clientLoader(queryClient), Component: BoardRoute };
                  },
                },
                {
                  path: 'mail',
                  lazy: async () => {
                    const { clientLoader, MailRoute } = await import('@/app/routes/mail.route');
                    return { loader: clientLoader(queryClient), Component: MailRoute };
                  },
                },
                {
                  path: 'to-confirm',
                  lazy: async () => ({
                    Component: (await import('@/app/routes/to-confirm.route')).ToConfirmRoute,
                  }),
                },
                {
                  path: 'received',
                  lazy: async () => ({
                    Component: (await import('@/app/routes/received.route')).ReceivedRoute,
                  }),
                },
                {
                  path: 'setup/:section?',
                  lazy: async () => {
                    const { clientLoader, SetupRoute } = await import('@/app/routes/setup.route');
                    return { loader: clientLoader(queryClient), Component: SetupRoute };
                  },
                },
                {
                  path: 'projects/new',
                  lazy: async () => ({
                    Component: (await import('@/app/routes/new-project.route')).NewProjectRoute,
                  }),
                },
                {
                  path: 'projects/:projectId/headings/:headingId',
                  lazy: async () => {
                    const { clientLoader, HeadingRoute } = await import('@/app/routes/heading.route');
                    return { loader: clientLoader(queryClient), Component: HeadingRoute };
                  },
                },
                {
                  path: 'projects/:projectId/rounds/:roundId',
                  lazy: async () => {
                    const { clientLoader, RoundRoute, shouldRevalidate } =
                      await import('@/app/routes/round.route');
                    return { loader: clientLoader(queryClient), Component: RoundRoute, shouldRevalidate };
                  },
                },
                { path: '*', Component: NotFound },
              ],
            },
          ],
        },
      ],
    },
  ];
}

interface NavigableRouter {
  state: {
    initialized: boolean;
    navigation: { state: string };
    location: { pathname: string; search: string };
  };
  navigate: (to: string, opts?: { replace?: boolean }) => Promise<void>;
}

/**
 * A 401 outside a loader (a refetch, a button) means the token ran out while the page was open:
 * go to sign-in and come back here afterwards. Loaders handle their own 401s (session-guard).
 */
export function handleSessionExpiry(router: NavigableRouter): void {
  setSessionExpiredHandler(() => {
    if (!router.state.initialized || router.state.navigation.state !== 'idle') return;
    const { pathname, search } = router.state.location;
    if (pathname === '/sign-in') return;
    // The cache is emptied at the next sign-in, once no page that reads it is mounted.
    void router.navigate(signInPath(`${pathname}${search}`, 'expired'), { replace: true });
  });
}

export function createAppRouter(queryClient: QueryClient) {
  const router = createBrowserRouter(createRoutes(queryClient));
  handleSessionExpiry(router);
  return router;
}
