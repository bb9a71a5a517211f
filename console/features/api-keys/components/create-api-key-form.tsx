import { useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { endOfLocalDayIso, toDateInputValue } from '@console/utils/format-date';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { friendlyZodError } from '@console/utils/validation-messages';
import type { CreatedApiKey } from '@shared/schemas/api-keys';
import { createApiKeyInputSchema, useCreateApiKey } from '../api/create-api-key';
import { ScopeCheckboxes } from './scope-checkboxes';

type CreateApiKeyFormProps = {
  scopes: { name: string; description: string }[];
  onCreated: (created: CreatedApiKey) => void;
};

const tomorrow = () => {
  const date = new Date();
  date.setDate(date.getDate() + 1);
  return toDateInputValue(date);
};

export function CreateApiKeyForm({ scopes, onCreated }: CreateApiKeyFormProps) {
  const formRef = useRef<HTMLFormElement>(null);
  const idempotencyKey = useRef(crypto.randomUUID());
  const [selected, setSelected] = useState<ReadonlySet<string>>(new Set());
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});

  const createKey = useCreateApiKey({
    onSuccess: (created) => {
      formRef.current?.reset();
      setSelected(new Set());
      idempotencyKey.current = crypto.randomUUID();
      onCreated(created);
    },
  });
  const errors = { ...fieldErrorsFromProblem(createKey.error), ...clientErrors };

  // Changed values are a new request, so they get a new Idempotency-Key.
  const renewIdempotencyKey = () => {
    idempotencyKey.current = crypto.randomUUID();
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    const expiryDay = String(data.get('expiresOn') ?? '');
    const expiresAt = expiryDay ? endOfLocalDayIso(expiryDay) : undefined;
    if (expiryDay && (!expiresAt || new Date(expiresAt).getTime() <= Date.now())) {
      const found = { expiresOn: 'Pick a day from tomorrow on, or leave it empty.' };
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    const parsed = createApiKeyInputSchema.safeParse(
      { name: String(data.get('name') ?? ''), scopes: [...selected], ...(expiresAt ? { expiresAt } : {}) },
      { error: friendlyZodError },
    );
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    createKey.mutate({ input: parsed.data, idempotencyKey: idempotencyKey.current });
  };

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} onChange={renewIdempotencyKey} className="space-y-6">
      {createKey.error && <ProblemAlert error={createKey.error} />}
      <div className="grid gap-5 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <TextField
          label="Name"
          name="name"
          placeholder="KB-65 line 2 rig"
          hint="Name it after the rig or job that will use it, so the list says where each key lives."
          error={errors.name}
          maxLength={100}
          autoComplete="off"
        />
        <TextField
          label="Expires on (optional)"
          name="expiresOn"
          type="date"
          min={tomorrow()}
          hint="Empty: valid until revoked. The key stops at the end of that day."
          error={errors.expiresOn ?? errors.expiresAt}
        />
      </div>
      <ScopeCheckboxes
        scopes={scopes}
        selected={selected}
        error={errors.scopes}
        onToggle={(name, checked) =>
          setSelected((current) => {
            const next = new Set(current);
            if (checked) next.add(name);
            else next.delete(name);
            return next;
          })
        }
        onSetAll={(names) => {
          renewIdempotencyKey();
          setSelected(new Set(names));
        }}
      />
      <div className="flex items-center gap-3">
        <Button type="submit" isPending={createKey.isPending}>
          {createKey.isPending ? 'Creating key…' : 'Create key'}
        </Button>
        <p className="text-xs text-ink-500">The secret is shown once, right after creation.</p>
      </div>
    </form>
  );
}
