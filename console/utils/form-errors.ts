export type FieldErrors = Record<string, string>;

type IssueLike = { path: readonly PropertyKey[]; message: string };

/** The first validation message per top-level field, from any zod-style list of issues. */
export function fieldErrorsFromIssues(issues: readonly IssueLike[]): FieldErrors {
  const byField: FieldErrors = {};
  for (const issue of issues) {
    const name = issue.path.length > 0 ? String(issue.path[0]) : '';
    if (name && !(name in byField)) byField[name] = issue.message;
  }
  return byField;
}

/** Moves the keyboard to the first field, in form order, that has a message. */
export function focusFirstInvalidField(form: HTMLFormElement, errors: FieldErrors): void {
  for (const element of Array.from(form.elements)) {
    const name = (element as HTMLInputElement).name;
    if (name && name in errors && element instanceof HTMLElement) {
      element.focus();
      return;
    }
  }
}
