import { Button } from '@chakra-ui/react';
import { screen, waitFor } from '@testing-library/react';
import * as yup from 'yup';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { ApiError } from '@/lib/api-client';
import { renderWithProviders } from './render';

const conflict = new ApiError({ statusCode: 409, message: 'Someone else changed this record first.' });

describe('ConfirmDialog', () => {
  it('asks, shows a refusal in words and stays open, then closes once the action succeeds', async () => {
    const onConfirm = vi.fn().mockRejectedValueOnce(conflict).mockResolvedValueOnce(undefined);
    const { user } = renderWithProviders(
      <ConfirmDialog trigger={<Button>Retire</Button>} title="Retire version 2?" confirmLabel="Retire" destructive onConfirm={onConfirm}>
        No new studies can use this version.
      </ConfirmDialog>,
    );
    await user.click(screen.getByRole('button', { name: 'Retire' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Retire version 2?' });
    expect(dialog).toHaveTextContent('No new studies can use this version.');
    await user.click(screen.getByRole('button', { name: 'Retire' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Someone else changed this record first.');
    expect(dialog).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Retire' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(onConfirm).toHaveBeenCalledTimes(2);
  });

  it('closes on Escape without acting', async () => {
    const onConfirm = vi.fn();
    const { user } = renderWithProviders(
      <ConfirmDialog trigger={<Button>Delete</Button>} title="Delete the draft?" confirmLabel="Delete" onConfirm={onConfirm}>
        The data cannot be brought back.
      </ConfirmDialog>,
    );
    await user.click(screen.getByRole('button', { name: 'Delete' }));
    await screen.findByRole('alertdialog');
    await user.keyboard('{Escape}');
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(onConfirm).not.toHaveBeenCalled();
  });
});

describe('FormDialog', () => {
  const schema = yup.object({ reason: yup.string().trim().required('Say why.') });

  it('refuses an empty field on the field, puts a 422 on its field, and closes once the submission resolves', async () => {
    const onSubmit = vi
      .fn()
      .mockRejectedValueOnce(
        new ApiError({
          statusCode: 422,
          message: 'Validation failed',
          errors: [{ field: 'reason', code: 'too_long', message: 'Use at most 1000 characters.' }],
        }),
      )
      .mockResolvedValueOnce(undefined);
    const { user } = renderWithProviders(
      <FormDialog
        trigger={<Button>Withdraw</Button>}
        title="Withdraw the material?"
        description="It stays in the register for the record."
        initialValues={{ reason: '' }}
        validationSchema={schema}
        onSubmit={onSubmit}
        submitLabel="Withdraw"
      >
        <FormField name="reason" label="Reason" required />
      </FormDialog>,
    );
    await user.click(screen.getByRole('button', { name: 'Withdraw' }));
    const dialog = await screen.findByRole('dialog', { name: 'Withdraw the material?' });
    expect(dialog).toHaveAccessibleDescription('It stays in the register for the record.');
    await user.click(screen.getByRole('button', { name: 'Withdraw' }));
    expect(await screen.findByText('Say why.')).toBeInTheDocument();
    expect(onSubmit).not.toHaveBeenCalled();

    await user.type(screen.getByRole('textbox', { name: /Reason/ }), '  Lid cracked  ');
    await user.click(screen.getByRole('button', { name: 'Withdraw' }));
    expect(await screen.findByText('Use at most 1000 characters.')).toBeInTheDocument();
    expect(onSubmit.mock.calls[0]?.[0]).toEqual({ reason: 'Lid cracked' });

    await user.click(screen.getByRole('button', { name: 'Withdraw' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
  });
});
