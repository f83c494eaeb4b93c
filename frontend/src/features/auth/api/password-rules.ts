import * as yup from 'yup';

export const PASSWORD_MIN_LENGTH = 10;

export const newPasswordField = yup
  .string()
  .required('Choose a password.')
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`);
