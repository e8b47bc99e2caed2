import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { FormikInputField, TOUCH_TARGET_PX } from '@roundbook/ui';
import { Form, Formik } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { LoginRequest, LoginResponse } from '@/api/contract';
import { useLogin } from '@/features/auth/api/login';
import { signInSchema } from '@/features/auth/schemas/sign-in.schema';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';

export interface SignInFormProps {
  /** Called with the API's answer once the credentials are accepted. */
  onSignedIn: (result: LoginResponse) => void;
}

interface FormProblem {
  title: string;
  detail: string;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  submit: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%' },
});

/** Turns a failed sign-in into words a person at the portal can act on. */
export function describeSignInProblem(error: unknown): FormProblem {
  if (!isApiError(error)) {
    return { title: 'Signing in did not work', detail: 'Something unexpected went wrong. Try again.' };
  }
  switch (error.code) {
    case 'INVALID_CREDENTIALS':
      return {
        title: 'E-mail or password not recognised',
        detail: 'Check both and try again. Passwords are case-sensitive.',
      };
    case 'TOO_MANY_REQUESTS':
      return {
        title: 'Too many attempts',
        detail: 'Sign-in is paused for this address for a short while. Wait a minute, then try again.',
      };
    case NETWORK_ERROR_CODE:
      return {
        title: 'Roundbook server not reachable',
        detail: 'Check the network connection (or that Roundbook is running) and try again.',
      };
    case 'VALIDATION_FAILED':
      return { title: 'Some details need fixing', detail: 'See the messages under the fields.' };
    default:
      return { title: 'Signing in did not work', detail: error.message };
  }
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const styles = useStyles();
  const loginMutation = useLogin();
  const [problem, setProblem] = useState<FormProblem | null>(null);

  const submit = async (values: LoginRequest, helpers: FormikHelpers<LoginRequest>) => {
    setProblem(null);
    try {
      const result = await loginMutation.mutateAsync({
        email: values.email.trim(),
        password: values.password,
      });
      onSignedIn(result);
    } catch (error) {
      if (isApiError(error) && error.fields !== undefined) helpers.setErrors(error.fields);
      setProblem(describeSignInProblem(error));
    }
  };

  return (
    <Formik<LoginRequest>
      initialValues={{ email: '', password: '' }}
      validationSchema={signInSchema}
      onSubmit={submit}
    >
      {({ isSubmitting }) => (
        <Form className={styles.form} noValidate aria-label="Sign in">
          <FormikInputField
            name="email"
            label="E-mail"
            type="email"
            inputMode="email"
            autoComplete="username"
            required
          />
          <FormikInputField
            name="password"
            label="Password"
            type="password"
            autoComplete="current-password"
            required
          />
          {problem !== null && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>{problem.title}</MessageBarTitle>
                  {problem.detail}
                </MessageBarBody>
              </MessageBar>
            </div>
          )}
          <Button
            type="submit"
            appearance="primary"
            size="large"
            className={styles.submit}
            disabled={isSubmitting}
            icon={isSubmitting ? <Spinner size="tiny" /> : undefined}
          >
            {isSubmitting ? 'Signing in…' : 'Sign in'}
          </Button>
        </Form>
      )}
    </Formik>
  );
}
