import { object, ref, string } from 'yup';
import type { ObjectSchema } from 'yup';

export interface ChangePasswordValues {
  currentPassword: string;
  newPassword: string;
  repeatPassword: string;
}

/** The same rules as the API (at least 10 characters, not the current one), said before sending. */
export const changePasswordSchema: ObjectSchema<ChangePasswordValues> = object({
  currentPassword: string().required('Type your current password.'),
  newPassword: string()
    .required('Choose a new password.')
    .min(10, 'Choose a password of at least 10 characters.')
    .max(200, 'At most 200 characters.')
    .notOneOf([ref('currentPassword')], 'Choose a password other than the current one.'),
  repeatPassword: string()
    .required('Type the new password again.')
    .oneOf([ref('newPassword')], 'The two new passwords are not the same.'),
});
