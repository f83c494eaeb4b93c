import { ALL_ROLES, type Role } from '@meritline/shared';
import * as yup from 'yup';

export const rolesField = yup
  .array(
    yup
      .mixed<Role>()
      .oneOf([...ALL_ROLES])
      .required(),
  )
  .required()
  .min(1, 'Choose at least one role.');

export const nameField = yup.string().trim().required('Enter the full name.').max(120, 'Use at most 120 characters.');
