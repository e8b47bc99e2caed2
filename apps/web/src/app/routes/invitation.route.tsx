import {
  Button,
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
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { CautionNote } from '@/app/caution-note';
import { HighContrastSwitch } from '@/app/high-contrast-switch';
import type { AcceptedInvitation } from '@/features/team/api/invitation';
import { useAcceptInvitation, useInvitation } from '@/features/team/api/invitation';
import { AcceptInvitationForm } from '@/features/team/components/accept-invitation-form';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';
import { clearSession, readSession, saveSession } from '@/lib/session';

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

/**
 * Public page behind the link in an invitation e-mail. It shows the invited address; only that address
 * joins: signed in as it, with one button; not signed in, by creating the account for it (or signing in
 * first when it already has one); signed in as someone else, after signing out.
 */
export function InvitationRoute() {
  const styles = useStyles();
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const invitation = useInvitation(token);
  const join = useAcceptInvitation(token);
  const [signedInAs, setSignedInAs] = useState(() => readSession()?.user.email ?? null);
  const next = `/sign-in?next=${encodeURIComponent(`/invitation/${token}`)}`;

  const onAccepted = (result: AcceptedInvitation) => {
    queryClient.clear();
    if (result.session) saveSession(result.session);
    void navigate('/', { replace: true });
  };
  const signOut = () => {
    clearSession();
    queryClient.clear();
    setSignedInAs(null);
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
              <dt className={styles.term}>For the address</dt>
              <dd className={styles.detail}>{invitation.data.email}</dd>
            </dl>
            {signedInAs === invitation.data.email ? (
              <>
                <Text as="p">You are signed in with this address. Join with your account:</Text>
                {join.isError && (
                  <div role="alert">
                    <MessageBar intent="error" layout="multiline">
                      <MessageBarBody>
                        <MessageBarTitle>Not joined yet</MessageBarTitle>
                        {isApiError(join.error) ? join.error.message : 'Try again.'}
                      </MessageBarBody>
                    </MessageBar>
                  </div>
                )}
                <Button
                  appearance="primary"
                  size="large"
                  disabled={join.isPending}
                  icon={join.isPending ? <Spinner size="tiny" /> : undefined}
                  onClick={() => join.mutate({}, { onSuccess: onAccepted })}
                >
                  Join the project
                </Button>
              </>
            ) : signedInAs !== null ? (
              <>
                <MessageBar intent="warning" layout="multiline">
                  <MessageBarBody>
                    <MessageBarTitle>This invitation is for another address</MessageBarTitle>
                    You are signed in as {signedInAs}. Only {invitation.data.email} can accept it: sign out,
                    then sign in with that address or create its account here.
                  </MessageBarBody>
                </MessageBar>
                <Button appearance="secondary" size="large" onClick={signOut}>
                  Sign out
                </Button>
              </>
            ) : (
              <>
                <Text as="p">
                  New to Roundbook? Create the account for this address: your name as colleagues know it, and
                  a password.
                </Text>
                <AcceptInvitationForm token={token} invitation={invitation.data} onAccepted={onAccepted} />
                <Text as="p">
                  Already have a Roundbook account for {invitation.data.email}?{' '}
                  <Link to={next}>Sign in with it</Link>, then you come back here to join.
                </Text>
              </>
            )}
          </>
        )}
      </main>
      <div className={styles.caution}>
        <CautionNote />
      </div>
    </div>
  );
}
