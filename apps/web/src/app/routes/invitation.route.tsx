import {
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Text,
  Title1,
  tokens,
} from '@fluentui/react-components';
import { RoleBadge } from '@roundbook/ui';
import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { LoginResponse } from '@/api/contract';
import { CautionNote } from '@/app/caution-note';
import { HighContrastSwitch } from '@/app/high-contrast-switch';
import { useInvitation } from '@/features/team/api/invitation';
import { AcceptInvitationForm } from '@/features/team/components/accept-invitation-form';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';
import { saveSession } from '@/lib/session';

const useStyles = makeStyles({
  page: {
    flexGrow: 1,
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'center',
    justifyContent: 'center',
    padding: tokens.spacingHorizontalXL,
    rowGap: tokens.spacingVerticalXL,
  },
  topBar: { alignSelf: 'stretch', display: 'flex', justifyContent: 'flex-end' },
  panel: {
    width: '100%',
    maxWidth: '32rem',
    boxSizing: 'border-box',
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalL,
    padding: tokens.spacingHorizontalXXL,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusXLarge,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderTop: `${tokens.strokeWidthThickest} solid ${tokens.colorBrandStroke1}`,
    boxShadow: tokens.shadow8,
  },
  wordmark: { display: 'block', margin: 0, color: tokens.colorBrandForeground1 },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'auto 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    margin: 0,
    alignItems: 'center',
  },
  term: { color: tokens.colorNeutralForeground2 },
  detail: { margin: 0, fontWeight: tokens.fontWeightSemibold },
  caution: { width: '100%', maxWidth: '32rem' },
});

function explain(error: unknown): { title: string; message: string } {
  if (isApiError(error) && error.code === NETWORK_ERROR_CODE) {
    return {
      title: 'Roundbook server not reachable',
      message: 'Check the connection and open the link again.',
    };
  }
  if (isApiError(error) && error.status === 404) {
    return {
      title: 'This invitation link no longer works',
      message: `${error.message} Links expire after a while and work only once. Ask the project admin to send a new invitation.`,
    };
  }
  return {
    title: 'The invitation could not be opened',
    message: isApiError(error) ? error.message : 'Try again.',
  };
}

/** Public page behind the link in an invitation e-mail: see the invitation, then join the project. */
export function InvitationRoute() {
  const styles = useStyles();
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const invitation = useInvitation(token);

  const onAccepted = (result: LoginResponse) => {
    queryClient.clear();
    saveSession({ accessToken: result.accessToken, expiresAt: result.expiresAt, user: result.user });
    void navigate('/', { replace: true });
  };

  return (
    <div className={styles.page}>
      <div className={styles.topBar}>
        <HighContrastSwitch />
      </div>
      <main className={styles.panel}>
        <Title1 as="h1" className={styles.wordmark}>
          Roundbook
        </Title1>
        {invitation.isPending && <Spinner label="Opening the invitation…" />}
        {invitation.isError && (
          <div role="alert">
            <MessageBar intent="error" layout="multiline">
              <MessageBarBody>
                <MessageBarTitle>{explain(invitation.error).title}</MessageBarTitle>
                {explain(invitation.error).message}
              </MessageBarBody>
            </MessageBar>
            <p>
              <Link to="/sign-in">Go to sign-in</Link>
            </p>
          </div>
        )}
        {invitation.isSuccess && (
          <>
            <Text as="p" size={400}>
              You are invited to join a project in Roundbook.
            </Text>
            <dl className={styles.facts} aria-label="Invitation">
              <dt className={styles.term}>Project</dt>
              <dd className={styles.detail}>{invitation.data.projectName}</dd>
              <dt className={styles.term}>Role</dt>
              <dd className={styles.detail}>
                <RoleBadge role={invitation.data.role} />
              </dd>
              <dt className={styles.term}>E-mail</dt>
              <dd className={styles.detail}>{invitation.data.email}</dd>
            </dl>
            <Text as="p">
              {invitation.data.accountExists
                ? 'This e-mail already has a Roundbook account. Enter its password to join.'
                : 'Create your account: your name as colleagues know it, and a password.'}
            </Text>
            <AcceptInvitationForm token={token} invitation={invitation.data} onAccepted={onAccepted} />
          </>
        )}
      </main>
      <div className={styles.caution}>
        <CautionNote />
      </div>
    </div>
  );
}
