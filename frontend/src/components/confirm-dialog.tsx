import { Alert, Button, Stack } from '@chakra-ui/react';
import { useState, type ReactElement, type ReactNode } from 'react';
import { DialogCancel, DialogShell, useDialogOpen, type DialogShellProps } from './dialog-shell';
import { toFormErrors } from './form/form-errors';

export interface ConfirmDialogProps extends Pick<DialogShellProps, 'title' | 'size'> {
  trigger?: ReactElement;
  /** What happens, in words; more controls (a reason, a password) may follow it. */
  children: ReactNode;
  /** Leave it out when this person may not go ahead: only Cancel is offered. */
  confirmLabel?: ReactNode;
  cancelLabel?: string;
  /** Red confirm button, for what cannot be taken back or locks someone out. */
  destructive?: boolean;
  confirmDisabled?: boolean;
  /** The dialog closes when it resolves; a rejection keeps it open with the answer in words. */
  onConfirm: () => Promise<unknown>;
  /** Words for a refusal the caller knows better than the server's message. */
  describeError?: (error: unknown) => string | undefined;
  open?: boolean;
  onOpenChange?: (open: boolean) => void;
}

/** A question before an action: the consequence in words, Cancel, and a confirm button that is busy while the request runs. */
export function ConfirmDialog({
  trigger,
  title,
  size = 'sm',
  children,
  confirmLabel,
  cancelLabel,
  destructive = false,
  confirmDisabled = false,
  onConfirm,
  describeError,
  open: controlledOpen,
  onOpenChange,
}: ConfirmDialogProps) {
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<string>();
  const [open, setDialogOpen] = useDialogOpen(controlledOpen, onOpenChange);
  const setOpen = (next: boolean) => {
    setProblem(undefined);
    setDialogOpen(next);
  };

  const confirm = async () => {
    setPending(true);
    setProblem(undefined);
    try {
      await onConfirm();
      setOpen(false);
    } catch (error) {
      setProblem(describeError?.(error) ?? toFormErrors(error, []).formError);
    } finally {
      setPending(false);
    }
  };

  return (
    <DialogShell
      open={open}
      onOpenChange={setOpen}
      trigger={trigger}
      title={title}
      size={size}
      role="alertdialog"
      footer={
        <>
          <DialogCancel label={cancelLabel} />
          {confirmLabel && (
            <Button
              colorPalette={destructive ? 'red' : undefined}
              loading={pending}
              disabled={confirmDisabled}
              onClick={() => void confirm()}
            >
              {confirmLabel}
            </Button>
          )}
        </>
      }
    >
      <Stack gap="3">
        {children}
        {problem && (
          <Alert.Root status="error" variant="subtle" role="alert">
            <Alert.Indicator />
            <Alert.Description>{problem}</Alert.Description>
          </Alert.Root>
        )}
      </Stack>
    </DialogShell>
  );
}
