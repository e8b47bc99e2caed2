import {
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Text,
  Title1,
  tokens,
} from '@fluentui/react-components';
import { useQueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { redirect, useNavigate, useSearchParams } from 'react-router-dom';
import type { LoginResponse } from '@/api/contract';
import { CautionNote } from '@/app/caution-note';
import { HighContrastSwitch } from '@/app/high-contrast-switch';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNextPath } from '@/features/auth/utils/next-path';
import { readSession, saveSession } from '@/lib/session';

/** Someone already signed in goes straight on to where they were heading. */
export function clientLoader({ request }: LoaderFunctionArgs) {
  if (readSession() !== null) {
    return redirect(safeNextPath(new URL(request.url).searchParams.get('next')));
  }
  return null;
}

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
    maxWidth: '30rem',
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
  lead: {
    display: 'block',
    margin: 0,
    marginTop: tokens.spacingVerticalS,
    color: tokens.colorNeutralForeground2,
  },
  caution: { width: '100%', maxWidth: '30rem' },
});

export function SignInRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  const expired = params.get('reason') === 'expired';

  const onSignedIn = (result: LoginResponse) => {
    // Nothing cached for a previous person may leak into this session.
    queryClient.clear();
    saveSession({ accessToken: result.accessToken, expiresAt: result.expiresAt, user: result.user });
    void navigate(next, { replace: true });
  };

  return (
    <div className={styles.page}>
      <div className={styles.topBar}>
        <HighContrastSwitch />
      </div>
      <main className={styles.panel}>
        <div>
          <Title1 as="h1" className={styles.wordmark}>
            Roundbook
          </Title1>
          <Text as="p" size={400} className={styles.lead}>
            Face records round by round, and the handover that goes with them. Sign in with your work e-mail.
          </Text>
        </div>
        {expired && (
          <MessageBar intent="warning" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>Signed out for safety</MessageBarTitle>
              Your session ran out. Sign in again and Roundbook takes you back to the page you were on.
            </MessageBarBody>
          </MessageBar>
        )}
        <SignInForm onSignedIn={onSignedIn} />
      </main>
      <div className={styles.caution}>
        <CautionNote />
      </div>
    </div>
  );
}
