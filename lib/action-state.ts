// What a form's server action returns to useActionState. Safe to import from client components.
export type FormState = {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  // The submitted text values (never passwords), so the form keeps what the user typed.
  values?: Record<string, string>;
  // Recovery codes of a second factor, shown once when they are made.
  codes?: string[];
  // A new API token, shown once when it is made.
  secret?: string;
};

export const initialFormState: FormState = {};
