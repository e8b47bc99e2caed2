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
import type { InvitationInfo } from '@/api/contract';
import type { AcceptedInvitation } from '@/features/team/api/invitation';
import { useAcceptInvitation } from '@/features/team/api/invitation';
import type { NewAccountValues } from '@/features/team/schemas/team.schema';
import { newAccountSchema } from '@/features/team/schemas/team.schema';
import { applyServerErrors } from '@/lib/form-errors';

export interface AcceptInvitationFormProps {
  token: string;
  invitation: InvitationInfo;
  onAccepted: (result: AcceptedInvitation) => void;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  submit: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%' },
});

/** Creates the account for the invited address (name prefilled with what the admin typed) and joins. */
export function AcceptInvitationForm({ token, invitation, onAccepted }: AcceptInvitationFormProps) {
  const styles = useStyles();
  const accept = useAcceptInvitation(token);
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (values: NewAccountValues, helpers: FormikHelpers<NewAccountValues>) => {
    setProblem(null);
    try {
      onAccepted(await accept.mutateAsync({ name: values.name.trim(), password: values.password }));
    } catch (error) {
      // A 409 (the address already has an account) comes back with its message: sign in with it first.
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<NewAccountValues>
      initialValues={{ name: invitation.name, password: '', repeat: '' }}
      validationSchema={newAccountSchema}
      onSubmit={submit}
    >
      {({ isSubmitting }) => (
        <Form className={styles.form} noValidate aria-label="Create your account and join">
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
            Create account and join
          </Button>
        </Form>
      )}
    </Formik>
  );
}
