import { useRef, type ReactNode } from 'react';
import * as RadixDialog from '@radix-ui/react-dialog';
import { Button } from './button';

interface ModalProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  /** Read out when the dialog opens; also its accessible name. */
  title: ReactNode;
  /** A line under the title, read out with it. */
  description?: ReactNode;
  children: ReactNode;
  /** 'sheet' fills the viewport (a gate monitor, a printed page); 'card' sits centred over the dimmed page. */
  size?: 'card' | 'sheet';
  /** Hides the visible title (it stays the dialog's name), for screens that draw their own headline. */
  titleHidden?: boolean;
  /**
   * Where focus lands once the dialog has closed. By default the control that had focus when it opened; an action
   * that removes that control (a round closed, a row decided) names the next sensible place instead.
   */
  returnFocus?: () => HTMLElement | null | undefined;
}

/**
 * The one modal dialog of the console, on Radix's dialog: focus moves in and is trapped, Esc and the Close button
 * close it, the page behind is hidden from screen readers, and focus goes back where the user was.
 */
export function Modal({ open, onOpenChange, title, description, children, size = 'card', titleHidden, returnFocus }: ModalProps) {
  // Radix returns focus only to its own Trigger; our dialogs open from buttons anywhere, so remember the opener.
  const opener = useRef<HTMLElement | null>(null);
  return (
    <RadixDialog.Root open={open} onOpenChange={onOpenChange}>
      <RadixDialog.Portal>
        <RadixDialog.Overlay className={size === 'sheet' ? 'fixed inset-0 z-40 bg-white print:hidden' : 'fixed inset-0 z-40 bg-ink/60'} />
        <RadixDialog.Content
          // Without a description Radix must be told there is none, or it warns on every open.
          {...(description ? {} : { 'aria-describedby': undefined })}
          onOpenAutoFocus={() => {
            opener.current = document.activeElement instanceof HTMLElement && document.activeElement !== document.body ? document.activeElement : null;
          }}
          onCloseAutoFocus={(e) => {
            e.preventDefault();
            const target = returnFocus?.() ?? (opener.current?.isConnected ? opener.current : null);
            target?.focus();
          }}
          className={
            size === 'sheet'
              ? 'fixed inset-0 z-50 overflow-auto bg-white text-ink print:static print:overflow-visible'
              : 'fixed left-1/2 top-1/2 z-50 max-h-[90vh] w-[min(36rem,94vw)] -translate-x-1/2 -translate-y-1/2 overflow-auto rounded-lg border-2 border-ink bg-card p-5 text-ink shadow-xl'
          }
        >
          <RadixDialog.Title className={titleHidden ? 'sr-only' : 'text-2xl font-bold text-harbour'}>{title}</RadixDialog.Title>
          {description && <RadixDialog.Description className="mt-1 text-ink-soft">{description}</RadixDialog.Description>}
          {children}
        </RadixDialog.Content>
      </RadixDialog.Portal>
    </RadixDialog.Root>
  );
}

/** The dialog's own close control, so every dialog closes the same way (Esc does the same). */
export function ModalClose({ children = 'Close', variant = 'quiet' }: { children?: ReactNode; variant?: 'primary' | 'secondary' | 'quiet' }) {
  return (
    <RadixDialog.Close asChild>
      <Button variant={variant}>{children}</Button>
    </RadixDialog.Close>
  );
}

interface ConfirmProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  title: string;
  /** What happens if the user confirms, in words. */
  consequence: ReactNode;
  confirmLabel: string;
  cancelLabel: string;
  pending?: boolean;
  onConfirm: () => void;
  /** Shown inside the dialog when the action failed, so the user can retry or cancel without losing the context. */
  problem?: ReactNode;
  danger?: boolean;
  returnFocus?: ModalProps['returnFocus'];
}

/** A yes-or-no question before an action that cannot be undone from the same screen. */
export function ConfirmDialog({ open, onOpenChange, title, consequence, confirmLabel, cancelLabel, pending, onConfirm, problem, danger, returnFocus }: ConfirmProps) {
  return (
    <Modal open={open} onOpenChange={onOpenChange} title={title} description={consequence} returnFocus={returnFocus}>
      {problem}
      <div className="mt-4 flex flex-wrap justify-end gap-2">
        <ModalClose>{cancelLabel}</ModalClose>
        <Button variant={danger ? 'danger' : 'primary'} disabled={pending} onClick={onConfirm}>
          {pending ? 'Working…' : confirmLabel}
        </Button>
      </div>
    </Modal>
  );
}
