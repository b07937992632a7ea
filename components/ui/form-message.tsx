import { cx } from './cx';
import { StatusShape } from './status-shape';

export type FormMessageTone = 'error' | 'success' | 'info';

/** Accepts the usual action state shape (`{ status, message }`) or an explicit tone and message. */
export type FormMessageProps = {
  state?: { status?: string; message?: string | null } | null;
  tone?: FormMessageTone;
  message?: string | null;
  className?: string;
  id?: string;
};

const tones: Record<FormMessageTone, { box: string; shape: 'out' | 'ok' | 'none' }> = {
  error: { box: 'border-out/40 bg-out-soft text-out', shape: 'out' },
  success: { box: 'border-ok/40 bg-ok-soft text-ok', shape: 'ok' },
  info: { box: 'border-action/30 bg-action-soft text-action', shape: 'none' },
};

function resolveTone(props: FormMessageProps): FormMessageTone {
  if (props.tone) return props.tone;
  const status = props.state?.status;
  if (status === 'success' || status === 'ok') return 'success';
  if (status === 'info') return 'info';
  return 'error';
}

/**
 * The form-level message (a business rule, a saved confirmation). The live region is always in the
 * page so the message is announced when it appears; errors are announced assertively.
 */
export function FormMessage(props: FormMessageProps) {
  const message = props.message ?? props.state?.message ?? null;
  const tone = resolveTone(props);
  const t = tones[tone];
  return (
    <div id={props.id} aria-live={tone === 'error' ? 'assertive' : 'polite'} aria-atomic="true" className={props.className}>
      {message ? (
        <p className={cx('flex items-start gap-2 rounded-md border px-3 py-2 text-sm font-medium', t.box)}>
          {t.shape === 'none' ? (
            <InfoIcon />
          ) : (
            <StatusShape status={t.shape} className="mt-0.5 size-4" />
          )}
          <span>{message}</span>
        </p>
      ) : null}
    </div>
  );
}

function InfoIcon() {
  return (
    <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true" focusable="false">
      <circle cx="8" cy="8" r="6.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
      <path d="M8 7v4.2M8 4.6v.1" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}
