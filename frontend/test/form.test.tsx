import { screen } from '@testing-library/react';
import * as yup from 'yup';
import { Form } from '@/components/form/form';
import { toFormErrors } from '@/components/form/form-errors';
import { FormField } from '@/components/form/form-field';
import { ApiError } from '@/lib/api-client';
import { renderWithProviders } from './render';

const unprocessable = new ApiError({
  statusCode: 422,
  message: 'Validation failed',
  errors: [
    { field: 'email', code: 'taken', message: 'A user with this e-mail address already exists.' },
    { field: 'roles.0', code: 'unknown_role', message: 'Choose one of the listed roles.' },
    { field: 'laboratoryId', code: 'missing', message: 'The laboratory no longer exists.' },
  ],
});

describe('toFormErrors', () => {
  it('puts each 422 error on its top-level field and keeps the rest for the form', () => {
    expect(toFormErrors(unprocessable, ['email', 'name', 'roles'])).toEqual({
      fieldErrors: {
        email: 'A user with this e-mail address already exists.',
        roles: 'Choose one of the listed roles.',
      },
      formError: 'The laboratory no longer exists.',
    });
  });

  it('shows the message of an error without field details on the form', () => {
    const tooMany = new ApiError({ statusCode: 429, message: 'Too many attempts. Wait a minute and try again.' });
    expect(toFormErrors(tooMany, ['email'])).toEqual({ fieldErrors: {}, formError: 'Too many attempts. Wait a minute and try again.' });
  });

  it('does not leak internals of a browser-side failure', () => {
    expect(toFormErrors(new TypeError('x is undefined'), ['email']).formError).toMatch(/Reload the page/);
  });
});

describe('Form', () => {
  it('shows a 422 answer beside the fields it concerns', async () => {
    const onSubmit = vi.fn().mockRejectedValue(unprocessable);
    const { user } = renderWithProviders(
      <Form
        initialValues={{ email: '', name: '' }}
        validationSchema={yup.object({ email: yup.string().required(), name: yup.string().trim().required() })}
        onSubmit={onSubmit}
        submitLabel="Send invitation"
      >
        <FormField name="email" label="E-mail" type="email" />
        <FormField name="name" label="Full name" />
      </Form>,
    );

    await user.type(await screen.findByLabelText('E-mail'), 'eli.varga@lab.example');
    await user.type(screen.getByLabelText('Full name'), '  Eli Varga  ');
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText('A user with this e-mail address already exists.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Full name')).not.toHaveAttribute('aria-invalid');
    // The field outside this form still reaches the user.
    expect(screen.getByRole('alert')).toHaveTextContent('The laboratory no longer exists.');
    // Values reach the caller cast by the schema (trimmed).
    expect(onSubmit.mock.calls[0]?.[0]).toEqual({ email: 'eli.varga@lab.example', name: 'Eli Varga' });
  });
});
