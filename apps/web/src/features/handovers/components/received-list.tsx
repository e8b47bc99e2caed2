import {
  Button,
  Card,
  Field,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Text,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { formatCalendarDate, formatProjectTime, shiftLabels } from '@roundbook/domain';
import { EmptyState, PageHeader } from '@roundbook/ui';
import { useEffect, useRef, useState } from 'react';
import {
  openHandoverPdf,
  useAcknowledgeHandover,
  useReceivedHandovers,
  type Handover,
} from '@/features/handovers/api/handovers';
import { HandoverStateBadge, overdueFirst } from '@/features/handovers/components/handover-state';
import { useHandoverStyles } from '@/features/handovers/components/handover-styles';
import { HeadingFacts } from '@/features/handovers/components/heading-facts';
import { isApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  item: { scrollMarginTop: '96px', scrollMarginBottom: '24px', borderRadius: tokens.borderRadiusLarge },
  // The handover the e-mail's link named: a thick brand outline and its own words, not colour alone.
  highlighted: {
    outline: `4px solid ${tokens.colorBrandStroke1}`,
    outlineOffset: '2px',
    ':focus-visible': { outline: `4px solid ${tokens.colorStrokeFocus2}` },
  },
  fromLink: { color: tokens.colorBrandForeground1, fontWeight: tokens.fontWeightSemibold },
  comment: { flexGrow: 1, minWidth: '240px' },
  caution: { marginBottom: '12px' },
});

interface ReceivedItemProps {
  handover: Handover;
  /** Opened from the e-mail's link: scrolled to, outlined and focused once */
  highlighted: boolean;
}

function ReceivedItem({ handover, highlighted }: ReceivedItemProps) {
  const shared = useHandoverStyles();
  const styles = useStyles();
  const itemRef = useRef<HTMLLIElement>(null);
  const [comment, setComment] = useState('');
  const [pdfProblem, setPdfProblem] = useState<string | null>(null);
  const acknowledge = useAcknowledgeHandover();
  const waiting = handover.status === 'sent';
  const title = `${handover.headings.map((h) => h.code).join(', ')} · ${shiftLabels[handover.shift]} ${formatCalendarDate(handover.shiftDate)}`;

  useEffect(() => {
    if (!highlighted || !itemRef.current) return;
    // jsdom has no scrollIntoView; browsers do.
    itemRef.current.scrollIntoView?.({ block: 'start', behavior: 'auto' });
    itemRef.current.focus({ preventScroll: true });
  }, [highlighted]);

  return (
    <li
      ref={itemRef}
      data-testid="received-item"
      data-highlighted={highlighted || undefined}
      aria-current={highlighted || undefined}
      tabIndex={highlighted ? -1 : undefined}
      aria-label={title}
      className={mergeClasses(styles.item, highlighted && styles.highlighted)}
    >
      <Card className={mergeClasses(shared.card, handover.overdue && shared.overdue)}>
        {highlighted && <Text className={styles.fromLink}>Opened from your e-mail link</Text>}
        <div className={shared.top}>
          <HandoverStateBadge handover={handover} />
          <Text as="h2" className={shared.title}>
            {title}
          </Text>
        </div>
        <Text className={shared.muted}>
          {`${handover.projectName} · from ${handover.outgoing.name} · sent ${formatProjectTime(handover.sentAt, handover.timeZone)}`}
        </Text>
        {handover.headings.map((h) => (
          <section key={h.headingId} className={shared.section} aria-label={`${h.code} — ${h.name}`}>
            <Text weight="semibold" size={400}>{`${h.code} — ${h.name}`}</Text>
            <HeadingFacts h={h} cycle={h.cycleStage} />
            {h.notes ? <Text as="p">{`Notes: ${h.notes}`}</Text> : null}
          </section>
        ))}
        {handover.generalNotes ? <Text>{`General notes: ${handover.generalNotes}`}</Text> : null}
        <div className={shared.bar}>
          {handover.pdfReady ? (
            <Button
              className={shared.button}
              appearance="secondary"
              size="large"
              onClick={() => {
                setPdfProblem(null);
                openHandoverPdf(handover.projectId, handover.id).catch((e: unknown) =>
                  setPdfProblem(isApiError(e) ? e.message : 'The PDF could not be opened.'),
                );
              }}
            >
              Open the PDF
            </Button>
          ) : (
            <Text className={shared.muted}>The PDF is being made.</Text>
          )}
          {waiting ? (
            <>
              <Field className={styles.comment} label="Comment or question back (optional)">
                <Textarea
                  value={comment}
                  maxLength={2000}
                  resize="vertical"
                  onChange={(_, d) => setComment(d.value)}
                />
              </Field>
              <Button
                className={shared.button}
                appearance="primary"
                size="large"
                disabled={acknowledge.isPending}
                onClick={() =>
                  acknowledge.mutate(
                    { projectId: handover.projectId, handoverId: handover.id, comment },
                    // The button goes away: keep the place, so a keyboard or screen reader is not lost.
                    { onSuccess: () => itemRef.current?.focus({ preventScroll: true }) },
                  )
                }
              >
                {acknowledge.isPending ? 'Acknowledging…' : 'Acknowledge'}
              </Button>
            </>
          ) : handover.acknowledgeComment ? (
            <Text>{`Your comment: “${handover.acknowledgeComment}”`}</Text>
          ) : null}
        </div>
        {pdfProblem && (
          <MessageBar intent="error">
            <MessageBarBody>{pdfProblem}</MessageBarBody>
          </MessageBar>
        )}
        {acknowledge.error ? (
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>Not acknowledged</MessageBarTitle>
              {acknowledge.error.message}
            </MessageBarBody>
          </MessageBar>
        ) : null}
      </Card>
    </li>
  );
}

export interface ReceivedListProps {
  /** The handover the e-mail's link names (`/received?handover=<id>`), if any */
  highlightId?: string | null;
}

/** Received: handovers addressed to the signed-in supervisor; overdue first, then waiting, then acknowledged. */
export function ReceivedList({ highlightId = null }: ReceivedListProps) {
  const shared = useHandoverStyles();
  const styles = useStyles();
  const { data, isPending, error } = useReceivedHandovers();
  const missing = highlightId !== null && data !== undefined && !data.some((h) => h.id === highlightId);
  return (
    <>
      <PageHeader title="Received" subtitle="Handovers to you: overdue first, then those waiting." />
      {data?.[0] ? (
        <div className={styles.caution}>
          <MessageBar intent="warning" layout="multiline" data-testid="handover-caution">
            <MessageBarBody>{data[0].caution}</MessageBarBody>
          </MessageBar>
        </div>
      ) : null}
      {missing && (
        <div className={styles.caution} role="alert">
          <MessageBar intent="warning" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>The handover in your link is not here</MessageBarTitle>
              It is not among the handovers sent to you: it may be addressed to another supervisor, or to a
              project you are not a member of. Ask the outgoing supervisor, or check that you signed in with
              the address the e-mail came to.
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      {isPending ? (
        <Spinner label="Reading the handovers sent to you…" />
      ) : error ? (
        <EmptyState title="The handovers could not be read" message={error.message} />
      ) : data.length === 0 ? (
        <EmptyState
          title="Nothing received yet"
          message="Handovers the outgoing supervisor sends to you come here until you acknowledge them."
        />
      ) : (
        <ul className={shared.list} aria-label="Received handovers">
          {overdueFirst(data).map((h) => (
            <ReceivedItem key={h.id} handover={h} highlighted={h.id === highlightId} />
          ))}
        </ul>
      )}
    </>
  );
}
