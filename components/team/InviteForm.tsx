import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { View } from 'react-native';

import { applyServerError } from '@/components/api/form-errors';
import { useInviteMutation } from '@/components/api/use-team';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormSegmentedControl } from '@/components/ui/FormSegmentedControl';
import { FormTextField } from '@/components/ui/FormTextField';
import { Text } from '@/components/ui/Text';
import { type Role, ROLE_LABELS } from '@/shared/contracts/roles';
import { inviteRequestSchema } from '@/shared/contracts/team';

import { CrewMemberPicker } from './CrewMemberPicker';
import { ROLE_OPTIONS } from './role-options';

/**
 * The API's invitation schema, plus: a trainee must be linked to a crew member (the link cannot be
 * added after the invitation is accepted, and an unlinked trainee has nothing to rehearse).
 */
const inviteFormSchema = inviteRequestSchema.superRefine((v, ctx) => {
  if (v.role === 'trainee' && !v.crewMemberId) ctx.addIssue({ code: 'custom', path: ['crewMemberId'], message: "Choose the trainee's crew member." });
});


/** Props of {@link InviteForm}. */
export interface InviteFormProps {
  /** Called after the server accepted the invitation and sent the e-mail. */
  onInvited?: (email: string) => void;
}

/**
 * Invite a person by e-mail with a role (react-hook-form + the API's own zod schema). Server
 * conflicts (already a user, already invited) show beside the e-mail field; input is kept on error.
 */
export function InviteForm({ onInvited }: InviteFormProps) {
  const invite = useInviteMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm({
    resolver: zodResolver(inviteFormSchema),
    defaultValues: { email: '', name: '', role: 'planner' as Role, crewMemberId: null as string | null },
  });
  const role = useWatch({ control, name: 'role' });
  const submit = handleSubmit((values) => {
    setFormError(null);
    setSentTo(null);
    // Only a trainee is linked to a crew member; a picked member is dropped if the role changed since.
    const body = { ...values, crewMemberId: values.role === 'trainee' ? values.crewMemberId : null };
    invite.mutate(body, {
      onSuccess: ({ invitation }) => {
        setSentTo(invitation.email);
        reset({ email: '', name: '', role: values.role, crewMemberId: null });
        onInvited?.(invitation.email);
      },
      onError: (err) => {
        // 409s (email_taken, already_invited) are about the e-mail even when the server names no field.
        const msg = applyServerError(err, ['email', 'name', 'role', 'crewMemberId'], setError);
        if (msg && (err as { status?: number }).status === 409) setError('email', { type: 'server', message: msg }, { shouldFocus: true });
        else setFormError(msg);
      },
    });
  });
  return (
    <View style={gaps.lg} role="form" aria-label="Invite someone">
      <View style={gaps.xs}>
        <Text variant="heading" role="heading" aria-level={2}>
          Invite someone
        </Text>
        <Text tone="muted">They get an e-mail with a link to choose a password. The link works once, for 7 days.</Text>
      </View>
      {sentTo ? (
        <View role="status">
          <Text tone="success">Invitation sent to {sentTo}.</Text>
          <Text variant="caption" tone="muted">The e-mail goes out in the background (retried if mail is down): the list of invitations shows whether it was sent.</Text>
        </View>
      ) : null}
      <ErrorBanner error={formError} />
      <FormTextField control={control} name="name" label="Name" placeholder="First and last name" autoComplete="off" />
      <FormTextField control={control} name="email" label="E-mail" placeholder="name@example.org" inputMode="email" autoCapitalize="none" autoComplete="off" />
      <FormSegmentedControl control={control} name="role" label="Role" options={ROLE_OPTIONS} />
      <Text variant="caption" tone="muted">
        {ROLE_HELP[role]}
      </Text>
      {role === 'trainee' ? (
        <Controller
          control={control}
          name="crewMemberId"
          render={({ field, fieldState }) => (
            <CrewMemberPicker value={field.value ?? ''} onChange={(id) => field.onChange(id || null)} error={fieldState.error?.message} />
          )}
        />
      ) : null}
      <Button label="Send invitation" icon="send" loading={invite.isPending} onPress={() => void submit()} />
    </View>
  );
}

/** One line per role: what the invitee will be able to do. */
const ROLE_HELP: Record<Role, string> = {
  admin: `${ROLE_LABELS.admin}: invites people, changes roles, reads the audit log, and sees every area.`,
  planner: `${ROLE_LABELS.planner}: builds inertia profiles and composes maneuvers.`,
  reviewer: `${ROLE_LABELS.reviewer}: checks verification reports and clears or sends back versions.`,
  trainee: `${ROLE_LABELS.trainee}: rehearses cleared maneuvers and sees their own profile.`,
};
