'use client';

import { useFormStatus } from 'react-dom';
import { Button, type ButtonProps } from './button';

/**
 * A submit button that knows when its form's action is running (React's form status), so
 * forms need not thread a pending flag through. An explicit `pending` prop still wins.
 */
export function SubmitButton({ pending, ...rest }: Omit<ButtonProps, 'type'>) {
  const status = useFormStatus();
  return <Button type="submit" pending={pending ?? status.pending} {...rest} />;
}
