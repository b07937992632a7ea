import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { cx } from './cx';
import { StatusShape } from './status-shape';

export type FieldSize = 'md' | 'lg';

export type FieldBaseProps = {
  label: ReactNode;
  name: string;
  /** Defaults to a generated id; give one when a test or a label elsewhere needs it. */
  id?: string;
  hint?: ReactNode;
  /** Unit shown after the control and read out with it, e.g. "g/L" or "A". */
  unit?: string;
  /** This field's messages, e.g. `state.fieldErrors?.volume_l` from a server action. */
  errors?: readonly string[] | string | null;
  required?: boolean;
  /** `lg` for floor screens: 48 px targets and large type. */
  size?: FieldSize;
  /** Classes for the wrapper (layout), not the control. */
  className?: string;
};

type ControlProps = {
  id: string;
  name: string;
  required?: boolean;
  'aria-invalid'?: true;
  'aria-describedby'?: string;
  className: string;
};

type FieldProps = FieldBaseProps & { children: (control: ControlProps) => ReactNode };

function toList(errors: FieldBaseProps['errors']): readonly string[] {
  if (!errors) return [];
  return typeof errors === 'string' ? [errors] : errors;
}

const controlBase =
  'block w-full min-w-0 bg-surface text-ink placeholder:text-ink-faint disabled:bg-surface-sunken disabled:text-ink-muted';
const controlSize: Record<FieldSize, string> = {
  md: 'min-h-10 px-3 py-1.5 text-sm',
  lg: 'min-h-target px-3 py-2 text-lg',
};
const frame = 'rounded-md border border-surface-line';
const frameInvalid = 'border-out';

/**
 * Label, control, hint, unit and error list wired together: the control is described by the hint,
 * the unit and (when present) the errors; the error list sits in a live region so a new message is
 * announced without moving focus.
 */
export function Field({ label, name, id, hint, unit, errors, required, size = 'md', className, children }: FieldProps) {
  const autoId = useId();
  const controlId = id ?? `${name}-${autoId}`;
  const hintId = `${controlId}-hint`;
  const unitId = `${controlId}-unit`;
  const errorId = `${controlId}-errors`;
  const list = toList(errors);
  const isInvalid = list.length > 0;
  const describedBy = [hint ? hintId : null, unit ? unitId : null, isInvalid ? errorId : null]
    .filter(Boolean)
    .join(' ');

  const control = children({
    id: controlId,
    name,
    required,
    'aria-invalid': isInvalid || undefined,
    'aria-describedby': describedBy || undefined,
    className: cx(controlBase, controlSize[size], unit ? 'rounded-l-md border-0' : cx(frame, isInvalid && frameInvalid)),
  });

  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={controlId} className={cx('font-medium text-ink', size === 'lg' ? 'text-base' : 'text-sm')}>
        {label}
        {required ? (
          <span aria-hidden="true" className="ml-0.5 text-copper-deep">
            *
          </span>
        ) : null}
      </label>
      {unit ? (
        <div
          className={cx(
            'flex items-stretch overflow-hidden focus-within:outline-3 focus-within:outline-offset-2 focus-within:outline-action-ring',
            frame,
            isInvalid && frameInvalid,
            '[&_:focus-visible]:outline-none',
          )}
        >
          {control}
          <span
            id={unitId}
            className={cx(
              'flex shrink-0 items-center border-l border-surface-line bg-surface-muted px-3 text-ink-muted',
              size === 'lg' ? 'text-base' : 'text-sm',
            )}
          >
            {unit}
          </span>
        </div>
      ) : (
        control
      )}
      {hint ? (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      {/* Always rendered so screen readers are already watching it when a message arrives. */}
      <div id={errorId} aria-live="polite" aria-atomic="true">
        {isInvalid ? (
          <ul className="flex flex-col gap-0.5 text-sm text-out">
            {list.map((message) => (
              <li key={message} className="flex items-start gap-1.5">
                <StatusShape status="out" className="mt-0.5 size-3.5" />
                <span>{message}</span>
              </li>
            ))}
          </ul>
        ) : null}
      </div>
    </div>
  );
}

type InputOnly = Omit<ComponentPropsWithRef<'input'>, 'id' | 'name' | 'size' | 'required' | 'className'> & {
  inputClassName?: string;
};

export type TextFieldProps = FieldBaseProps & InputOnly;

export function TextField({ label, name, id, hint, unit, errors, required, size, className, inputClassName, ...input }: TextFieldProps) {
  return (
    <Field {...{ label, name, id, hint, unit, errors, required, size, className }}>
      {(control) => <input type="text" {...input} {...control} className={cx(control.className, inputClassName)} />}
    </Field>
  );
}

export type NumberFieldProps = FieldBaseProps & Omit<InputOnly, 'type' | 'inputMode'>;

/**
 * Numbers as text with a decimal keypad: `type="number"` rejects some locales' input, swallows
 * partial values and changes on scroll, so the server parses and reports instead.
 */
export function NumberField({ label, name, id, hint, unit, errors, required, size, className, inputClassName, ...input }: NumberFieldProps) {
  return (
    <Field {...{ label, name, id, hint, unit, errors, required, size, className }}>
      {(control) => (
        <input
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          {...input}
          {...control}
          className={cx(control.className, 'tabular', inputClassName)}
        />
      )}
    </Field>
  );
}

export type SelectOption = { value: string; label: string; disabled?: boolean };

export type SelectFieldProps = FieldBaseProps &
  Omit<ComponentPropsWithRef<'select'>, 'id' | 'name' | 'size' | 'required' | 'className'> & {
    options?: readonly SelectOption[];
    /** A first, empty choice such as "Choose a tank". */
    placeholder?: string;
    selectClassName?: string;
  };

export function SelectField({
  label, name, id, hint, unit, errors, required, size, className, options, placeholder, selectClassName, children, ...select
}: SelectFieldProps) {
  return (
    <Field {...{ label, name, id, hint, unit, errors, required, size, className }}>
      {(control) => (
        <select {...select} {...control} className={cx(control.className, 'pr-8', selectClassName)}>
          {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
          {options?.map((option) => (
            <option key={option.value} value={option.value} disabled={option.disabled}>
              {option.label}
            </option>
          ))}
          {children}
        </select>
      )}
    </Field>
  );
}

export type TextareaFieldProps = FieldBaseProps &
  Omit<ComponentPropsWithRef<'textarea'>, 'id' | 'name' | 'required' | 'className'> & { textareaClassName?: string };

export function TextareaField({
  label, name, id, hint, unit, errors, required, size, className, textareaClassName, rows = 3, ...textarea
}: TextareaFieldProps) {
  return (
    <Field {...{ label, name, id, hint, unit, errors, required, size, className }}>
      {(control) => <textarea rows={rows} {...textarea} {...control} className={cx(control.className, textareaClassName)} />}
    </Field>
  );
}
