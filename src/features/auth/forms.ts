// Yup rules for the sign-in and set-password forms. They mirror shared/schemas/users.ts (the server's
// zod schemas stay the authority); tests/web/auth-forms.test.ts checks both give the same verdict.
import * as yup from 'yup';
import { z } from 'zod';

/** The same pattern zod's z.email() applies on the server, so both sides agree on every address. */
export const emailPattern = z.regexes.email;

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

export const signInFormSchema = yup.object({
  email: yup.string().trim().required('Enter your e-mail address').max(320, 'Enter a valid e-mail address').matches(emailPattern, 'Enter a valid e-mail address'),
  password: yup.string().required('Enter your password').max(PASSWORD_MAX, 'Use at most 200 characters'),
});
export type SignInFormValues = yup.InferType<typeof signInFormSchema>;

export const setPasswordFormSchema = yup.object({
  password: yup
    .string()
    .required('Choose a password')
    .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
    .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`),
  confirm: yup
    .string()
    .required('Type the password again')
    .oneOf([yup.ref('password')], 'The two passwords differ'),
});
export type SetPasswordFormValues = yup.InferType<typeof setPasswordFormSchema>;
