import { object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type { LoginRequest } from '@/api/contract';

export const signInSchema: ObjectSchema<LoginRequest> = object({
  email: string()
    .trim()
    .required('Type the e-mail address you sign in with.')
    .email('That does not look like an e-mail address (name@company.com).'),
  password: string().required('Type your password.'),
});
