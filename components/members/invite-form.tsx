import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { applyServerErrors, FormTextField, zodResolver } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { inviteBodySchema, type InviteBody } from '@/shared/schemas/organisation';
import { useInvitePerson } from './queries';

type InviteValues = z.input<typeof inviteBodySchema>;
const fields = ['name', 'email'] as const;
const empty: InviteValues = { name: '', email: '' };

/** Invites a person to the organisation by name and e-mail; errors appear beside the field at fault. */
export function InviteForm() {
  const invite = useInvitePerson();
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<InviteValues, unknown, InviteBody>({
    resolver: zodResolver(inviteBodySchema),
    defaultValues: empty,
  });

  const submit = handleSubmit(async (body) => {
    setFormError(null);
    setSentTo(null);
    try {
      const invitation = await invite.mutateAsync(body);
      reset(empty);
      setSentTo(invitation.email);
    } catch (error) {
      setFormError(applyServerErrors(error, fields, setError));
    }
  });

  return (
    <View style={styles.form}>
      <FormTextField control={control} name="name" label="Name" testID="invite-name" autoComplete="name" />
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        testID="invite-email"
        keyboardType="email-address"
        autoCapitalize="none"
        autoComplete="email"
      />
      {formError ? (
        <AppText variant="error" role="alert">
          {formError}
        </AppText>
      ) : null}
      {sentTo ? <AppText role="status">Invitation sent to {sentTo}.</AppText> : null}
      <Button label="Send invitation" busy={formState.isSubmitting} onPress={() => void submit()} style={styles.start} testID="invite-submit" />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  start: { alignSelf: 'flex-start' },
});
