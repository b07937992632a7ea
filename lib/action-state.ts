// What a form's server action returns to useActionState. Safe to import from client components.
export type FormState = {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  // The submitted text values (never passwords), so the form keeps what the user typed.
  values?: Record<string, string>;
};

export const initialFormState: FormState = {};
