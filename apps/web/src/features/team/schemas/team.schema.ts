import { mixed, object, ref, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type { AcceptInvitationRequest, InviteRequest, ProjectRole } from '@/api/contract';

export const PROJECT_ROLES: ProjectRole[] = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'];

export const inviteSchema: ObjectSchema<Required<InviteRequest>> = object({
  email: string()
    .trim()
    .required('Give the e-mail address to send the invitation to.')
    .email('Enter an e-mail address such as name@example.org.')
    .max(254, 'That address is too long.'),
  name: string().trim().max(120, 'Up to 120 characters.').default('').defined(),
  role: mixed<ProjectRole>()
    .oneOf(PROJECT_ROLES, 'Choose one of: admin, geologist, engineer, supervisor, viewer.')
    .required('Choose the role they will have.'),
});

export interface NewAccountValues {
  name: string;
  password: string;
  repeat: string;
}

export const newAccountSchema: ObjectSchema<Required<AcceptInvitationRequest> & { repeat: string }> = object({
  name: string().trim().required('Enter your name.').max(120, 'Up to 120 characters.'),
  password: string()
    .required('Choose a password.')
    .min(10, 'Use at least 10 characters.')
    .max(200, 'Use at most 200 characters.'),
  repeat: string()
    .required('Type the password again.')
    .oneOf([ref('password')], 'The two passwords differ.'),
});
