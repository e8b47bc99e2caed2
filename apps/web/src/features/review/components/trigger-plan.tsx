import {
  Button,
  Field,
  Input,
  makeStyles,
  Subtitle2,
  Text,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { CalendarDateInput, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { AcceptedRule, LapsedAcceptance, RoundRule } from '@/features/review/api/review';
import { useReviewAction } from '@/features/review/api/review';
import { RuleClockLine } from '@/features/review/components/rule-clock';
import { isApiError } from '@/lib/api-client';

export interface TriggerPlanProps {
  projectId: string;
  roundId: string;
  rules: RoundRule[];
  /** Fired rules held by an accepted standing condition (listed, not raising the level). */
  accepted?: AcceptedRule[];
  /** Fired rules whose acceptance lapsed, with why. */
  lapsed?: LapsedAcceptance[];
  /** The caller is an engineer (may withdraw an acceptance taken on this round). */
  canWithdraw?: boolean;
  /** Formats a time in the project's zone. */
  when: (iso: string) => string;
}

const useStyles = makeStyles({
  list: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '12px',
  },
  rule: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
    paddingBlock: tokens.spacingVerticalS,
    borderTop: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  clock: { listStyle: 'none', margin: 0, padding: 0 },
  muted: { color: tokens.colorNeutralForeground2 },
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalS, maxWidth: '42rem' },
  control: { minHeight: `${TOUCH_TARGET_PX}px` },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
});

function AcknowledgeForm({
  projectId,
  roundId,
  rule,
}: {
  projectId: string;
  roundId: string;
  rule: RoundRule;
}) {
  const styles = useStyles();
  const action = useReviewAction(projectId, roundId);
  const [actionTaken, setActionTaken] = useState('');
  const [note, setNote] = useState('');
  const failure = action.error
    ? isApiError(action.error)
      ? action.error.message
      : 'Something went wrong.'
    : null;
  return (
    <form
      className={styles.form}
      aria-label={`Acknowledge: ${rule.summary}`}
      onSubmit={(e) => {
        e.preventDefault();
        action.mutate({ kind: 'acknowledge', ruleId: rule.ruleId, body: { actionTaken, note } });
      }}
    >
      <Field label="What was done" required validationMessage={failure ?? undefined}>
        <Textarea resize="vertical" value={actionTaken} onChange={(_, d) => setActionTaken(d.value)} />
      </Field>
      <Field label="Note">
        <Input className={styles.control} size="large" value={note} onChange={(_, d) => setNote(d.value)} />
      </Field>
      <Button
        className={styles.button}
        type="submit"
        size="large"
        disabled={action.isPending || actionTaken.trim() === ''}
      >
        Acknowledge
      </Button>
    </form>
  );
}

/** A number typed with a comma or a point, or null when empty. */
const numberOf = (text: string): number | null =>
  text.trim() === '' ? null : Number(text.trim().replace(',', '.'));

/** The engineer accepts a fired rule's standing condition for a chainage range or until a date. */
function AcceptForm({
  projectId,
  roundId,
  rule,
  onCancel,
}: {
  projectId: string;
  roundId: string;
  rule: RoundRule;
  onCancel: () => void;
}) {
  const styles = useStyles();
  const action = useReviewAction(projectId, roundId);
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [until, setUntil] = useState('');
  const [reason, setReason] = useState('');
  const failure = action.error
    ? isApiError(action.error)
      ? { message: action.error.message, fields: action.error.fields ?? {} }
      : { message: 'Something went wrong.', fields: {} as Record<string, string> }
    : null;
  const red = rule.level === 'red';
  return (
    <form
      className={styles.form}
      aria-label={`Accept the standing condition: ${rule.summary}`}
      onSubmit={(e) => {
        e.preventDefault();
        action.mutate({
          kind: 'accept',
          ruleId: rule.ruleId,
          body: {
            fromChainage: numberOf(from),
            toChainage: numberOf(to),
            until: until === '' ? null : `${until}T23:59:59.999Z`,
            reason,
          },
        });
      }}
    >
      <Text>
        While the acceptance holds, this rule is listed as accepted and does not raise the level of this
        heading&apos;s rounds. It is raised again when the face leaves the range, the date passes, or the
        condition changes (a new set, a steeper dip, another value or class).
      </Text>
      <div className={styles.row}>
        <Field label="From chainage (m)" validationMessage={failure?.fields.fromChainage}>
          <Input
            className={styles.control}
            size="large"
            inputMode="decimal"
            value={from}
            onChange={(_, d) => setFrom(d.value)}
          />
        </Field>
        <Field
          label="To chainage (m)"
          validationMessage={failure?.fields.toChainage}
          hint="A range, a date, or both"
        >
          <Input
            className={styles.control}
            size="large"
            inputMode="decimal"
            value={to}
            onChange={(_, d) => setTo(d.value)}
          />
        </Field>
        <Field label="Until (date)" validationMessage={failure?.fields.until}>
          <CalendarDateInput
            className={styles.control}
            label="Until (date)"
            value={until}
            onChange={setUntil}
          />
        </Field>
      </div>
      <Field
        label="Your reason"
        required
        hint={
          red
            ? 'A red rule is accepted only with your written reason (at least 20 characters).'
            : 'Why the condition is covered.'
        }
        validationMessage={
          failure?.fields.reason ??
          (failure && !Object.keys(failure.fields).length ? failure.message : undefined)
        }
      >
        <Textarea resize="vertical" value={reason} onChange={(_, d) => setReason(d.value)} />
      </Field>
      <div className={styles.row}>
        <Button
          className={styles.button}
          type="submit"
          appearance="primary"
          size="large"
          disabled={action.isPending || reason.trim() === ''}
        >
          Accept the condition
        </Button>
        <Button className={styles.button} size="large" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const rangeText = (a: AcceptedRule): string =>
  [
    a.fromChainage !== null || a.toChainage !== null
      ? `chainage ${a.fromChainage ?? '…'} to ${a.toChainage ?? '…'} m`
      : '',
    a.until ? `until ${a.until.slice(0, 10)}` : '',
  ]
    .filter(Boolean)
    .join(', ');

/** The accepted standing conditions of the round, each with the engineer's reason (and Withdraw). */
function AcceptedList({
  projectId,
  roundId,
  accepted,
  canWithdraw,
  when,
}: {
  projectId: string;
  roundId: string;
  accepted: AcceptedRule[];
  canWithdraw: boolean;
  when: (iso: string) => string;
}) {
  const styles = useStyles();
  const action = useReviewAction(projectId, roundId);
  return (
    <ul className={styles.list} aria-label="Accepted standing conditions">
      {accepted.map((a) => (
        <li key={a.acceptanceId} className={styles.rule} data-testid="accepted-rule">
          <Text weight="semibold">{`Accepted (${a.level}, not raising the level): ${a.summary}`}</Text>
          <Text className={styles.muted}>{a.detail}</Text>
          <Text>{`${a.acceptedByName}, ${when(a.acceptedAt)} — ${rangeText(a)}: ${a.reason}`}</Text>
          {canWithdraw && a.acceptedHere ? (
            <Button
              className={styles.button}
              size="large"
              disabled={action.isPending}
              onClick={() => action.mutate({ kind: 'withdraw', acceptanceId: a.acceptanceId })}
            >
              Withdraw the acceptance
            </Button>
          ) : null}
        </li>
      ))}
    </ul>
  );
}

/** The trigger plan of the round: each fired rule, its clock, its owner's acknowledgement, and acceptances. */
export function TriggerPlan({
  projectId,
  roundId,
  rules,
  accepted = [],
  lapsed = [],
  canWithdraw = false,
  when,
}: TriggerPlanProps) {
  const styles = useStyles();
  const [open, setOpen] = useState<string[]>([]);
  const [accepting, setAccepting] = useState<string | null>(null);
  if (rules.length === 0 && accepted.length === 0) return null;
  return (
    <section aria-label="Trigger plan">
      <Subtitle2 as="h3">Trigger plan</Subtitle2>
      <ul className={styles.list}>
        {rules.map((rule) => (
          <li key={rule.ruleId} className={styles.rule} data-testid="round-rule">
            <ul className={styles.clock}>
              <RuleClockLine rule={rule} />
            </ul>
            <Text className={styles.muted}>{`${rule.detail} What to do: ${rule.action}`}</Text>
            {rule.acknowledgement ? (
              <Text>
                {`Acknowledged by ${rule.acknowledgement.byName} (${rule.acknowledgement.role}), ${when(rule.acknowledgement.at)}: ${rule.acknowledgement.actionTaken}` +
                  (rule.acknowledgement.note ? ` — ${rule.acknowledgement.note}` : '')}
              </Text>
            ) : rule.canAcknowledge ? (
              open.includes(rule.ruleId) ? (
                <AcknowledgeForm projectId={projectId} roundId={roundId} rule={rule} />
              ) : (
                <Button
                  className={styles.button}
                  size="large"
                  onClick={() => setOpen((o) => [...o, rule.ruleId])}
                >
                  Acknowledge…
                </Button>
              )
            ) : (
              <Text className={styles.muted}>{`Waiting for the ${rule.ownerRole} to acknowledge it.`}</Text>
            )}
            {lapsed
              .filter((l) => l.ruleId === rule.ruleId)
              .map((l) => (
                <Text key={l.acceptanceId} weight="semibold" data-testid="lapsed-acceptance">
                  {`Raised again: ${l.why}.`}
                </Text>
              ))}
            {rule.canAccept ? (
              accepting === rule.ruleId ? (
                <AcceptForm
                  projectId={projectId}
                  roundId={roundId}
                  rule={rule}
                  onCancel={() => setAccepting(null)}
                />
              ) : (
                <Button className={styles.button} size="large" onClick={() => setAccepting(rule.ruleId)}>
                  Accept as a standing condition…
                </Button>
              )
            ) : null}
          </li>
        ))}
      </ul>
      {accepted.length > 0 ? (
        <AcceptedList
          projectId={projectId}
          roundId={roundId}
          accepted={accepted}
          canWithdraw={canWithdraw}
          when={when}
        />
      ) : null}
    </section>
  );
}
