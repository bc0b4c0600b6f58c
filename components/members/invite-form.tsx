import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { inviteBodySchema } from '@/shared/schemas/organisation';
import { useInvitePerson } from './queries';

/** Invites a person to the organisation by name and e-mail; errors appear beside the field at fault. */
export function InviteForm() {
  const invite = useInvitePerson();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: inviteBodySchema,
    defaultValues: { name: '', email: '' },
    fields: ['name', 'email'],
    onValid: async (body) => {
      setSentTo(null);
      const invitation = await invite.mutateAsync(body);
      setSentTo(invitation.email);
    },
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
        onSubmitEditing={submit}
      />
      <FormError message={formError} />
      {sentTo ? <AppText role="status">Invitation sent to {sentTo}.</AppText> : null}
      <Button label="Send invitation" busy={isSubmitting} onPress={submit} style={styles.start} testID="invite-submit" />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  start: { alignSelf: 'flex-start' },
});
