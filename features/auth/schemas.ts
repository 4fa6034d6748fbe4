import { array, object, string, type InferType } from 'yup';

// One schema per input, used by the form on the client and by the server's validation middleware.

import { ROLE_LABELS, ROLES, type Role } from '@/features/access/permissions';

// The roles come from the access model; these names are kept for the forms that use them.
export const ROLE_VALUES = ROLES;
export type RoleValue = Role;
export { ROLE_LABELS };

const email = string().trim().lowercase().email('Enter a valid e-mail address.').required('Enter your e-mail address.');

export const PASSWORD_MIN = 10;
const newPassword = string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(200, 'Use at most 200 characters.')
  .required('Choose a password.');

export const signInSchema = object({
  email,
  password: string().required('Enter your password.'),
});
export type SignInInput = InferType<typeof signInSchema>;

export const MAX_INVITED_CHILDREN = 6;

export const inviteSchema = object({
  email,
  role: string()
    .oneOf([...ROLE_VALUES], 'Choose a role.')
    .required('Choose a role.'),
  /** A parent's invitation names the children it links when accepted. */
  athleteIds: array(string().uuid('Choose children of the club.').required())
    .max(MAX_INVITED_CHILDREN, `Link at most ${MAX_INVITED_CHILDREN} children in one invitation.`)
    .default([])
    .test('parents-only', 'Only a parent or guardian is linked to children.', function onlyParents(ids) {
      return !ids || ids.length === 0 || this.parent.role === 'parent';
    }),
});
export type InviteInput = InferType<typeof inviteSchema>;

export const acceptInvitationSchema = object({
  token: string().required('This link is incomplete.'),
  displayName: string().trim().min(2, 'Enter your name.').max(80).required('Enter your name.'),
  password: newPassword,
});
export type AcceptInvitationInput = InferType<typeof acceptInvitationSchema>;

export const requestResetSchema = object({ email });
export type RequestResetInput = InferType<typeof requestResetSchema>;

export const resetPasswordSchema = object({
  token: string().required('This link is incomplete.'),
  password: newPassword,
});
export type ResetPasswordInput = InferType<typeof resetPasswordSchema>;

export const invitationLookupSchema = object({ token: string().required('This link is incomplete.') });
export type InvitationLookupInput = InferType<typeof invitationLookupSchema>;

export const changePasswordSchema = object({
  currentPassword: string().required('Enter your current password.'),
  newPassword,
});
export type ChangePasswordInput = InferType<typeof changePasswordSchema>;

/** A member's new role (People, admins only). */
export const changeRoleSchema = object({
  role: string<Role>()
    .oneOf([...ROLES], 'Choose one of the roles.')
    .required('Choose one of the roles.'),
});
