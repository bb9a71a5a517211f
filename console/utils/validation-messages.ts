// Words for the shared request schemas' validation issues, so a form can reuse the server's schema as is and
// still speak to a person ("Use at least 12 characters") rather than in zod's own terms.

type IssueLike = {
  code: string;
  origin?: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  format?: string;
  input?: unknown;
  message?: string;
};

export function friendlyIssueMessage(issue: IssueLike): string | undefined {
  switch (issue.code) {
    case 'too_small':
      if (issue.origin === 'string') {
        return Number(issue.minimum) <= 1 || issue.input === ''
          ? 'This field is required.'
          : `Use at least ${issue.minimum} characters.`;
      }
      if (issue.origin === 'array') return Number(issue.minimum) <= 1 ? 'Choose at least one.' : `Choose at least ${issue.minimum}.`;
      return undefined;
    case 'too_big':
      if (issue.origin === 'string') return `Use at most ${issue.maximum} characters.`;
      return undefined;
    case 'invalid_format':
      if (issue.format === 'email') {
        return issue.input === '' ? 'This field is required.' : 'Enter an e-mail address such as name@lab.example.';
      }
      if (issue.format === 'datetime') return 'Enter a valid date.';
      return undefined;
    case 'invalid_type':
      return issue.input === undefined ? 'This field is required.' : undefined;
    default:
      return undefined;
  }
}

/** Per-parse error option for zod: `schema.safeParse(values, { error: friendlyZodError })`. */
export const friendlyZodError = (issue: IssueLike) => friendlyIssueMessage(issue);
