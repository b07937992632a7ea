import Link from 'next/link';
import type { ComponentPropsWithRef, ReactNode } from 'react';
import { cx } from './cx';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'ghost';
// `lg` is the floor size: at least 48 px in both directions for gloved hands.
export type ButtonSize = 'sm' | 'md' | 'lg';

type StyleOptions = { variant?: ButtonVariant; size?: ButtonSize; fullWidth?: boolean };

const base =
  'inline-flex items-center justify-center gap-2 rounded-md font-medium whitespace-nowrap select-none ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-60 aria-disabled:cursor-not-allowed aria-disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-action text-white shadow-sm hover:bg-action-hover',
  secondary: 'border border-surface-line bg-surface text-ink shadow-sm hover:bg-surface-muted hover:border-ink-faint',
  danger: 'bg-out text-white shadow-sm hover:brightness-90',
  ghost: 'text-action hover:bg-action-soft',
};

const sizes: Record<ButtonSize, string> = {
  sm: 'min-h-8 px-2.5 text-sm',
  md: 'min-h-10 px-4 text-sm',
  lg: 'min-h-target min-w-target px-5 text-base font-semibold',
};

// Exported so other clickable things (a file input label, a summary) can look like a button.
export function buttonClasses({ variant = 'primary', size = 'md', fullWidth }: StyleOptions = {}): string {
  return cx(base, variants[variant], sizes[size], fullWidth && 'w-full');
}

export type ButtonProps = ComponentPropsWithRef<'button'> &
  StyleOptions & {
    /** Shows a spinner, sets aria-busy and blocks further clicks while work is under way. */
    pending?: boolean;
    /** Replaces the label while pending, e.g. "Saving…". */
    pendingLabel?: ReactNode;
    /** A decorative icon before the label (hidden from assistive technology). */
    icon?: ReactNode;
  };

/** A button; `type` defaults to "button" so that only explicit submit buttons submit a form. */
export function Button({
  variant,
  size,
  fullWidth,
  pending = false,
  pendingLabel,
  icon,
  className,
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={cx(buttonClasses({ variant, size, fullWidth }), pending && 'cursor-wait', className)}
      {...rest}
    >
      {pending ? (
        <Spinner />
      ) : icon ? (
        <span aria-hidden="true" className="inline-flex shrink-0">
          {icon}
        </span>
      ) : null}
      <span>{pending && pendingLabel ? pendingLabel : children}</span>
    </button>
  );
}

export type LinkButtonProps = ComponentPropsWithRef<typeof Link> & StyleOptions & { icon?: ReactNode };

/** A link that looks like a button: use it for navigation ("New quote"), never for actions. */
export function LinkButton({ variant, size, fullWidth, icon, className, children, ...rest }: LinkButtonProps) {
  return (
    <Link className={cx(buttonClasses({ variant, size, fullWidth }), 'no-underline', className)} {...rest}>
      {icon ? (
        <span aria-hidden="true" className="inline-flex shrink-0">
          {icon}
        </span>
      ) : null}
      <span>{children}</span>
    </Link>
  );
}
