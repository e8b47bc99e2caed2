import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Text,
  tokens,
} from '@fluentui/react-components';
import { FormikInputField, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMutation } from '@tanstack/react-query';
import { Form, Formik } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { ReactNode } from 'react';
import type { LoginResponse } from '@/api/contract';
import { changePassword, signOutEverywhere } from '@/api/resources/auth';
import type { ChangePasswordValues } from '@/features/auth/schemas/change-password.schema';
import { changePasswordSchema } from '@/features/auth/schemas/change-password.schema';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';

export interface AccountDialogProps {
  open: boolean;
  name: string;
  email: string;
  onClose: () => void;
  /** The password was changed: keep the new token (every other session has ended). */
  onPasswordChanged: (result: LoginResponse) => void;
  /** Every session ended, this one too: go to sign-in. */
  onSignedOutEverywhere: () => void;
  /** More sections of the account, composed by the app (the notice settings of the current project). */
  children?: ReactNode;
}

const useStyles = makeStyles({
  surface: { maxWidth: '640px', width: '100%' },
  content: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  section: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    paddingTop: tokens.spacingVerticalM,
    borderTop: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  heading: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold, margin: 0 },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/** Words a person can act on when changing the password or ending sessions did not work. */
function describeProblem(error: unknown, what: string): string {
  if (isApiError(error)) {
    if (error.code === NETWORK_ERROR_CODE) {
      return `The Roundbook server could not be reached, so ${what} did not happen. Try again when the connection is back.`;
    }
    if (error.code === 'VALIDATION_FAILED') return error.message;
    return `${what[0]?.toUpperCase() ?? ''}${what.slice(1)} did not work: ${error.message}`;
  }
  return `${what[0]?.toUpperCase() ?? ''}${what.slice(1)} did not work. Try again.`;
}

const emptyPasswords: ChangePasswordValues = { currentPassword: '', newPassword: '', repeatPassword: '' };

/**
 * The signed-in person's account: change the password (the current one asked again), or end every
 * session on every device — for a tablet lost underground or left signed in at the portal.
 */
export function AccountDialog({
  open,
  name,
  email,
  onClose,
  onPasswordChanged,
  onSignedOutEverywhere,
  children,
}: AccountDialogProps) {
  const styles = useStyles();
  const [passwordProblem, setPasswordProblem] = useState<string | null>(null);
  const [passwordChanged, setPasswordChanged] = useState(false);
  const [confirmingEverywhere, setConfirmingEverywhere] = useState(false);
  const passwordMutation = useMutation({ mutationKey: ['auth', 'password'], mutationFn: changePassword });
  const everywhereMutation = useMutation({
    mutationKey: ['auth', 'sign-out-everywhere'],
    mutationFn: signOutEverywhere,
    onSuccess: onSignedOutEverywhere,
  });

  const close = () => {
    setPasswordProblem(null);
    setPasswordChanged(false);
    setConfirmingEverywhere(false);
    everywhereMutation.reset();
    onClose();
  };

  const submitPassword = async (
    values: ChangePasswordValues,
    helpers: FormikHelpers<ChangePasswordValues>,
  ) => {
    setPasswordProblem(null);
    setPasswordChanged(false);
    try {
      const result = await passwordMutation.mutateAsync({
        currentPassword: values.currentPassword,
        newPassword: values.newPassword,
      });
      onPasswordChanged(result);
      helpers.resetForm();
      setPasswordChanged(true);
    } catch (error) {
      if (isApiError(error) && error.fields !== undefined) helpers.setErrors(error.fields);
      setPasswordProblem(describeProblem(error, 'the password change'));
    }
  };

  return (
    <Dialog open={open} onOpenChange={(_e, data) => !data.open && close()}>
      <DialogSurface className={styles.surface}>
        <DialogBody>
          <DialogTitle>Your account</DialogTitle>
          <DialogContent className={styles.content}>
            <div>
              <Text block weight="semibold">
                {name}
              </Text>
              <Text block>{email}</Text>
            </div>

            {children}

            <section className={styles.section} aria-labelledby="account-password">
              <h3 id="account-password" className={styles.heading}>
                Change password
              </h3>
              <Text>
                Every other device signed in with this account is signed out when the password changes; this
                one stays signed in.
              </Text>
              <Formik<ChangePasswordValues>
                initialValues={emptyPasswords}
                validationSchema={changePasswordSchema}
                onSubmit={submitPassword}
              >
                {({ isSubmitting }) => (
                  <Form className={styles.content} noValidate aria-label="Change password">
                    <FormikInputField
                      name="currentPassword"
                      label="Current password"
                      type="password"
                      autoComplete="current-password"
                      required
                    />
                    <FormikInputField
                      name="newPassword"
                      label="New password (at least 10 characters)"
                      type="password"
                      autoComplete="new-password"
                      required
                    />
                    <FormikInputField
                      name="repeatPassword"
                      label="New password again"
                      type="password"
                      autoComplete="new-password"
                      required
                    />
                    {passwordProblem !== null && (
                      <div role="alert">
                        <MessageBar intent="error" layout="multiline">
                          <MessageBarBody>{passwordProblem}</MessageBarBody>
                        </MessageBar>
                      </div>
                    )}
                    {passwordChanged && (
                      <div role="status">
                        <MessageBar intent="success" layout="multiline">
                          <MessageBarBody>
                            <MessageBarTitle>Password changed</MessageBarTitle>
                            Other devices are signed out and need the new password.
                          </MessageBarBody>
                        </MessageBar>
                      </div>
                    )}
                    <div className={styles.row}>
                      <Button
                        type="submit"
                        appearance="primary"
                        size="large"
                        className={styles.button}
                        disabled={isSubmitting}
                        icon={isSubmitting ? <Spinner size="tiny" /> : undefined}
                      >
                        Change password
                      </Button>
                    </div>
                  </Form>
                )}
              </Formik>
            </section>

            <section className={styles.section} aria-labelledby="account-everywhere">
              <h3 id="account-everywhere" className={styles.heading}>
                Sign out on every device
              </h3>
              <Text>
                For a tablet that was lost or left signed in: every device signed in with this account, this
                one too, has to sign in again. Changes not yet sent from another device stay on that device
                until its owner signs in there again.
              </Text>
              {everywhereMutation.isError && (
                <div role="alert">
                  <MessageBar intent="error" layout="multiline">
                    <MessageBarBody>
                      {describeProblem(everywhereMutation.error, 'signing out everywhere')}
                    </MessageBarBody>
                  </MessageBar>
                </div>
              )}
              <div className={styles.row}>
                {confirmingEverywhere ? (
                  <>
                    <Button
                      appearance="primary"
                      size="large"
                      className={styles.button}
                      disabled={everywhereMutation.isPending}
                      icon={everywhereMutation.isPending ? <Spinner size="tiny" /> : undefined}
                      onClick={() => everywhereMutation.mutate()}
                    >
                      Yes, sign out everywhere now
                    </Button>
                    <Button
                      size="large"
                      className={styles.button}
                      onClick={() => setConfirmingEverywhere(false)}
                    >
                      Keep me signed in
                    </Button>
                  </>
                ) : (
                  <Button
                    size="large"
                    className={styles.button}
                    onClick={() => setConfirmingEverywhere(true)}
                  >
                    Sign out on every device…
                  </Button>
                )}
              </div>
            </section>
          </DialogContent>
          <DialogActions>
            <Button size="large" className={styles.button} onClick={close}>
              Close
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
