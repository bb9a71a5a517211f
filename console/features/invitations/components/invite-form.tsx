import { useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { SelectField, TextField } from '@console/components/ui/field';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { ROLES, roleLabel } from '@console/utils/roles';
import { friendlyZodError } from '@console/utils/validation-messages';
import type { Invitation } from '@shared/schemas/invitations';
import { createInvitationInputSchema, useCreateInvitation } from '../api/create-invitation';

type InviteFormProps = {
  /** Only an owner may invite an owner. */
  viewerIsOwner: boolean;
  onInvited: (invitation: Invitation) => void;
};

export function InviteForm({ viewerIsOwner, onInvited }: InviteFormProps) {
  const formRef = useRef<HTMLFormElement>(null);
  const idempotencyKey = useRef(crypto.randomUUID());
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const create = useCreateInvitation({
    onSuccess: (invitation) => {
      formRef.current?.reset();
      idempotencyKey.current = crypto.randomUUID();
      onInvited(invitation);
    },
  });
  const errors = { ...fieldErrorsFromProblem(create.error), ...clientErrors };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = createInvitationInputSchema.safeParse(Object.fromEntries(new FormData(form)), { error: friendlyZodError });
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    create.mutate({ input: parsed.data, idempotencyKey: idempotencyKey.current });
  };

  return (
    <form
      ref={formRef}
      noValidate
      onSubmit={onSubmit}
      onChange={() => {
        idempotencyKey.current = crypto.randomUUID();
      }}
      className="space-y-4"
    >
      {create.error && <ProblemAlert error={create.error} />}
      <div className="grid items-start gap-4 sm:grid-cols-[minmax(0,1fr)_11rem_auto]">
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="off"
          placeholder="new.colleague@kestrelbay.example"
          error={errors.email}
          required
        />
        <SelectField label="Role" name="role" defaultValue="analyst" error={errors.role}>
          {ROLES.map((role) => (
            <option key={role} value={role} disabled={role === 'owner' && !viewerIsOwner}>
              {roleLabel(role)}
            </option>
          ))}
        </SelectField>
        <Button type="submit" isPending={create.isPending} className="sm:mt-7">
          {create.isPending ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}
