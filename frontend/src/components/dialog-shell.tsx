import { Button, CloseButton, Dialog, Portal } from '@chakra-ui/react';
import { useState, type ReactElement, type ReactNode } from 'react';

export interface DialogShellProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  /** The button that opens the dialog; leave it out when the caller opens the dialog itself. */
  trigger?: ReactElement;
  title: ReactNode;
  /** A sentence under the title, read out with the dialog by screen readers. */
  description?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
  size?: 'xs' | 'sm' | 'md' | 'lg' | 'xl';
  /** `alertdialog` for a question that interrupts, such as a confirmation. */
  role?: 'dialog' | 'alertdialog';
  scrollBehavior?: 'inside' | 'outside';
  initialFocusEl?: () => HTMLElement | null;
}

/** The one frame every dialog of the app shares: title, close button, body, optional footer, Escape and focus handling. */
export function DialogShell({
  open,
  onOpenChange,
  trigger,
  title,
  description,
  children,
  footer,
  size = 'md',
  role = 'dialog',
  scrollBehavior,
  initialFocusEl,
}: DialogShellProps) {
  return (
    <Dialog.Root
      open={open}
      onOpenChange={(event) => onOpenChange(event.open)}
      size={size}
      role={role}
      scrollBehavior={scrollBehavior}
      initialFocusEl={initialFocusEl}
    >
      {trigger && <Dialog.Trigger asChild>{trigger}</Dialog.Trigger>}
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb={footer ? undefined : '6'}>
              {description && (
                <Dialog.Description mb="5" color="fg.muted">
                  {description}
                </Dialog.Description>
              )}
              {children}
            </Dialog.Body>
            {footer && <Dialog.Footer>{footer}</Dialog.Footer>}
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}

/** The Cancel button of a dialog footer or form: closes the dialog it sits in. */
export function DialogCancel({ label = 'Cancel' }: { label?: string }) {
  return (
    <Dialog.ActionTrigger asChild>
      <Button variant="outline">{label}</Button>
    </Dialog.ActionTrigger>
  );
}

/** Open state the dialog keeps itself, unless the caller passes `open` to hold it; `onOpenChange` hears every change. */
export function useDialogOpen(open: boolean | undefined, onOpenChange: ((open: boolean) => void) | undefined) {
  const [ownOpen, setOwnOpen] = useState(false);
  const setOpen = (next: boolean) => {
    setOwnOpen(next);
    onOpenChange?.(next);
  };
  return [open ?? ownOpen, setOpen] as const;
}
