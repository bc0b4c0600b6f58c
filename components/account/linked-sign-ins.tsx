import { useMutation, useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { assignPageLocation } from '@/components/auth/page-navigation';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { identityLinkResultSchema, signInProviderSchema, type IdentityLinkResult, type SignInProvider } from '@/shared/schemas/session';
import { requestIdentityLink } from './api';
import { identityListOptions } from './queries';

const providerLabels: Readonly<Record<SignInProvider, string>> = { google: 'Google', sso: 'Company SSO' };

const linkMessages: Readonly<Record<IdentityLinkResult, string>> = {
  linked: 'is linked: you can sign in with it from now on.',
  already_linked: 'was already linked to you.',
  identity_in_use: 'belongs to another Trimsheet person, so it was not linked.',
  link_expired: 'was not linked: the request expired. Press the button again.',
  state_mismatch: 'was not linked: the sign-in expired or was started in another tab. Please try again.',
  access_denied: 'was not linked: the sign-in was cancelled at the provider.',
  provider_error: 'was not linked: the provider could not be reached. Please try again in a moment.',
  too_many_requests: 'was not linked: too many sign-in attempts. Wait a minute, then try again.',
};

/** What came back from a link request (`/account?link=<result>&provider=<provider>`), as a sentence; null when nothing did. */
export function describeLinkResult(result: string | undefined, provider: string | undefined): { text: string; ok: boolean } | null {
  const known = identityLinkResultSchema.safeParse(result);
  if (!known.success) return null;
  const which = signInProviderSchema.safeParse(provider);
  const name = which.success ? `${providerLabels[which.data]} sign-in` : 'The sign-in';
  const ok = known.data === 'linked' || known.data === 'already_linked';
  return { text: `${which.success ? 'Your ' : ''}${name} ${linkMessages[known.data]}`, ok };
}

export type LinkedSignInsProps = {
  /** The `link` and `provider` query parameters of a link request that came back. */
  linkResult?: string;
  linkProvider?: string;
};

/**
 * The ways the person signs in, and a button per provider not yet linked: the deliberate step that adds a
 * sign-in to this account (never an e-mail address alone). Pressing it goes through the provider and back.
 */
export function LinkedSignIns({ linkResult, linkProvider }: LinkedSignInsProps) {
  const identities = useQuery(identityListOptions());
  const link = useMutation({ mutationFn: requestIdentityLink, onSuccess: ({ startUrl }) => assignPageLocation(startUrl) });
  const outcome = describeLinkResult(linkResult, linkProvider);
  return (
    <Card testID="linked-sign-ins">
      <AppText variant="heading">Ways to sign in</AppText>
      {outcome ? (
        <View role={outcome.ok ? 'status' : 'alert'} style={[styles.outcome, !outcome.ok && styles.failed]} testID="link-result">
          <AppText variant={outcome.ok ? undefined : 'error'}>{outcome.text}</AppText>
        </View>
      ) : null}
      {identities.isPending ? (
        <LoadingState label="Loading your sign-ins…" />
      ) : identities.isError ? (
        <ErrorState title="Could not load your sign-ins" message={identities.error.message} onRetry={() => void identities.refetch()} />
      ) : (
        <View style={styles.providers}>
          {signInProviderSchema.options.map((provider) => {
            const linked = identities.data.some((identity) => identity.provider === provider);
            return (
              <View key={provider} style={styles.provider}>
                <AppText>{providerLabels[provider]}</AppText>
                {linked ? (
                  <Badge label="Linked" strong />
                ) : (
                  <Button
                    label={`Link ${providerLabels[provider]} sign-in`}
                    tone="secondary"
                    busy={link.isPending && link.variables === provider}
                    disabled={link.isPending}
                    onPress={() => link.mutate(provider)}
                    testID={`link-${provider}`}
                  />
                )}
              </View>
            );
          })}
        </View>
      )}
      <FormError message={link.error?.message} />
    </Card>
  );
}

const styles = StyleSheet.create({
  outcome: { padding: space.md, borderRadius: 10, backgroundColor: colors.recess },
  failed: { backgroundColor: colors.faultWash },
  providers: { gap: space.sm },
  provider: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
});
