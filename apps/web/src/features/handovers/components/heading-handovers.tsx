import {
  Button,
  Card,
  Checkbox,
  Field,
  Input,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Text,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import {
  CYCLE_STAGES,
  cycleStageLabels,
  formatCalendarDate,
  formatProjectTime,
  SHIFTS,
  shiftLabels,
  type CycleStage,
  type Shift,
} from '@roundbook/domain';
import { CalendarDateInput, EmptyState, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMemo, useState } from 'react';
import type { HeadingSummary, ProjectRole } from '@/api/contract';
import {
  openHandoverPdf,
  useComposeHandover,
  useHandoverDraft,
  useHeadingHandovers,
  type Handover,
} from '@/features/handovers/api/handovers';
import { emailWords, HandoverStateBadge } from '@/features/handovers/components/handover-state';
import { useHandoverStyles } from '@/features/handovers/components/handover-styles';
import { HeadingFacts } from '@/features/handovers/components/heading-facts';
import { isApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  form: { padding: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalM },
  checkbox: { minHeight: `${TOUCH_TARGET_PX}px`, alignItems: 'center' },
  /**
   * A Select's root is a wrapper: the <select> inside keeps Fluent's height (40 px at large) whatever the
   * root's, so the touch target is set on the <select> itself (gloves: 48 px, as the round's forms).
   */
  select: { minWidth: '180px', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  failed: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
});

type HeadingWords = { cycleStage: CycleStage | ''; notes: string };

function HistoryItem({ handover }: { handover: Handover }) {
  const shared = useHandoverStyles();
  const styles = useStyles();
  const [pdfProblem, setPdfProblem] = useState<string | null>(null);
  const title = `${shiftLabels[handover.shift]} ${formatCalendarDate(handover.shiftDate)}`;
  return (
    <li data-testid="handover-history-item" aria-label={title}>
      <Card className={mergeClasses(shared.card, handover.overdue && shared.overdue)}>
        <div className={shared.top}>
          <Text as="h3" className={shared.title}>
            {title}
          </Text>
          <HandoverStateBadge handover={handover} />
        </div>
        <Text>{`${handover.outgoing.name} → ${handover.incoming.name} · sent ${formatProjectTime(handover.sentAt, handover.timeZone)}`}</Text>
        <Text className={shared.muted}>
          <span
            className={handover.emailStatus === 'failed' ? styles.failed : undefined}
            data-testid="handover-email-status"
          >
            {emailWords[handover.emailStatus]}
          </span>
          {` · headings ${handover.headings.map((h) => h.code).join(', ')}`}
        </Text>
        {handover.acknowledgeComment ? <Text>{`Comment back: “${handover.acknowledgeComment}”`}</Text> : null}
        <div className={shared.bar}>
          <Button
            className={shared.button}
            size="large"
            disabled={!handover.pdfReady}
            onClick={() => {
              setPdfProblem(null);
              openHandoverPdf(handover.projectId, handover.id).catch((e: unknown) =>
                setPdfProblem(isApiError(e) ? e.message : 'The PDF could not be opened.'),
              );
            }}
          >
            {handover.pdfReady ? 'Open PDF' : 'PDF being made'}
          </Button>
        </div>
        {pdfProblem && (
          <MessageBar intent="error">
            <MessageBarBody>{pdfProblem}</MessageBarBody>
          </MessageBar>
        )}
      </Card>
    </li>
  );
}

interface ComposerProps {
  projectId: string;
  headings: HeadingSummary[];
  headingId: string;
  onSent: (h: Handover) => void;
  onCancel: () => void;
}

/** Compose and send: headings, shift, incoming supervisor, the cycle and notes per heading, recipients. */
function Composer({ projectId, headings, headingId, onSent, onCancel }: ComposerProps) {
  const shared = useHandoverStyles();
  const styles = useStyles();
  const [chosen, setChosen] = useState<string[]>([headingId]);
  const ordered = useMemo(
    () => headings.filter((h) => chosen.includes(h.id)).map((h) => h.id),
    [headings, chosen],
  );
  const draft = useHandoverDraft(projectId, ordered);
  const compose = useComposeHandover(projectId);
  // null: not touched yet, so the draft's value shows (the shift now; the only other supervisor, if one).
  const [shiftDateInput, setShiftDate] = useState<string | null>(null);
  const [shiftInput, setShift] = useState<Shift | null>(null);
  const [incomingInput, setIncoming] = useState<string | null>(null);
  const shiftDate = shiftDateInput ?? draft.data?.shiftDate ?? '';
  const shift: Shift | '' = shiftInput ?? draft.data?.shift ?? '';
  const incomingUserId =
    incomingInput ?? (draft.data?.supervisors.length === 1 ? draft.data.supervisors[0].userId : '');
  const [words, setWords] = useState<Record<string, HeadingWords>>({});
  const [generalNotes, setGeneralNotes] = useState('');
  const [extra, setExtra] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});

  const wordsOf = (id: string): HeadingWords => words[id] ?? { cycleStage: '', notes: '' };
  const setWord = (id: string, patch: Partial<HeadingWords>) =>
    setWords((w) => ({ ...w, [id]: { ...wordsOf(id), ...patch } }));

  const send = async () => {
    setProblem(null);
    const local: Record<string, string> = {};
    if (!shiftDate) local.shiftDate = 'Give the shift date.';
    if (!shift) local.shift = 'Choose the shift.';
    if (!incomingUserId) local.incomingUserId = 'Choose the incoming supervisor.';
    for (const id of ordered)
      if (!wordsOf(id).cycleStage) local[`cycle-${id}`] = 'Say where the cycle stands.';
    const extraRecipients = extra
      .split(/[\s,;]+/)
      .map((e) => e.trim())
      .filter(Boolean);
    if (extraRecipients.some((e) => !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(e)))
      local.extraRecipients = 'Each extra recipient is an e-mail address such as name@example.org.';
    setFields(local);
    if (Object.keys(local).length > 0 || ordered.length === 0) return;
    try {
      const sent = await compose.mutateAsync({
        shiftDate,
        shift: shift as Shift,
        incomingUserId,
        headings: ordered.map((id) => ({
          headingId: id,
          cycleStage: wordsOf(id).cycleStage as CycleStage,
          notes: wordsOf(id).notes,
        })),
        generalNotes,
        extraRecipients: [...new Set(extraRecipients.map((e) => e.toLowerCase()))],
      });
      onSent(sent);
    } catch (e) {
      if (isApiError(e)) {
        setProblem(e.message);
        if (e.fields) setFields(e.fields);
      } else setProblem('The handover could not be sent; nothing was saved. Try again.');
    }
  };

  return (
    <Card className={styles.form} aria-label="Compose a handover">
      <Text className={shared.title}>Compose a handover</Text>
      <fieldset>
        <legend>Headings to hand over</legend>
        {headings.map((h) => (
          <Checkbox
            key={h.id}
            className={styles.checkbox}
            size="large"
            label={`${h.code} — ${h.name}`}
            checked={chosen.includes(h.id)}
            onChange={(_, d) => setChosen((c) => (d.checked ? [...c, h.id] : c.filter((x) => x !== h.id)))}
          />
        ))}
      </fieldset>
      {ordered.length === 0 && <Text>Choose at least one heading.</Text>}
      {draft.isPending && ordered.length > 0 && <Spinner label="Reading the headings…" />}
      {draft.isError && (
        <MessageBar intent="error">
          <MessageBarBody>
            {isApiError(draft.error) ? draft.error.message : 'The headings could not be read.'}
          </MessageBarBody>
        </MessageBar>
      )}
      {draft.data && (
        <>
          <div className={shared.bar}>
            <Field label="Shift date" required validationMessage={fields.shiftDate}>
              <CalendarDateInput
                className={shared.control}
                label="Shift date"
                steppers
                value={shiftDate}
                onChange={setShiftDate}
              />
            </Field>
            <Field label="Shift" required validationMessage={fields.shift}>
              <Select
                className={styles.select}
                size="large"
                value={shift}
                onChange={(_, d) => setShift(d.value as Shift)}
              >
                {SHIFTS.map((s) => (
                  <option key={s} value={s}>
                    {shiftLabels[s]}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Incoming supervisor" required validationMessage={fields.incomingUserId}>
              <Select
                className={styles.select}
                size="large"
                value={incomingUserId}
                onChange={(_, d) => setIncoming(d.value)}
              >
                <option value="">Choose…</option>
                {draft.data.supervisors.map((s) => (
                  <option key={s.userId} value={s.userId}>
                    {s.name}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
          {draft.data.supervisors.length === 0 && (
            <MessageBar intent="warning">
              <MessageBarBody>
                No other supervisor is in this project’s team: an admin adds the incoming supervisor first.
              </MessageBarBody>
            </MessageBar>
          )}
          {draft.data.headings.map((h) => (
            <section key={h.headingId} className={shared.section} aria-label={`${h.code} — ${h.name}`}>
              <Text weight="semibold">{`${h.code} — ${h.name}`}</Text>
              <HeadingFacts h={h} />
              <div className={shared.bar}>
                <Field
                  label={`Cycle at ${h.code}`}
                  required
                  validationMessage={fields[`cycle-${h.headingId}`]}
                >
                  <Select
                    className={styles.select}
                    size="large"
                    value={wordsOf(h.headingId).cycleStage}
                    onChange={(_, d) => setWord(h.headingId, { cycleStage: d.value as CycleStage })}
                  >
                    <option value="">Choose…</option>
                    {CYCLE_STAGES.map((c) => (
                      <option key={c} value={c}>
                        {cycleStageLabels[c]}
                      </option>
                    ))}
                  </Select>
                </Field>
              </div>
              <Field label={`Notes for ${h.code}`}>
                <Textarea
                  size="large"
                  resize="vertical"
                  value={wordsOf(h.headingId).notes}
                  maxLength={4000}
                  onChange={(_, d) => setWord(h.headingId, { notes: d.value })}
                />
              </Field>
            </section>
          ))}
          <Field label="General notes">
            <Textarea
              size="large"
              resize="vertical"
              value={generalNotes}
              maxLength={8000}
              onChange={(_, d) => setGeneralNotes(d.value)}
            />
          </Field>
          <Field
            label="Extra recipients"
            hint={
              draft.data.distributionList.length
                ? `Also goes to the incoming supervisor and ${draft.data.distributionList.join(', ')}`
                : 'Also goes to the incoming supervisor'
            }
            validationMessage={fields.extraRecipients}
          >
            <Input
              className={shared.control}
              size="large"
              value={extra}
              placeholder="name@example.org, …"
              onChange={(_, d) => setExtra(d.value)}
            />
          </Field>
          <MessageBar intent="warning" layout="multiline">
            <MessageBarBody>{draft.data.caution}</MessageBarBody>
          </MessageBar>
          {problem && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Not sent</MessageBarTitle>
                  {problem}
                </MessageBarBody>
              </MessageBar>
            </div>
          )}
          <div className={shared.bar}>
            <Button
              className={shared.button}
              size="large"
              appearance="primary"
              disabled={compose.isPending || ordered.length === 0}
              onClick={() => void send()}
            >
              {compose.isPending ? 'Sending…' : 'Send handover'}
            </Button>
            <Button className={shared.button} size="large" onClick={onCancel}>
              Cancel
            </Button>
          </div>
        </>
      )}
    </Card>
  );
}

export interface HeadingHandoversProps {
  projectId: string;
  heading: Pick<HeadingSummary, 'id' | 'code'>;
  /** The project's headings, to hand several over at once */
  headings: HeadingSummary[];
  role: ProjectRole;
}

/** The Handovers tab of a heading: its history (filter by date and shift) and, for supervisors, the composer. */
export function HeadingHandovers({ projectId, heading, headings, role }: HeadingHandoversProps) {
  const shared = useHandoverStyles();
  const styles = useStyles();
  const history = useHeadingHandovers(projectId, heading.id);
  const [composing, setComposing] = useState(false);
  const [sent, setSent] = useState<Handover | null>(null);
  const [date, setDate] = useState('');
  const [shift, setShift] = useState<Shift | ''>('');
  const canCompose = role === 'supervisor' || role === 'admin';
  const shown = (history.data ?? []).filter(
    (h) => (!date || h.shiftDate === date) && (!shift || h.shift === shift),
  );
  return (
    <div className={styles.root}>
      {sent && (
        <div role="status">
          <MessageBar intent="success" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>Handover sent</MessageBarTitle>
              {`Saved and on its way to ${sent.incoming.name}; the PDF and e-mail follow in a moment.`}
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      {canCompose && !composing && (
        <div className={shared.bar}>
          <Button
            className={shared.button}
            size="large"
            appearance="primary"
            onClick={() => {
              setSent(null);
              setComposing(true);
            }}
          >
            Compose handover
          </Button>
        </div>
      )}
      {composing && (
        <Composer
          projectId={projectId}
          headings={headings}
          headingId={heading.id}
          onCancel={() => setComposing(false)}
          onSent={(h) => {
            setSent(h);
            setComposing(false);
          }}
        />
      )}
      <div className={shared.bar} role="search" aria-label="Filter handovers">
        <Field label="Shift date">
          <CalendarDateInput
            className={shared.control}
            label="Shift date"
            placeholder="Any date"
            clearable
            value={date}
            onChange={setDate}
          />
        </Field>
        <Field label="Shift">
          <Select
            className={styles.select}
            size="large"
            value={shift}
            onChange={(_, d) => setShift(d.value as Shift | '')}
          >
            <option value="">Both shifts</option>
            {SHIFTS.map((s) => (
              <option key={s} value={s}>
                {shiftLabels[s]}
              </option>
            ))}
          </Select>
        </Field>
        {(date || shift) && (
          <Button
            className={shared.button}
            size="large"
            onClick={() => {
              setDate('');
              setShift('');
            }}
          >
            Clear filter
          </Button>
        )}
      </div>
      {history.isPending ? (
        <Spinner label="Reading the handovers…" />
      ) : history.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>
            {isApiError(history.error) ? history.error.message : 'The handovers could not be read.'}
          </MessageBarBody>
        </MessageBar>
      ) : shown.length === 0 ? (
        <EmptyState
          title={history.data.length === 0 ? 'No handovers yet' : 'No handover for this date and shift'}
          message={
            history.data.length === 0
              ? `Handovers of ${heading.code} appear here once a supervisor sends one.`
              : 'Change or clear the filter.'
          }
        />
      ) : (
        <ul className={shared.list} aria-label={`Handovers of ${heading.code}`}>
          {shown.map((h) => (
            <HistoryItem key={h.id} handover={h} />
          ))}
        </ul>
      )}
    </div>
  );
}
