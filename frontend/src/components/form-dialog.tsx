import type { FormikValues } from 'formik';
import type { ReactElement, ReactNode } from 'react';
import { DialogCancel, DialogShell, useDialogOpen, type DialogShellProps } from './dialog-shell';
import { Form, type FormProps } from './form/form';

export interface FormDialogProps<Values extends FormikValues>
  extends
    Omit<FormProps<Values>, 'secondaryAction' | 'resetOnSuccess' | 'submitFullWidth' | 'id'>,
    Pick<DialogShellProps, 'title' | 'description' | 'size' | 'role' | 'scrollBehavior'> {
  trigger?: ReactElement;
  /** Shown above the form, after the description: notes, cautions, what a signature means. */
  notice?: ReactNode;
  /** Give both to open and close the dialog from outside (e.g. to load choices only while it is open). */
  open?: boolean;
  onOpenChange?: (open: boolean) => void;
  /** Changing it starts the form afresh, e.g. when the schema changes. */
  formKey?: string;
}

/**
 * A dialog hosting the Form wrapper: Cancel and submit buttons, the submit button busy while the request runs, the server's
 * answer in words (422 errors on their fields), and the dialog closes once `onSubmit` resolves. Throw to keep it open.
 */
export function FormDialog<Values extends FormikValues>({
  trigger,
  title,
  description,
  notice,
  size,
  role,
  scrollBehavior,
  open: controlledOpen,
  onOpenChange,
  formKey,
  onSubmit,
  ...form
}: FormDialogProps<Values>) {
  const [open, setOpen] = useDialogOpen(controlledOpen, onOpenChange);

  return (
    <DialogShell
      open={open}
      onOpenChange={setOpen}
      trigger={trigger}
      title={title}
      description={description}
      size={size}
      role={role}
      scrollBehavior={scrollBehavior}
    >
      {notice}
      <Form
        key={formKey}
        {...form}
        onSubmit={async (values, helpers) => {
          await onSubmit(values, helpers);
          setOpen(false);
        }}
        secondaryAction={<DialogCancel />}
      />
    </DialogShell>
  );
}
