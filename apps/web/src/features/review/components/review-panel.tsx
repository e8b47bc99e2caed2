import {
  Button,
  Card,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle1,
  Subtitle2,
  Tab,
  TabList,
  Text,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { CheckmarkCircleRegular } from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { FormEvent } from 'react';
import { useState } from 'react';
import type {
  ReviewDecision,
  ReviewSection,
  RoundReview,
  SupportClassOption,
} from '@/features/review/api/review';
import { useReviewAction, useRoundReview } from '@/features/review/api/review';
import { ReviewCaution } from '@/features/review/components/review-caution';
import { RevisionCompare } from '@/features/review/components/revision-compare';
import { SincePreviousRound } from '@/features/review/components/since-previous';
import { SubmittedSketch } from '@/features/review/components/submitted-sketch';
import { TriggerPlan } from '@/features/review/components/trigger-plan';
import { needsReason, SECTIONS, sectionLabels } from '@/features/review/utils/format';
import { isApiError } from '@/lib/api-client';

export interface ReviewPanelProps {
  projectId: string;
  roundId: string;
  /** The project's support classes (the confirmation offers the active ones). */
  supportClasses: SupportClassOption[];
  /** The time zone the sign-off time is shown in. */
  timeZone: string;
}

const useStyles = makeStyles({
  root: {
    padding: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    marginBlock: tokens.spacingVerticalL,
    borderTop: `${tokens.strokeWidthThickest} solid ${tokens.colorBrandStroke1}`,
  },
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM, maxWidth: '42rem' },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  control: { minHeight: `${TOUCH_TARGET_PX}px` },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
  tab: { minHeight: `${TOUCH_TARGET_PX}px` },
  list: { listStyle: 'none', margin: 0, padding: 0, display: 'flex', flexDirection: 'column', rowGap: '8px' },
  comment: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    padding: tokens.spacingVerticalS,
    borderLeft: `4px solid ${tokens.colorPaletteMarigoldBorderActive}`,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalXS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground2 },
  detail: { margin: 0 },
  muted: { color: tokens.colorNeutralForeground2 },
});

const errorOf = (error: unknown): { message: string; fields: Record<string, string> } | null =>
  error === null || error === undefined
    ? null
    : isApiError(error)
      ? { message: error.message, fields: error.fields ?? {} }
      : { message: error instanceof Error ? error.message : 'Something went wrong.', fields: {} };

function when(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', {
    dateStyle: 'medium',
    timeStyle: 'short',
    timeZone,
  }).format(new Date(iso));
}

function ConfirmForm({
  projectId,
  review,
  classes,
}: {
  projectId: string;
  review: RoundReview;
  classes: SupportClassOption[];
}) {
  const styles = useStyles();
  const action = useReviewAction(projectId, review.roundId);
  const [classId, setClassId] = useState(review.recommendedClassId ?? '');
  const [length, setLength] = useState(
    review.recommendedRoundLength === null ? '' : String(review.recommendedRoundLength),
  );
  const [reason, setReason] = useState('');
  const [comments, setComments] = useState('');
  const [password, setPassword] = useState('');
  const chosen = classes.find((c) => c.id === classId);
  const roundLength = length.trim() === '' ? null : Number(length.replace(',', '.'));
  const asksReason = needsReason(classId, roundLength, review.recommendedClassId, chosen?.maxRoundLength);
  const failure = errorOf(action.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    action.mutate({
      kind: 'confirm',
      body: {
        version: review.version,
        classId,
        roundLength: roundLength ?? Number.NaN,
        reason: asksReason ? reason : '',
        comments,
        password,
      },
    });
  };
  const recommended = classes.find((c) => c.id === review.recommendedClassId);
  return (
    <form className={styles.form} onSubmit={submit} aria-label="Confirm the round">
      <Text>
        {`The geologist recommends ${recommended ? `${recommended.code} (${recommended.name})` : 'no class'}` +
          (review.recommendedRoundLength !== null
            ? ` and a next round of ${review.recommendedRoundLength} m.`
            : '.')}
      </Text>
      <div className={styles.row}>
        <Field label="Support class to build" required validationMessage={failure?.fields.classId}>
          <Select
            className={styles.control}
            size="large"
            value={classId}
            onChange={(_, d) => setClassId(d.value)}
          >
            <option value="" disabled>
              Choose a class
            </option>
            {classes
              .filter((c) => !c.retired || c.id === review.recommendedClassId)
              .map((c) => (
                <option key={c.id} value={c.id}>
                  {`${c.code} — ${c.name} (rounds up to ${c.maxRoundLength} m)${c.id === review.recommendedClassId ? ' · recommended' : ''}`}
                </option>
              ))}
          </Select>
        </Field>
        <Field
          label="Next round length (m)"
          required
          validationMessage={failure?.fields.roundLength}
          hint={chosen ? `${chosen.code} allows up to ${chosen.maxRoundLength} m` : undefined}
        >
          <Input
            className={styles.control}
            size="large"
            inputMode="decimal"
            value={length}
            onChange={(_, d) => setLength(d.value)}
          />
        </Field>
      </div>
      {asksReason ? (
        <Field
          label="Reason"
          required
          hint="Another class than recommended, or a round longer than the class allows, needs your reason."
          validationMessage={failure?.fields.reason}
        >
          <Textarea resize="vertical" value={reason} onChange={(_, d) => setReason(d.value)} />
        </Field>
      ) : null}
      <Field label="Comments">
        <Textarea resize="vertical" value={comments} onChange={(_, d) => setComments(d.value)} />
      </Field>
      <Field
        label="Your password, to sign"
        required
        hint="Your name, role and the time are recorded with the confirmation."
        validationMessage={failure?.fields.password}
      >
        <Input
          className={styles.control}
          size="large"
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(_, d) => setPassword(d.value)}
        />
      </Field>
      {failure ? (
        <MessageBar intent="error" layout="multiline">
          <MessageBarBody>{failure.message}</MessageBarBody>
        </MessageBar>
      ) : null}
      <Button
        className={styles.button}
        type="submit"
        appearance="primary"
        size="large"
        disabled={action.isPending || classId === '' || roundLength === null || password === ''}
      >
        {action.isPending ? 'Signing…' : 'Sign and confirm'}
      </Button>
    </form>
  );
}

function ReturnForm({ projectId, review }: { projectId: string; review: RoundReview }) {
  const styles = useStyles();
  const action = useReviewAction(projectId, review.roundId);
  const [texts, setTexts] = useState<Partial<Record<ReviewSection, string>>>({});
  const comments = SECTIONS.filter((s) => (texts[s] ?? '').trim() !== '').map((section) => ({
    section,
    text: (texts[section] ?? '').trim(),
  }));
  const failure = errorOf(action.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    action.mutate({ kind: 'return', body: { version: review.version, comments } });
  };
  return (
    <form className={styles.form} onSubmit={submit} aria-label="Return the round">
      <Text>Say what needs another look, beside the section it concerns. Leave the others empty.</Text>
      {SECTIONS.map((section) => (
        <Field key={section} label={sectionLabels[section]}>
          <Textarea
            resize="vertical"
            value={texts[section] ?? ''}
            onChange={(_, d) => setTexts((t) => ({ ...t, [section]: d.value }))}
          />
        </Field>
      ))}
      {failure ? (
        <MessageBar intent="error" layout="multiline">
          <MessageBarBody>{failure.message}</MessageBarBody>
        </MessageBar>
      ) : null}
      <Button
        className={styles.button}
        type="submit"
        appearance="primary"
        size="large"
        disabled={action.isPending || comments.length === 0}
      >
        {action.isPending ? 'Returning…' : 'Return to the geologist'}
      </Button>
    </form>
  );
}

function CorrectForm({ projectId, review }: { projectId: string; review: RoundReview }) {
  const styles = useStyles();
  const action = useReviewAction(projectId, review.roundId);
  const [reason, setReason] = useState('');
  const failure = errorOf(action.error);
  return (
    <form
      className={styles.form}
      aria-label="Correct the confirmed round"
      onSubmit={(e) => {
        e.preventDefault();
        action.mutate({ kind: 'correct', body: { version: review.version, reason } });
      }}
    >
      <Field
        label="Reason for a correction"
        hint="A correction opens a new revision as a draft; it is reviewed again. This confirmation stays readable."
        validationMessage={failure?.fields.reason ?? failure?.message}
      >
        <Textarea resize="vertical" value={reason} onChange={(_, d) => setReason(d.value)} />
      </Field>
      <Button
        className={styles.button}
        type="submit"
        size="large"
        disabled={action.isPending || reason.trim() === ''}
      >
        Open a correction
      </Button>
    </form>
  );
}

function Decision({
  decision,
  timeZone,
  classes,
}: {
  decision: ReviewDecision;
  timeZone: string;
  classes: SupportClassOption[];
}) {
  const styles = useStyles();
  const recommended = classes.find((c) => c.id === decision.recommendedClassId);
  return (
    <dl className={styles.facts} data-testid="confirmation">
      <dt className={styles.term}>Class to build</dt>
      <dd className={styles.detail}>{decision.classCode ?? '—'}</dd>
      <dt className={styles.term}>Next round length</dt>
      <dd className={styles.detail}>{decision.roundLength === null ? '—' : `${decision.roundLength} m`}</dd>
      {decision.classId !== decision.recommendedClassId ? (
        <>
          <dt className={styles.term}>Recommended</dt>
          <dd
            className={styles.detail}
          >{`${recommended?.code ?? 'none'} (the geologist's recommendation)`}</dd>
        </>
      ) : null}
      {decision.reason ? (
        <>
          <dt className={styles.term}>Reason</dt>
          <dd className={styles.detail}>{decision.reason}</dd>
        </>
      ) : null}
      {decision.comments ? (
        <>
          <dt className={styles.term}>Comments</dt>
          <dd className={styles.detail}>{decision.comments}</dd>
        </>
      ) : null}
      <dt className={styles.term}>Signed</dt>
      <dd className={styles.detail}>
        {`${decision.signedByName} (${decision.signedRole}), ${when(decision.signedAt, timeZone)}`}
      </dd>
    </dl>
  );
}

function OpenComments({ projectId, review }: { projectId: string; review: RoundReview }) {
  const styles = useStyles();
  const action = useReviewAction(projectId, review.roundId);
  // At the next review the engineer reads the last return's comments, resolved and open; the geologist
  // (and anyone else) reads the open ones to work through.
  const atReview = review.status === 'submitted' && review.returnComments.length > 0;
  const list = atReview ? review.returnComments : review.openComments;
  if (list.length === 0) return null;
  return (
    <section aria-label="Return comments">
      <Subtitle2 as="h3">
        {atReview ? 'Comments of the last return' : 'Return comments to work through'}
      </Subtitle2>
      <ul className={styles.list}>
        {list.map((c) => (
          <li key={c.id} className={styles.comment} data-testid="return-comment">
            <Text weight="semibold">{sectionLabels[c.section]}</Text>
            <Text>{c.text}</Text>
            <Text className={styles.muted}>{`— ${c.authorName}, revision ${c.revision}`}</Text>
            {c.resolvedAt !== null ? (
              <Text weight="semibold">{`Resolved${c.resolvedByName ? ` by ${c.resolvedByName}` : ''}`}</Text>
            ) : atReview ? (
              <Text weight="semibold">Still open</Text>
            ) : null}
            {c.resolvedAt === null && review.canResolve ? (
              <Button
                className={styles.button}
                icon={<CheckmarkCircleRegular />}
                disabled={action.isPending}
                onClick={() => action.mutate({ kind: 'resolve', commentId: c.id })}
              >
                Resolve
              </Button>
            ) : null}
          </li>
        ))}
      </ul>
      <Text className={styles.muted}>
        Each comment is also shown at the top of the section it concerns, and stays open until it is marked
        resolved.
      </Text>
    </section>
  );
}

/** Review: the engineer confirms or returns a submitted round; everyone sees the outcome and the comments. */
export function ReviewPanel({ projectId, roundId, supportClasses, timeZone }: ReviewPanelProps) {
  const styles = useStyles();
  const { data: review, isPending, error } = useRoundReview(projectId, roundId);
  const [mode, setMode] = useState<'confirm' | 'return'>('confirm');
  if (isPending) return <Spinner label="Reading the review…" />;
  if (error)
    return (
      <MessageBar intent="error" layout="multiline">
        <MessageBarBody>{`The review could not be read: ${error.message}`}</MessageBarBody>
      </MessageBar>
    );
  const decides = review.canConfirm.allowed || review.canReturn.allowed;
  // An engineer who may return but not confirm (separation of duties): no Confirm tab, and why not.
  const returnOnly = !review.canConfirm.allowed && review.canReturn.allowed;
  const shown = returnOnly ? 'return' : mode;
  return (
    <Card className={styles.root} aria-label="Review" data-testid="review-panel">
      <Subtitle1 as="h2">Review</Subtitle1>
      <ReviewCaution text={review.caution} />
      <SubmittedSketch projectId={projectId} roundId={roundId} />
      {review.sincePrevious ? <SincePreviousRound since={review.sincePrevious} /> : null}
      {review.confirmation ? (
        <section aria-label="Confirmation">
          <Subtitle2 as="h3">{`Confirmed (revision ${review.confirmation.revision})`}</Subtitle2>
          <Decision decision={review.confirmation} timeZone={timeZone} classes={supportClasses} />
        </section>
      ) : null}
      <OpenComments projectId={projectId} review={review} />
      {review.status === 'submitted' && !decides ? (
        <Text>
          {review.canConfirm.reason.startsWith('Only an engineer')
            ? 'Waiting for an engineer of the project to confirm or return it.'
            : review.canConfirm.reason}
        </Text>
      ) : null}
      {returnOnly ? (
        <MessageBar intent="info" layout="multiline" data-testid="no-confirm-reason">
          <MessageBarBody>
            <MessageBarTitle>Why Confirm is not offered to you</MessageBarTitle>
            {review.canConfirm.reason}
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {decides ? (
        <>
          <TabList
            selectedValue={shown}
            onTabSelect={(_, d) => setMode(d.value as 'confirm' | 'return')}
            size="large"
          >
            {returnOnly ? null : (
              <Tab className={styles.tab} value="confirm">
                Confirm
              </Tab>
            )}
            <Tab className={styles.tab} value="return">
              Return with comments
            </Tab>
          </TabList>
          {shown === 'confirm' ? (
            review.canConfirm.allowed ? (
              <ConfirmForm projectId={projectId} review={review} classes={supportClasses} />
            ) : (
              <MessageBar intent="warning" layout="multiline">
                <MessageBarBody>{review.canConfirm.reason}</MessageBarBody>
              </MessageBar>
            )
          ) : (
            <ReturnForm projectId={projectId} review={review} />
          )}
        </>
      ) : null}
      <TriggerPlan
        projectId={projectId}
        roundId={roundId}
        rules={review.rules}
        accepted={review.acceptedRules}
        lapsed={review.lapsedAcceptances}
        canWithdraw={review.canAcceptConditions}
        when={(iso) => when(iso, timeZone)}
      />
      {review.canCorrect.allowed ? <CorrectForm projectId={projectId} review={review} /> : null}
      {review.decisions.length > 0 ? (
        <RevisionCompare projectId={projectId} roundId={roundId} when={(iso) => when(iso, timeZone)} />
      ) : null}
      {review.decisions.length > 0 ? (
        <section aria-label="Review history">
          <Subtitle2 as="h3">History</Subtitle2>
          <ul className={styles.list}>
            {review.decisions.map((d) => (
              <li key={d.id}>
                <Text>
                  {`Revision ${d.revision}: ${d.decision === 'confirm' ? `confirmed ${d.classCode ?? ''}` : d.decision === 'return' ? 'returned' : 'corrected'} by ${d.signedByName}, ${when(d.signedAt, timeZone)}${d.reason ? ` — ${d.reason}` : ''}`}
                </Text>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </Card>
  );
}
