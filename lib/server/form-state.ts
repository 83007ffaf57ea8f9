/** What every form's server action returns: one pattern for every form in the app. */
export type FormState<T = unknown> = {
  status: "idle" | "ok" | "error";
  message?: string;
  /** Field name → message, shown beside the field. */
  fieldErrors?: Record<string, string>;
  /** What the user submitted, so a failed submit keeps it (React resets uncontrolled fields). */
  values?: Record<string, string>;
  data?: T;
};

export const initialFormState: FormState = { status: "idle" };
