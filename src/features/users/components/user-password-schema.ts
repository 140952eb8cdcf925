import * as Yup from 'yup';

export const minPasswordLength = 10;

export const temporaryPassword = () =>
  Yup.string()
    .required('Set a temporary password.')
    .min(minPasswordLength, `Use at least ${minPasswordLength} characters.`);
