import { useId } from 'react';
import { controlClasses } from '@console/components/ui/field';
import { Spinner } from '@console/components/ui/spinner';
import { cn } from '@console/utils/cn';
import { ROLES, roleLabel } from '@console/utils/roles';
import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/permissions';

type MemberRoleSelectProps = {
  member: Member;
  /** Only an owner may grant the owner role or change an owner's role. */
  viewerIsOwner: boolean;
  isPending: boolean;
  onChange: (role: Role) => void;
};

export function MemberRoleSelect({ member, viewerIsOwner, isPending, onChange }: MemberRoleSelectProps) {
  const id = useId();
  const locked = member.role === 'owner' && !viewerIsOwner;
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="sr-only">
        Role of {member.displayName}
      </label>
      <select
        id={id}
        value={member.role}
        disabled={isPending || locked}
        onChange={(event) => onChange(event.target.value as Role)}
        className={cn(controlClasses, 'h-8 w-32 pr-7 text-sm')}
        title={locked ? 'Only an owner can change an owner’s role' : undefined}
      >
        {ROLES.map((role) => (
          <option key={role} value={role} disabled={role === 'owner' && !viewerIsOwner}>
            {roleLabel(role)}
          </option>
        ))}
      </select>
      {isPending && (
        <span className="inline-flex items-center gap-1 text-xs text-ink-600">
          <Spinner className="size-3.5" />
          <span className="sr-only">Saving role</span>
        </span>
      )}
    </div>
  );
}
