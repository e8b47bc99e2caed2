import {
  Button,
  Card,
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  Spinner,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { CheckmarkRegular } from '@fluentui/react-icons';
import {
  formatChainageFor,
  formatProjectTime,
  HAZARD_CLOSING_ROLES,
  hazardKindLabels,
  hazardOriginLabels,
} from '@roundbook/domain';
import { EmptyState, TOUCH_TARGET_PX, TriggerLevelBadge } from '@roundbook/ui';
import { useState } from 'react';
import type { Hazard, Heading, ProjectRole } from '@/api/contract';
import { useCloseHazard, useHazards } from '@/features/hazards/api/hazards';
import { RaiseHazardButton } from '@/features/hazards/components/raise-hazard-button';
import { isApiError } from '@/lib/api-client';

export interface HazardRegisterProps {
  projectId: string;
  heading: Heading;
  /** The caller's role in the project: viewers read; engineers, supervisors and admins also close. */
  role: ProjectRole;
  /** The heading's latest face, to start a new hazard's range from (null: no round yet). */
  faceChainage?: number | null;
  /** The project's time zone: every time is shown in it (packages/domain formatProjectTime). */
  timeZone?: string;
}

const useStyles = makeStyles({
  bar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  list: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
  },
  card: { padding: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS },
  red: { borderLeft: `${tokens.strokeWidthThickest} solid ${tokens.colorPaletteRedBorder2}` },
  amber: { borderLeft: `${tokens.strokeWidthThickest} solid ${tokens.colorPaletteMarigoldBorder2}` },
  green: { borderLeft: `${tokens.strokeWidthThickest} solid ${tokens.colorPaletteGreenBorder2}` },
  closed: { opacity: 0.85, backgroundColor: tokens.colorNeutralBackground2 },
  head: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  kind: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  range: { fontSize: tokens.fontSizeBase400 },
  meta: { color: tokens.colorNeutralForeground2, margin: 0 },
  text: { margin: 0, whiteSpace: 'pre-wrap' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '9rem' },
  section: { marginTop: tokens.spacingVerticalXL },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  dialog: { maxWidth: '44rem' },
});

function rangeText(h: Hazard, heading: Heading): string {
  const from = formatChainageFor(h.fromChainage, heading);
  return h.fromChainage === h.toChainage
    ? `at ${from}`
    : `${from} – ${formatChainageFor(h.toChainage, heading)}`;
}

function origin(h: Hazard): string {
  if (h.origin === 'round' && h.roundNumber !== null) return `Raised on round ${h.roundNumber}`;
  return hazardOriginLabels[h.origin];
}

function CloseHazardDialog({
  projectId,
  heading,
  hazard,
  onDone,
}: {
  projectId: string;
  heading: Heading;
  hazard: Hazard;
  onDone: () => void;
}) {
  const styles = useStyles();
  const close = useCloseHazard(projectId, heading.id);
  const [reason, setReason] = useState('');
  const [touched, setTouched] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const tooShort = reason.trim().length < 3;
  const submit = async () => {
    setTouched(true);
    if (tooShort) return;
    setProblem(null);
    try {
      await close.mutateAsync({
        hazardId: hazard.id,
        body: { reason: reason.trim(), version: hazard.version },
      });
      onDone();
    } catch (error) {
      setProblem(
        isApiError(error)
          ? error.status === 409
            ? `${error.message} The list has been read again; open the hazard again to close it.`
            : error.message
          : 'Something unexpected went wrong. Try again.',
      );
    }
  };
  return (
    <Dialog open modalType="modal" onOpenChange={(_, d) => !d.open && !close.isPending && onDone()}>
      <DialogSurface className={styles.dialog}>
        <DialogBody>
          <DialogTitle>Close hazard</DialogTitle>
          <DialogContent>
            <p>
              {hazardKindLabels[hazard.kind]} {rangeText(hazard, heading)}: {hazard.description}
            </p>
            <Field
              label="Why it no longer stands"
              required
              size="large"
              validationState={touched && tooShort ? 'error' : 'none'}
              validationMessage={touched && tooShort ? 'Give the reason (at least 3 characters).' : undefined}
            >
              <Textarea
                value={reason}
                rows={3}
                resize="vertical"
                onChange={(_, d) => setReason(d.value)}
                onBlur={() => setTouched(true)}
              />
            </Field>
            {problem !== null && (
              <div role="alert">
                <MessageBar intent="error" layout="multiline">
                  <MessageBarBody>{problem}</MessageBarBody>
                </MessageBar>
              </div>
            )}
            <p className={styles.meta}>
              Closing is recorded with your name and the reason. Only the competent person on site decides
              whether the ground is safe to enter.
            </p>
            <div className={styles.actions}>
              <Button
                appearance="primary"
                size="large"
                className={styles.button}
                disabled={close.isPending}
                icon={close.isPending ? <Spinner size="tiny" /> : <CheckmarkRegular />}
                onClick={() => void submit()}
              >
                Close hazard
              </Button>
              <Button size="large" className={styles.button} disabled={close.isPending} onClick={onDone}>
                Keep it open
              </Button>
            </div>
          </DialogContent>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

function HazardCard({
  hazard,
  heading,
  canClose,
  onClose,
  timeZone,
}: {
  hazard: Hazard;
  heading: Heading;
  timeZone: string;
  canClose: boolean;
  onClose: () => void;
}) {
  const styles = useStyles();
  const open = hazard.status === 'open';
  const kind = hazardKindLabels[hazard.kind];
  return (
    <li aria-label={`${kind} ${rangeText(hazard, heading)}, ${hazard.level}, ${hazard.status}`}>
      <Card className={mergeClasses(styles.card, open ? styles[hazard.level] : styles.closed)}>
        <div className={styles.head}>
          <TriggerLevelBadge level={hazard.level} />
          <span className={styles.kind}>{kind}</span>
          <span className={styles.range}>{rangeText(hazard, heading)}</span>
          {!open && <span className={styles.meta}>Closed</span>}
        </div>
        <p className={styles.text}>{hazard.description}</p>
        <p className={styles.meta}>
          {origin(hazard)} by {hazard.raisedByName ?? 'someone no longer in the project'},{' '}
          {formatProjectTime(hazard.raisedAt, timeZone)}
          {hazard.photoIds.length > 0 &&
            ` · ${hazard.photoIds.length} photo${hazard.photoIds.length === 1 ? '' : 's'}`}
        </p>
        {!open && hazard.closedAt !== null && (
          <p className={styles.meta}>
            Closed by {hazard.closedByName ?? 'someone no longer in the project'},{' '}
            {formatProjectTime(hazard.closedAt, timeZone)}: {hazard.closeReason}
          </p>
        )}
        {open && canClose && (
          <div>
            <Button size="large" className={styles.button} onClick={onClose}>
              Close…
            </Button>
          </div>
        )}
      </Card>
    </li>
  );
}

/** The Hazards tab of a heading: open hazards first (level by colour, shape and word), then closed ones. */
export function HazardRegister({
  projectId,
  heading,
  role,
  faceChainage = null,
  timeZone,
}: HazardRegisterProps) {
  const zone = timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  const styles = useStyles();
  const { data, isPending, isError, refetch } = useHazards(projectId, heading.id);
  const [closing, setClosing] = useState<Hazard | null>(null);
  const canRaise = role !== 'viewer';
  const canClose = (HAZARD_CLOSING_ROLES as readonly string[]).includes(role);
  if (isPending) return <Spinner label="Reading the hazards…" />;
  if (isError)
    return (
      <MessageBar intent="error" layout="multiline">
        <MessageBarBody>
          The hazards could not be read.{' '}
          <Button appearance="transparent" onClick={() => void refetch()}>
            Try again
          </Button>
        </MessageBarBody>
      </MessageBar>
    );
  const open = data.filter((h) => h.status === 'open');
  const closed = data.filter((h) => h.status === 'closed');
  return (
    <section aria-label="Hazards">
      <div className={styles.bar}>
        {canRaise && (
          <RaiseHazardButton projectId={projectId} heading={heading} faceChainage={faceChainage} />
        )}
        <span className={styles.meta}>
          {open.length === 0 ? 'No open hazard' : `${open.length} open`} · open hazards stay on every handover
          until an engineer or supervisor closes them.
        </span>
      </div>
      <h2>Open</h2>
      {open.length === 0 ? (
        <EmptyState title="No open hazard on this heading" />
      ) : (
        <ul className={styles.list} aria-label="Open hazards">
          {open.map((h) => (
            <HazardCard
              key={h.id}
              hazard={h}
              heading={heading}
              timeZone={zone}
              canClose={canClose}
              onClose={() => setClosing(h)}
            />
          ))}
        </ul>
      )}
      {closed.length > 0 && (
        <div className={styles.section}>
          <h2>Closed</h2>
          <ul className={styles.list} aria-label="Closed hazards">
            {closed.map((h) => (
              <HazardCard
                key={h.id}
                hazard={h}
                heading={heading}
                timeZone={zone}
                canClose={false}
                onClose={() => undefined}
              />
            ))}
          </ul>
        </div>
      )}
      {closing && (
        <CloseHazardDialog
          projectId={projectId}
          heading={heading}
          hazard={closing}
          onDone={() => setClosing(null)}
        />
      )}
    </section>
  );
}
