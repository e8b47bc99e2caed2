import {
  Badge,
  Button,
  Card,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
  Text,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import {
  cycleStageLabels,
  formatCalendarDate,
  formatChainageFor,
  formatProjectTime,
  levelLabels,
  shiftLabels,
  stageLabels,
} from '@roundbook/domain';
import { EmptyState, PageHeader, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import {
  openHandoverPdf,
  useAcknowledgeHandover,
  useReceivedHandovers,
  type Handover,
} from '@/features/handovers/api/handovers';

const useStyles = makeStyles({
  list: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '12px',
  },
  card: { padding: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS },
  top: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  title: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  muted: { color: tokens.colorNeutralForeground2 },
  heading: { borderTop: `1px solid ${tokens.colorNeutralStroke2}`, paddingTop: tokens.spacingVerticalS },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-end' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  comment: { flexGrow: 1, minWidth: '240px' },
  caution: { marginBottom: '12px' },
});

function HeadingLines({ h }: { h: Handover['headings'][number] }) {
  const styles = useStyles();
  const chainage = (m: number) => formatChainageFor(m, h);
  const c = h.lastConfirmed;
  return (
    <div className={styles.heading}>
      <Text weight="semibold">{`${h.code} — ${h.name}`}</Text>
      <ul>
        <li>
          {h.faceChainage === null
            ? 'Face: no round handed in yet'
            : `Face ${chainage(h.faceChainage)}${h.stage ? `, ${stageLabels[h.stage]}` : ''}`}
        </li>
        <li>{`Cycle: ${h.cycleStage ? cycleStageLabels[h.cycleStage] : 'not given'}`}</li>
        <li>
          {c
            ? `Last confirmed: round ${c.roundNumber} at ${chainage(c.faceChainage)}, class ${c.classCode ?? '—'}` +
              `, next round ${c.nextRoundLength ?? '—'} m`
            : 'No round confirmed yet'}
        </li>
        <li>{`Trigger level: ${h.triggerLevel ? levelLabels[h.triggerLevel] : 'not evaluated'}`}</li>
        {h.alerts.map((a, i) => (
          <li key={i}>{`${levelLabels[a.level]}: ${a.summary} — ${a.action}`}</li>
        ))}
        {h.notes ? <li>{`Notes: ${h.notes}`}</li> : null}
      </ul>
    </div>
  );
}

function ReceivedItem({ handover }: { handover: Handover }) {
  const styles = useStyles();
  const [comment, setComment] = useState('');
  const acknowledge = useAcknowledgeHandover();
  const waiting = handover.status === 'sent';
  const title = `${handover.headings.map((h) => h.code).join(', ')} · ${shiftLabels[handover.shift]} ${formatCalendarDate(handover.shiftDate)}`;
  return (
    <li data-testid="received-item">
      <Card className={styles.card} aria-label={title}>
        <div className={styles.top}>
          <Badge size="large" appearance="filled" color={waiting ? 'warning' : 'success'}>
            {waiting ? 'Waiting for you' : 'Acknowledged'}
          </Badge>
          <Text className={styles.title}>{title}</Text>
        </div>
        <Text className={styles.muted}>
          {`${handover.projectName} · from ${handover.outgoing.name} · sent ${formatProjectTime(handover.sentAt, handover.timeZone)}`}
        </Text>
        {handover.headings.map((h) => (
          <HeadingLines key={h.headingId} h={h} />
        ))}
        {handover.generalNotes ? <Text>{`General notes: ${handover.generalNotes}`}</Text> : null}
        <div className={styles.actions}>
          {handover.pdfReady ? (
            <Button
              className={styles.button}
              appearance="secondary"
              size="large"
              onClick={() => void openHandoverPdf(handover.projectId, handover.id)}
            >
              Open the PDF
            </Button>
          ) : (
            <Text className={styles.muted}>The PDF is being made.</Text>
          )}
          {waiting ? (
            <>
              <Field className={styles.comment} label="Comment or question back (optional)">
                <Textarea value={comment} maxLength={2000} onChange={(_, d) => setComment(d.value)} />
              </Field>
              <Button
                className={styles.button}
                appearance="primary"
                size="large"
                disabled={acknowledge.isPending}
                onClick={() =>
                  acknowledge.mutate({ projectId: handover.projectId, handoverId: handover.id, comment })
                }
              >
                Acknowledge
              </Button>
            </>
          ) : (
            <Text>
              {`Acknowledged ${handover.acknowledgedAt ? formatProjectTime(handover.acknowledgedAt, handover.timeZone) : ''}` +
                (handover.acknowledgeComment ? ` — “${handover.acknowledgeComment}”` : '')}
            </Text>
          )}
        </div>
        {acknowledge.error ? (
          <MessageBar intent="error">
            <MessageBarBody>{acknowledge.error.message}</MessageBarBody>
          </MessageBar>
        ) : null}
      </Card>
    </li>
  );
}

/** Received: handovers addressed to the signed-in supervisor, those waiting for acknowledgement first. */
export function ReceivedList() {
  const styles = useStyles();
  const { data, isPending, error } = useReceivedHandovers();
  return (
    <>
      <PageHeader title="Received" subtitle="Handovers to you: those waiting first." />
      {data?.[0] ? (
        <div className={styles.caution}>
          <MessageBar intent="warning" layout="multiline" data-testid="handover-caution">
            <MessageBarBody>{data[0].caution}</MessageBarBody>
          </MessageBar>
        </div>
      ) : null}
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
        <ul className={styles.list} aria-label="Received handovers">
          {data.map((h) => (
            <ReceivedItem key={h.id} handover={h} />
          ))}
        </ul>
      )}
    </>
  );
}
