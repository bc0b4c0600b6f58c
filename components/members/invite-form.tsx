import { useState } from 'react';
import { Controller } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { inviteBodySchema } from '@/shared/schemas/organisation';
import { useInvitePerson } from './queries';

type ProviderChoice = 'either' | 'google' | 'sso';
const providerChoices: readonly { value: ProviderChoice; label: string }[] = [
  { value: 'either', label: 'Either' },
  { value: 'google', label: 'Google' },
  { value: 'sso', label: 'Company SSO' },
];

/**
 * Invites a person to the organisation by name and e-mail, for either sign-in or one provider (which also
 * lets someone already in the organisation link that provider); errors appear beside the field at fault.
 */
export function InviteForm() {
  const invite = useInvitePerson();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: inviteBodySchema,
    defaultValues: { name: '', email: '', provider: null },
    fields: ['name', 'email', 'provider'],
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
      <Controller
        control={control}
        name="provider"
        render={({ field }) => (
          <ChoiceChips
            label="Signs in with"
            choices={providerChoices}
            value={field.value ?? 'either'}
            onChange={(choice) => field.onChange(choice === 'either' ? null : choice)}
            testID="invite-provider"
          />
        )}
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
