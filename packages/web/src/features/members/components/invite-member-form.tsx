import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useInviteMember } from '../api/invite-member';
import { ROLES } from '../api/list-members';
import { type InviteValues, inviteSchema } from '../invite-schema';
import { ROLE_DESCRIPTIONS } from './role-descriptions';

/** Invites someone by e-mail with a role; the link works once, for seven days. */
export function InviteMemberForm({ organisationId }: { organisationId: string }) {
  const id = useId();
  const invite = useInviteMember();
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<InviteValues>({
    resolver: zodResolver(inviteSchema),
    mode: 'onTouched',
    defaultValues: { email: '', role: 'viewer' },
  });
  const onSubmit = handleSubmit(async (values) => {
    try {
      await invite.mutateAsync({ organisationId, ...values });
      reset();
    } catch {
      // Shown by FormFailure.
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-lg font-semibold">
        Invite someone
      </h2>
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="off"
        error={errors.email?.message}
        {...register('email')}
      />
      <SelectField label="Role" error={errors.role?.message} {...register('role')}>
        {ROLES.map((role) => (
          <option key={role} value={role}>
            {ROLE_DESCRIPTIONS[role]}
          </option>
        ))}
      </SelectField>
      <FormFailure error={invite.error} />
      <div role="status" className="text-sm text-abyss-soft empty:hidden">
        {invite.isSuccess && !invite.isPending ? `Invitation sent to ${invite.data.email}.` : ''}
      </div>
      <div>
        <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send the invitation'}
        </button>
      </div>
    </form>
  );
}
