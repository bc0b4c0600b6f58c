import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SailMark } from '@/components/ui/sail-mark';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { signInErrorCodeSchema, type SessionResponse, type SignInErrorCode } from '@/shared/schemas/session';
import { InvitationChoiceList } from './invitation-choice';
import { assignPageLocation } from './page-navigation';
import { useSession } from './queries';

type ProviderId = SessionResponse['providers'][number]['id'];

const buttonLabels: Record<ProviderId, string> = {
  google: 'Sign in with Google',
  sso: 'Company SSO',
};

const errorMessages: Record<SignInErrorCode, string> = {
  no_account: 'There is no Trimsheet account for this sign-in. Ask an organisation admin to invite you.',
  identity_not_linked:
    'This e-mail address belongs to a Trimsheet account that signs in another way, so this sign-in was refused. Sign in as you usually do, then link this sign-in on your Account page, or ask your organisation admin for an invitation for it.',
  choose_invitation: 'More than one organisation has invited you. Choose the one to join.',
  invitation_unavailable: 'That invitation was withdrawn or has already been accepted. Ask the organisation admin for a new one.',
  other_provider: 'Your invitation is for the other way of signing in. Use that button instead.',
  email_not_verified: 'Your provider has not verified this e-mail address. Verify it there, then sign in again.',
  missing_email: 'Your provider did not share an e-mail address, and Trimsheet needs one to know who you are.',
  state_mismatch: 'The sign-in expired or was started in another tab. Please try again.',
  access_denied: 'Sign-in was cancelled at the provider.',
  provider_error: 'The sign-in provider could not be reached. Please try again in a moment.',
  too_many_requests: 'Too many sign-in attempts. Wait a minute, then try again.',
};

/** Turns an `?error=` code from the sign-in redirect into a sentence a person can act on. */
export function describeSignInError(code: string): string {
  const known = signInErrorCodeSchema.safeParse(code);
  if (known.success) return errorMessages[known.data];
  const words = code.replace(/[_-]+/g, ' ').trim();
  return `Sign-in did not complete (${words || 'unknown reason'}). Please try again.`;
}

export type SignInScreenProps = {
  /** The `error` query parameter the server adds when a sign-in fails. */
  error?: string;
};

/** The signed-out landing page: what Trimsheet is and the two ways to sign in. */
export function SignInScreen({ error }: SignInScreenProps) {
  const providers = useSession().data?.providers ?? [];
  return (
    <View style={styles.page}>
      <Card style={styles.card}>
        <View style={styles.band} testID="sign-in-band">
          <SailMark size={56} backdrop="ink" />
          <AppText variant="display" style={styles.name}>
            Trimsheet
          </AppText>
        </View>
        <AppText variant="muted">
          Sizing sheets and mass budgets for solar-sail spacecraft, kept in revisions your whole team can trust.
        </AppText>
        {error ? (
          <View style={styles.error} role="alert" testID="sign-in-error">
            <AppText variant="error">{describeSignInError(error)}</AppText>
          </View>
        ) : null}
        <InvitationChoiceList />
        <View style={styles.buttons}>
          {providers.map((provider) => (
            <Button
              key={provider.id}
              label={buttonLabels[provider.id]}
              tone={provider.id === 'google' ? 'primary' : 'secondary'}
              testID={`sign-in-${provider.id}`}
              onPress={() => assignPageLocation(provider.startUrl)}
            />
          ))}
        </View>
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.ground, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  card: { width: '100%', maxWidth: 420, padding: space.xl, gap: space.lg, overflow: 'hidden' },
  // The ink-blue band runs edge to edge across the top of the card, behind the mark and the name.
  band: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    marginTop: -space.xl,
    marginHorizontal: -space.xl,
    paddingHorizontal: space.xl,
    paddingVertical: space.lg,
    backgroundColor: colors.ink,
  },
  name: { color: colors.ground },
  error: { backgroundColor: colors.faultWash, borderRadius: 10, padding: space.md },
  buttons: { gap: space.md },
});
