import { Badge, Button, makeStyles, mergeClasses, Spinner, Text, tokens } from '@fluentui/react-components';
import {
  ArrowSyncRegular,
  CheckmarkCircleRegular,
  CloudOffRegular,
  ErrorCircleRegular,
  PlugConnectedRegular,
} from '@fluentui/react-icons';
import { formatProjectTime } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useEffect, useState, useSyncExternalStore } from 'react';
import type { SyncStatus } from '@/lib/sync/autosave';
import type { SyncStateSnapshot } from '@/lib/sync/sync-state';

/**
 * The sync bar: always in view at the bottom of the window, wherever the person has scrolled (a save
 * failure must not hide above the joints). Connection, what is being sent, how many changes wait on this
 * device, when the server last took one, and any refusal in words.
 */
export interface SyncBarViewProps {
  online: boolean;
  /** A save is on its way. */
  syncing: boolean;
  /** Changes kept on this device that the server does not have yet. */
  waiting: number;
  lastSyncedAt: number | null;
  /** Refusals and conflicts, in words (each names its record). */
  problems: string[];
  /** While signed out with changes waiting: they are sent after the same person signs in again. */
  heldForSignIn?: boolean;
  onRetry?: () => void;
  /** The time "last synced" is worded against (ms since epoch). */
  now: number;
}

const useStyles = makeStyles({
  bar: {
    position: 'sticky',
    bottom: 0,
    zIndex: 10,
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalL,
    minHeight: `${TOUCH_TARGET_PX}px`,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalXL}`,
    backgroundColor: tokens.colorNeutralBackground3,
    borderTop: `${tokens.strokeWidthThick} solid ${tokens.colorNeutralStroke1}`,
    fontSize: tokens.fontSizeBase400,
  },
  offline: { borderTopColor: tokens.colorPaletteMarigoldBorderActive },
  problem: {
    borderTopColor: tokens.colorPaletteRedBorderActive,
    backgroundColor: tokens.colorPaletteRedBackground1,
  },
  item: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  problemText: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  spacer: { flexGrow: 1 },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

function ago(at: number, now: number): string {
  const s = Math.max(0, Math.round((now - at) / 1000));
  if (s < 45) return 'just now';
  const m = Math.round(s / 60);
  if (m < 60) return `${m} min ago`;
  return formatProjectTime(new Date(at), Intl.DateTimeFormat().resolvedOptions().timeZone);
}

export function SyncBarView({
  online,
  syncing,
  waiting,
  lastSyncedAt,
  problems,
  heldForSignIn = false,
  onRetry,
  now,
}: SyncBarViewProps) {
  const styles = useStyles();
  const failed = problems.length > 0;
  const summary = syncing
    ? 'Syncing…'
    : waiting > 0
      ? `${waiting} ${waiting === 1 ? 'change' : 'changes'} waiting on this device`
      : failed
        ? 'Not saved'
        : 'All changes saved';
  return (
    <div
      className={mergeClasses(styles.bar, !online && styles.offline, failed && styles.problem)}
      role="status"
      aria-live="polite"
      aria-label="Sync"
      data-testid="sync-bar"
    >
      <span className={styles.item}>
        {online ? <PlugConnectedRegular /> : <CloudOffRegular />}
        <Badge appearance={online ? 'tint' : 'filled'} color={online ? 'success' : 'warning'} shape="rounded">
          {online ? 'Online' : 'Offline'}
        </Badge>
      </span>
      <span className={styles.item} data-testid="sync-summary">
        {syncing ? (
          <Spinner size="extra-tiny" />
        ) : waiting > 0 ? (
          <ArrowSyncRegular />
        ) : failed ? (
          <ErrorCircleRegular />
        ) : (
          <CheckmarkCircleRegular />
        )}
        <Text>{summary}</Text>
      </span>
      {heldForSignIn && waiting > 0 && (
        <Text data-testid="sync-held">Sent after you sign in again (only for the same person).</Text>
      )}
      {problems.map((p) => (
        <Text key={p} className={styles.problemText} data-testid="sync-problem">
          {p}
        </Text>
      ))}
      <span className={styles.spacer} />
      <Text data-testid="sync-last">
        {lastSyncedAt === null ? 'Not synced from this device yet' : `Last synced ${ago(lastSyncedAt, now)}`}
      </Text>
      {onRetry !== undefined && online && waiting > 0 && !syncing && (
        <Button className={styles.button} onClick={onRetry}>
          Send now
        </Button>
      )}
    </div>
  );
}

const PENDING: SyncStatus[] = ['waiting', 'offline', 'saving', 'error', 'conflict'];

/** Summary of the sync state for the bar (pure: tested without React). */
export function summarise(
  state: SyncStateSnapshot,
  outboxKeys: readonly string[],
  draftKeys: readonly string[],
): Pick<SyncBarViewProps, 'syncing' | 'waiting' | 'problems' | 'lastSyncedAt'> {
  const open = [...state.records.entries()];
  const openWaiting = open.filter(([, r]) => PENDING.includes(r.status)).map(([k]) => k);
  // Typing kept from rounds no longer on screen counts too (its draft waits in this browser). A round
  // opened offline is in the outbox, usually has a draft and may be on screen: it is one change waiting.
  const problems = open.flatMap(([, r]) =>
    r.status === 'error'
      ? [`${r.label}: not saved — ${r.message ?? 'the server refused it'}`]
      : r.status === 'conflict'
        ? [`${r.label}: changed by someone else — choose what to keep`]
        : [],
  );
  return {
    syncing: state.sendingOutbox || open.some(([, r]) => r.status === 'saving'),
    waiting: new Set([...outboxKeys, ...openWaiting, ...draftKeys.filter((k) => !state.records.has(k))]).size,
    problems,
    lastSyncedAt: state.lastSyncedAt,
  };
}

/** navigator.onLine, kept up to date. */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (listener) => {
      window.addEventListener('online', listener);
      window.addEventListener('offline', listener);
      return () => {
        window.removeEventListener('online', listener);
        window.removeEventListener('offline', listener);
      };
    },
    () => navigator.onLine,
  );
}

/** Re-renders every `ms` (the "last synced" words). */
export function useNow(ms = 30_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const id = setInterval(() => setNow(Date.now()), ms);
    return () => clearInterval(id);
  }, [ms]);
  return now;
}
