'use client';

import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cx } from './cx';

export type DialogProps = {
  open: boolean;
  /** Called for Escape, the close button, a backdrop click (when dismissible) and form method="dialog". */
  onClose: () => void;
  title: ReactNode;
  description?: ReactNode;
  children?: ReactNode;
  /** Buttons; put the safe choice first in reading order. */
  footer?: ReactNode;
  size?: 'sm' | 'md' | 'lg';
  /** Whether a click on the backdrop closes it. Off for forms that would lose typing. */
  dismissible?: boolean;
  className?: string;
};

const widths = { sm: 'max-w-sm', md: 'max-w-lg', lg: 'max-w-2xl' } as const;

/**
 * A modal on the native <dialog>: the browser traps focus, makes the page inert, closes on Escape
 * and returns focus to the opener, so none of that is re-implemented here. Focus starts on the
 * first focusable element (the close button) unless a field inside has `autoFocus`.
 */
export function Dialog({ open, onClose, title, description, children, footer, size = 'md', dismissible = true, className }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();
  // Keep the latest handler without re-running the open/close effect.
  const onCloseRef = useRef(onClose);
  useEffect(() => {
    onCloseRef.current = onClose;
  }, [onClose]);

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onClose={() => onCloseRef.current()}
      onClick={(event) => {
        // A click whose target is the <dialog> itself landed on the backdrop, outside the panel.
        if (dismissible && event.target === ref.current) ref.current?.close();
      }}
      className={cx(
        'm-auto w-[calc(100%-2rem)] rounded-lg border border-surface-line bg-surface p-0 text-ink shadow-xl backdrop:bg-ink/40',
        widths[size],
        className,
      )}
    >
      <div className="flex items-start justify-between gap-4 border-b border-surface-line px-5 py-3.5">
        <div className="min-w-0">
          <h2 id={titleId} className="text-lg font-semibold">
            {title}
          </h2>
          {description ? (
            <p id={descriptionId} className="mt-0.5 text-sm text-ink-muted">
              {description}
            </p>
          ) : null}
        </div>
        <button
          type="button"
          onClick={() => ref.current?.close()}
          aria-label="Close"
          className="-mr-2 inline-flex size-10 shrink-0 items-center justify-center rounded-md text-ink-muted hover:bg-surface-muted hover:text-ink"
        >
          <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true" focusable="false">
            <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
          </svg>
        </button>
      </div>
      {children ? <div className="max-h-[70vh] overflow-y-auto px-5 py-4">{children}</div> : null}
      {footer ? (
        <div className="flex flex-wrap justify-end gap-2 rounded-b-lg border-t border-surface-line bg-surface-muted px-5 py-3">
          {footer}
        </div>
      ) : null}
    </dialog>
  );
}
