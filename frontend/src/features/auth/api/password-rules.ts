import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@meritline/shared';
import * as yup from 'yup';

export { PASSWORD_MIN_LENGTH };

export const newPasswordField = yup
  .string()
  .required('Choose a password.')
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`);
