import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { ArrowSyncRegular } from '@fluentui/react-icons';
import { EmptyState, PageHeader, TOUCH_TARGET_PX } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import type { CurrentUser } from '@/api/contract';
import { currentUserQueryOptions } from '@/api/resources/auth';
import { configQueryOptions } from '@/api/resources/config';
import { guarded } from '@/app/routes/session-guard';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { mailQueryOptions, useMail } from '@/features/mail/api/get-mail';
import { MailInbox } from '@/features/mail/components/mail-inbox';
import { useConfig } from '@/features/system/api/get-config';

function mayReadLocalMail(localMode: boolean, me: CurrentUser): boolean {
  return localMode && me.memberships.some((m) => m.role === 'admin');
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    guarded(request, async () => {
      const [config, me] = await Promise.all([
        queryClient.ensureQueryData(configQueryOptions()),
        queryClient.ensureQueryData(currentUserQueryOptions()),
      ]);
      if (mayReadLocalMail(config.localMode, me)) await queryClient.ensureQueryData(mailQueryOptions());
      return null;
    });

const useStyles = makeStyles({
  touch: { minHeight: `${TOUCH_TARGET_PX}px` },
  note: { marginBottom: tokens.spacingVerticalL },
});

function Inbox() {
  const styles = useStyles();
  const { data: messages, refetch, isFetching } = useMail();
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
            }}
          >
            {isFetching ? 'Checking…' : 'Check for new'}
          </Button>
        }
      />
      <MailInbox messages={messages} />
    </>
  );
}

/** Local mail: the SMTP fake's inbox, for admins, in local mode only. */
export function MailRoute() {
  const { data: config } = useConfig();
  const { data: me } = useCurrentUser();
  if (!config.localMode) {
    return (
      <EmptyState
        title="Local mail is off"
        message="This Roundbook sends real e-mail, so there is no local inbox to show."
      />
    );
  }
  if (!mayReadLocalMail(config.localMode, me)) {
    return (
      <EmptyState
        title="For project admins"
        message="Only people who are admin on at least one project can read the local inbox."
      />
    );
  }
  return <Inbox />;
}
