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
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { RoundRule } from '@/features/review/api/review';
import { useReviewAction } from '@/features/review/api/review';
import { RuleClockLine } from '@/features/review/components/rule-clock';
import { isApiError } from '@/lib/api-client';

export interface TriggerPlanProps {
  projectId: string;
  roundId: string;
  rules: RoundRule[];
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

/** The trigger plan of the round: each fired rule, its clock, and its owner's acknowledgement. */
export function TriggerPlan({ projectId, roundId, rules, when }: TriggerPlanProps) {
  const styles = useStyles();
  const [open, setOpen] = useState<string[]>([]);
  if (rules.length === 0) return null;
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
          </li>
        ))}
      </ul>
    </section>
  );
}
