import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { ArrowSyncRegular } from '@fluentui/react-icons';
import { EmptyState, PageHeader, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { configQueryOptions } from '@/api/resources/config';
import { guarded } from '@/app/routes/session-guard';
import type { LocalAccess } from '@/features/mail/api/get-local-access';
import { localAccessQueryOptions, useLocalAccess } from '@/features/mail/api/get-local-access';
import { mailQueryOptions, useMail } from '@/features/mail/api/get-mail';
import { jobsQueryOptions, useJobs } from '@/features/mail/api/jobs';
import { JobsPanel } from '@/features/mail/components/jobs-panel';
import { MailInbox } from '@/features/mail/components/mail-inbox';
import { useConfig } from '@/features/system/api/get-config';

/** Local mode and the instance operator (a flag on the account, not a project role). */
function mayReadLocalMail(localMode: boolean, access: LocalAccess): boolean {
  return localMode && access.localMode && access.operator;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      const config = await queryClient.ensureQueryData(configQueryOptions());
      if (!config.localMode) return null;
      const access = await queryClient.ensureQueryData(localAccessQueryOptions());
      if (mayReadLocalMail(config.localMode, access))
        await Promise.all([
          queryClient.ensureQueryData(mailQueryOptions()),
          queryClient.ensureQueryData(jobsQueryOptions()),
        ]);
      return null;
    });

const useStyles = makeStyles({
  touch: { minHeight: `${TOUCH_TARGET_PX}px` },
  note: { marginBottom: tokens.spacingVerticalL },
});

function Inbox() {
  const styles = useStyles();
  const { data: messages, refetch, isFetching } = useMail();
  const jobs = useJobs();
  return (
    <>
      <PageHeader
        title="Local mail"
        subtitle={`What Roundbook sent while running locally: ${messages.length} ${messages.length === 1 ? 'e-mail' : 'e-mails'}, newest first`}
        actions={
          <Button
            className={styles.touch}
            size="large"
            icon={<ArrowSyncRegular />}
            disabled={isFetching}
            onClick={() => {
              void refetch();
              void jobs.refetch();
            }}
          >
            {isFetching || jobs.isFetching ? 'Checking…' : 'Check for new'}
          </Button>
        }
      />
      <JobsPanel overview={jobs.data} />
      <MailInbox messages={messages} />
    </>
  );
}

/** Local mail: the SMTP fake's inbox and the jobs queue, for the instance operator, in local mode only. */
export function MailRoute() {
  const { data: config } = useConfig();
  if (!config.localMode) {
    return (
      <EmptyState
        title="Local mail is off"
        message="This Roundbook sends real e-mail, so there is no local inbox to show."
      />
    );
  }
  return <OperatorOnly localMode={config.localMode} />;
}

function OperatorOnly({ localMode }: { localMode: boolean }) {
  const { data: access } = useLocalAccess();
  if (!mayReadLocalMail(localMode, access)) {
    return (
      <EmptyState
        title="For the instance operator"
        message="Only the person who runs this Roundbook reads its local inbox; being a project admin is not enough."
      />
    );
  }
  return <Inbox />;
}
