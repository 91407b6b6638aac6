import { useEffect, useId, useRef, type ReactNode } from 'react';
import { errorText } from '@/lib/api-client';
import { Button } from './button';

/**
 * A modal confirmation (or small form) on the native <dialog>: the browser keeps focus inside it
 * and makes the page behind inert; Escape cancels. Focus goes to the element marked
 * data-autofocus (or the Cancel button) on opening, and back to where it was on closing.
 * Shared by the projects, Evaluate and admin pages.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  tone = 'primary',
  busy = false,
  busyLabel = 'Working…',
  error,
  confirmDisabled = false,
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  tone?: 'primary' | 'danger';
  busy?: boolean;
  busyLabel?: string;
  error?: ReactNode;
  confirmDisabled?: boolean;
  onConfirm: () => void;
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const returnTo = useRef<Element | null>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      returnTo.current = document.activeElement;
      dialog.showModal();
      const first = dialog.querySelector<HTMLElement>('[data-autofocus]') ?? dialog.querySelector<HTMLElement>('[data-cancel]');
      first?.focus();
    } else if (!open && dialog.open) {
      dialog.close();
      if (returnTo.current instanceof HTMLElement && returnTo.current.isConnected) returnTo.current.focus();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        if (!busy) onClose();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-plate bg-chart-raised p-0 text-ink shadow-plate backdrop:bg-trench/60"
    >
      {open ? (
        <form
          method="dialog"
          className="flex flex-col gap-3 p-5"
          onSubmit={(e) => {
            e.preventDefault();
            // React bubbles submit through the component tree: keep it from reaching a form around the dialog.
            e.stopPropagation();
            if (!busy && !confirmDisabled) onConfirm();
          }}
        >
          <h2 id={titleId} className="text-lg font-bold">
            {title}
          </h2>
          <div className="flex flex-col gap-2 text-sm">{children}</div>
          {error ? (
            <div role="alert" className="rounded-plate border border-verdict-fail/40 bg-white px-3 py-2 text-sm text-verdict-fail">
              {error}
            </div>
          ) : null}
          <div className="mt-2 flex justify-end gap-2">
            <Button data-cancel tone="quiet" onClick={onClose} disabled={busy}>
              Cancel
            </Button>
            <Button type="submit" tone={tone} disabled={busy || confirmDisabled}>
              {busy ? busyLabel : confirmLabel}
            </Button>
          </div>
        </form>
      ) : null}
    </dialog>
  );
}

/** The busy state and error of the mutation a dialog runs, to spread into <ConfirmDialog>. */
export const mutationState = (m: { isPending: boolean; isError: boolean; error: unknown }) => ({ busy: m.isPending, error: m.isError ? errorText(m.error) : undefined });
