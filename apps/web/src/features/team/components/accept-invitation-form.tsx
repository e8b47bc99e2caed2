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
import type { InvitationInfo, LoginResponse } from '@/api/contract';
import { useAcceptInvitation } from '@/features/team/api/invitation';
import type { NewAccountValues } from '@/features/team/schemas/team.schema';
import { existingAccountSchema, newAccountSchema } from '@/features/team/schemas/team.schema';
import { applyServerErrors } from '@/lib/form-errors';

export interface AcceptInvitationFormProps {
  token: string;
  invitation: InvitationInfo;
  onAccepted: (result: LoginResponse) => void;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  submit: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%' },
});

/** Joins the project: a new account chooses a name and password; an existing one confirms its password. */
export function AcceptInvitationForm({ token, invitation, onAccepted }: AcceptInvitationFormProps) {
  const styles = useStyles();
  const accept = useAcceptInvitation(token);
  const [problem, setProblem] = useState<string | null>(null);
  const isNew = !invitation.accountExists;

  const submit = async (values: NewAccountValues, helpers: FormikHelpers<NewAccountValues>) => {
    setProblem(null);
    try {
      const result = await accept.mutateAsync(
        isNew ? { name: values.name.trim(), password: values.password } : { password: values.password },
      );
      onAccepted(result);
    } catch (error) {
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<NewAccountValues>
      initialValues={{ name: invitation.name, password: '', repeat: '' }}
      validationSchema={isNew ? newAccountSchema : existingAccountSchema}
      onSubmit={submit}
    >
      {({ isSubmitting }) => (
        <Form className={styles.form} noValidate aria-label="Join the project">
          {isNew ? (
            <>
              <FormikInputField name="name" label="Your name" autoComplete="name" required />
              <FormikInputField
                name="password"
                label="Choose a password"
                type="password"
                autoComplete="new-password"
                hint="At least 10 characters"
                required
              />
              <FormikInputField
                name="repeat"
                label="Type it again"
                type="password"
                autoComplete="new-password"
                required
              />
            </>
          ) : (
            <FormikInputField
              name="password"
              label="Password of your Roundbook account"
              type="password"
              autoComplete="current-password"
              required
            />
          )}
          {problem !== null && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Not joined yet</MessageBarTitle>
                  {problem}
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
            {isNew ? 'Create account and join' : 'Join the project'}
          </Button>
        </Form>
      )}
    </Formik>
  );
}
