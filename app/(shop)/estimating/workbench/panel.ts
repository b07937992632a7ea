// What every workbench panel receives: the form, a setter and the field messages.
import type { ChangeEvent } from 'react';
import type { UnitSystem } from '@/lib/plating';
import type { FieldErrors } from '@/lib/estimating/form-read';
import type { WorkbenchForm } from '@/lib/estimating/form-state';

export type PanelProps = {
  form: WorkbenchForm;
  set: (patch: Partial<WorkbenchForm>) => void;
  errors: FieldErrors;
  system: UnitSystem;
};

type TextKey = { [K in keyof WorkbenchForm]: WorkbenchForm[K] extends string ? K : never }[keyof WorkbenchForm];

/** Props for a text or number field bound to one form value. */
export function bind(p: PanelProps, key: TextKey) {
  return {
    name: key,
    value: p.form[key] as string,
    onChange: (e: ChangeEvent<HTMLInputElement | HTMLSelectElement>) => p.set({ [key]: e.target.value } as Partial<WorkbenchForm>),
    errors: p.errors[key],
  };
}
