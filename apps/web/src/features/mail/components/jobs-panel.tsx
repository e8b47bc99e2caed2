import {
  Badge,
  Button,
  Caption1,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
} from '@fluentui/react-components';
import { ArrowClockwiseRegular } from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { BackgroundJob, JobsOverview } from '@/features/mail/api/jobs';
import { useRetryJob } from '@/features/mail/api/jobs';

export interface JobsPanelProps {
  overview: JobsOverview;
}

const useStyles = makeStyles({
  panel: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXL,
  },
  counts: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalL },
  error: { color: tokens.colorPaletteRedForeground1, wordBreak: 'break-word' },
  retry: { minHeight: `${TOUCH_TARGET_PX}px` },
});

const STATE_WORDS: Record<
  BackgroundJob['state'],
  { label: string; color: 'informative' | 'brand' | 'success' | 'danger' }
> = {
  pending: { label: 'Waiting', color: 'informative' },
  running: { label: 'Running', color: 'brand' },
  done: { label: 'Done', color: 'success' },
  dead: { label: 'Gave up', color: 'danger' },
};

const at = (iso: string): string => new Date(iso).toISOString().slice(0, 19).replace('T', ' ') + ' UTC';

/** The jobs worker's queue for the instance operator: what waits, what failed and why, and a retry. */
export function JobsPanel({ overview }: JobsPanelProps) {
  const styles = useStyles();
  const retry = useRetryJob();
  const [problem, setProblem] = useState<string | null>(null);
  const { counts, jobs } = overview;

  const onRetry = (job: BackgroundJob) => {
    setProblem(null);
    retry.mutate(job.id, {
      onError: (e) => setProblem(e instanceof Error ? e.message : 'The job could not be retried.'),
    });
  };

  return (
    <section className={styles.panel} aria-labelledby="jobs-title">
      <Subtitle1 as="h2" id="jobs-title">
        Background jobs
      </Subtitle1>
      <div className={styles.counts} aria-label="Jobs by state">
        <Text>{counts.pending} waiting</Text>
        <Text>{counts.running} running</Text>
        <Text>{counts.dead} gave up</Text>
        <Text>{counts.done} done</Text>
      </div>
      {problem !== null && (
        <MessageBar intent="error">
          <MessageBarBody>{problem}</MessageBarBody>
        </MessageBar>
      )}
      {jobs.length === 0 ? (
        <Text>Nothing waiting: every job has run.</Text>
      ) : (
        <Table aria-label="Jobs not done">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Job</TableHeaderCell>
              <TableHeaderCell>State</TableHeaderCell>
              <TableHeaderCell>Attempts</TableHeaderCell>
              <TableHeaderCell>Next attempt</TableHeaderCell>
              <TableHeaderCell>Last error</TableHeaderCell>
              <TableHeaderCell>Retry</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {jobs.map((job) => (
              <TableRow key={job.id}>
                <TableCell>
                  <Text block>{job.summary ?? job.kind}</Text>
                  <Caption1>{job.kind}</Caption1>
                </TableCell>
                <TableCell>
                  <Badge appearance="tint" color={STATE_WORDS[job.state].color}>
                    {STATE_WORDS[job.state].label}
                  </Badge>
                </TableCell>
                <TableCell>
                  {job.attempts} of {job.maxAttempts}
                </TableCell>
                <TableCell>{job.state === 'pending' ? at(job.nextAttemptAt) : '—'}</TableCell>
                <TableCell>
                  {job.lastError === null ? '—' : <span className={styles.error}>{job.lastError}</span>}
                </TableCell>
                <TableCell>
                  {job.state === 'pending' || job.state === 'dead' ? (
                    <Button
                      className={styles.retry}
                      icon={<ArrowClockwiseRegular />}
                      disabled={retry.isPending}
                      aria-label={`Retry ${job.summary ?? job.kind} now`}
                      onClick={() => onRetry(job)}
                    >
                      {job.state === 'dead' ? 'Start over' : 'Run now'}
                    </Button>
                  ) : (
                    '—'
                  )}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
    </section>
  );
}
