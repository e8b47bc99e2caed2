import { Button, makeStyles, mergeClasses, Select, Text, tokens } from '@fluentui/react-components';
import {
  BoardRegular,
  ClipboardTaskListLtrRegular,
  MailInboxRegular,
  PersonRegular,
  PeopleSwapRegular,
  SettingsRegular,
  SignOutRegular,
} from '@fluentui/react-icons';
import { RoleBadge, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Suspense, useCallback, useEffect, useState, useSyncExternalStore } from 'react';
import type { ReactElement } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { currentUserQueryOptions } from '@/api/resources/auth';
import { configQueryOptions } from '@/api/resources/config';
import { CautionNote } from '@/app/caution-note';
import { HighContrastSwitch } from '@/app/high-contrast-switch';
import type { NavItem } from '@/app/navigation';
import { navigationFor, pickCurrentProject, rememberCurrentProject } from '@/app/navigation';
import { PageLoading } from '@/app/routes/page-loading';
import { guarded } from '@/app/routes/session-guard';
import type { ShellContext } from '@/app/shell-context';
import { SyncBarView, summarise, useNow, useOnline } from '@/app/sync-bar';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { AccountDialog } from '@/features/auth/components/account-dialog';
import { localAccessQueryOptions } from '@/features/mail/api/get-local-access';
import { NoticeSettingsPanel } from '@/features/notices/components/notice-settings-panel';
import { roundDraftsFor } from '@/features/rounds/hooks/use-round-autosave';
import { sendWaitingRounds } from '@/features/rounds/utils/background-sender';
import { useConfig } from '@/features/system/api/get-config';
import { clearSession, saveSession } from '@/lib/session';
import { outbox } from '@/lib/sync/outbox';
import { syncState } from '@/lib/sync/sync-state';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      await Promise.all([
        queryClient.ensureQueryData(currentUserQueryOptions()),
        queryClient.ensureQueryData(configQueryOptions()),
      ]);
      return null;
    });

const navIcons: Record<NavItem['icon'], ReactElement> = {
  board: <BoardRegular />,
  confirm: <ClipboardTaskListLtrRegular />,
  received: <PeopleSwapRegular />,
  setup: <SettingsRegular />,
  mail: <MailInboxRegular />,
};

const useStyles = makeStyles({
  shell: { display: 'flex', flexDirection: 'column', minHeight: '100dvh' },
  header: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    columnGap: tokens.spacingHorizontalXL,
    rowGap: tokens.spacingVerticalS,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalXL}`,
    backgroundColor: tokens.colorNeutralBackground1,
    borderBottom: `${tokens.strokeWidthThickest} solid ${tokens.colorBrandStroke1}`,
  },
  wordmark: {
    fontSize: tokens.fontSizeBase600,
    fontWeight: tokens.fontWeightBold,
    color: tokens.colorBrandForeground1,
    letterSpacing: '-0.01em',
    textDecoration: 'none',
    display: 'inline-flex',
    alignItems: 'center',
    minHeight: `${TOUCH_TARGET_PX}px`,
  },
  project: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, minWidth: 0 },
  projectName: { fontWeight: tokens.fontWeightSemibold },
  select: { minWidth: '16rem', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  spacer: { flexGrow: 1 },
  user: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM },
  touch: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  nav: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalS,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalXL}`,
    backgroundColor: tokens.colorNeutralBackground2,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  navLink: {
    display: 'inline-flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    minHeight: `${TOUCH_TARGET_PX}px`,
    paddingInline: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusXLarge,
    color: tokens.colorNeutralForeground1,
    fontSize: tokens.fontSizeBase400,
    fontWeight: tokens.fontWeightSemibold,
    textDecoration: 'none',
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    backgroundColor: tokens.colorNeutralBackground1,
    ':hover': { backgroundColor: tokens.colorNeutralBackground1Hover },
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
    '& svg': { fontSize: '24px' },
  },
  navLinkActive: {
    backgroundColor: tokens.colorBrandBackground,
    color: tokens.colorNeutralForegroundOnBrand,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorBrandStroke1}`,
    ':hover': { backgroundColor: tokens.colorBrandBackgroundHover },
  },
  main: {
    flexGrow: 1,
    width: '100%',
    maxWidth: '1600px',
    boxSizing: 'border-box',
    marginInline: 'auto',
    padding: `${tokens.spacingVerticalXL} ${tokens.spacingHorizontalXL}`,
  },
  footer: {
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalXL}`,
    borderTop: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground2,
    display: 'flex',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalL,
  },
  version: { color: tokens.colorNeutralForeground3 },
});

/** The signed-in frame: who you are, which project, what your role lets you open, the caution. */
export function AppShellRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const { data: me } = useCurrentUser();
  const { data: config } = useConfig();
  const [chosenId, setChosenId] = useState(() => pickCurrentProject(me.memberships)?.projectId ?? null);
  // Derived on every render, so a project that joins the memberships later (a new one) can be current.
  const current = me.memberships.find((m) => m.projectId === chosenId) ?? pickCurrentProject(me.memberships);
  // Asked only in local mode (elsewhere there is no local mail to show).
  const localAccess = useQuery({ ...localAccessQueryOptions(), enabled: config.localMode });
  const navItems = navigationFor({
    role: current?.role ?? null,
    localAccess: config.localMode ? (localAccess.data ?? null) : null,
  });

  const [accountOpen, setAccountOpen] = useState(false);

  const signOut = async () => {
    clearSession();
    await navigate('/sign-in', { replace: true });
    // Cancel anything in flight; the cache itself is emptied at the next sign-in.
    await queryClient.cancelQueries();
  };

  const chooseProject = useCallback((projectId: string) => {
    rememberCurrentProject(projectId);
    setChosenId(projectId);
  }, []);

  return (
    <div className={styles.shell}>
      <header className={styles.header}>
        <NavLink to="/" className={styles.wordmark} aria-label="Roundbook, go to the Board">
          Roundbook
        </NavLink>
        <div className={styles.project}>
          {me.memberships.length > 1 ? (
            <Select
              className={styles.select}
              size="large"
              aria-label="Project"
              value={current?.projectId ?? ''}
              onChange={(_event, data) => chooseProject(data.value)}
            >
              {me.memberships.map((m) => (
                <option key={m.projectId} value={m.projectId}>
                  {m.projectName}
                </option>
              ))}
            </Select>
          ) : (
            <Text className={styles.projectName}>{current?.projectName ?? 'No project yet'}</Text>
          )}
          {current !== null && <RoleBadge role={current.role} />}
        </div>
        <div className={styles.spacer} />
        <HighContrastSwitch />
        <div className={styles.user}>
          <Text aria-label="Signed in as">{me.name}</Text>
          <Button
            className={styles.touch}
            size="large"
            icon={<PersonRegular />}
            onClick={() => setAccountOpen(true)}
          >
            Account
          </Button>
          <Button
            className={styles.touch}
            size="large"
            icon={<SignOutRegular />}
            onClick={() => {
              void signOut();
            }}
          >
            Sign out
          </Button>
        </div>
      </header>

      {accountOpen && (
        <AccountDialog
          open
          name={me.name}
          email={me.email}
          onClose={() => setAccountOpen(false)}
          onPasswordChanged={(result) =>
            saveSession({ accessToken: result.accessToken, expiresAt: result.expiresAt, user: result.user })
          }
          onSignedOutEverywhere={() => {
            setAccountOpen(false);
            void signOut();
          }}
        >
          {current !== null && (
            <NoticeSettingsPanel projectId={current.projectId} projectName={current.projectName} />
          )}
        </AccountDialog>
      )}

      <nav className={styles.nav} aria-label="Main">
        {navItems.map((item) => (
          <NavLink
            key={item.to}
            to={item.to}
            end={item.to === '/'}
            className={({ isActive }) => mergeClasses(styles.navLink, isActive && styles.navLinkActive)}
          >
            {navIcons[item.icon]}
            {item.label}
          </NavLink>
        ))}
      </nav>

      <main className={styles.main}>
        <Suspense fallback={<PageLoading />}>
          <Outlet context={{ membership: current, chooseProject } satisfies ShellContext} />
        </Suspense>
      </main>

      <ShellSyncBar userId={me.id} />

      <footer className={styles.footer}>
        <CautionNote />
        <Text size={200} className={styles.version}>{`Roundbook ${config.version}`}</Text>
      </footer>
    </div>
  );
}

/** How often the shell tries again while changes wait and the browser says it is online. */
const BACKGROUND_RETRY_MS = 60_000;

/** The sync bar of the signed-in frame; also sends the rounds opened offline when the connection is back. */
function ShellSyncBar({ userId }: { userId: string }) {
  const queryClient = useQueryClient();
  const online = useOnline();
  const now = useNow();
  const state = useSyncExternalStore(syncState.subscribe, syncState.getSnapshot);
  useSyncExternalStore(
    (listener) => outbox.subscribe(listener),
    () => outbox.version(),
  );
  const pending = outbox.list(userId).map((entry) => entry.id);
  const send = useCallback(() => {
    syncState.sendingOutbox(true);
    // Rounds open in an editor are sent by their own engine; the rest (closed, or opened offline) here.
    sendWaitingRounds(userId, { queryClient, isOpen: (id) => syncState.getSnapshot().records.has(id) })
      .then(({ sent }) => {
        if (sent > 0) syncState.synced();
      })
      // Still unreachable: the entries stay; the next connection, the next minute or Send now tries again.
      .catch(() => undefined)
      .finally(() => syncState.sendingOutbox(false));
  }, [userId, queryClient]);
  const draftKeys = roundDraftsFor(userId).keys();
  const waitingHere = pending.length > 0 || draftKeys.some((k) => !state.records.has(k));
  useEffect(() => {
    if (!online || !waitingHere) return;
    send();
    const id = setInterval(send, BACKGROUND_RETRY_MS);
    return () => clearInterval(id);
  }, [online, waitingHere, send]);
  const summary = summarise(state, pending, draftKeys);
  return (
    <SyncBarView
      {...summary}
      online={online}
      now={now}
      onRetry={() => {
        syncState.retryAll();
        send();
      }}
    />
  );
}
