import { StyleSheet, View } from 'react-native';
import { useSessionUser, useSignOut } from '@/components/auth/queries';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { AccessTokens } from './access-tokens';
import { LinkedSignIns, type LinkedSignInsProps } from './linked-sign-ins';
import { MailPreferencesCard, NotificationList } from './notifications';

/** Who is signed in, in which organisation, the ways they sign in, their notifications and mail settings, personal access tokens, and the two ways to sign out. */
export function AccountScreen({ linkResult, linkProvider }: LinkedSignInsProps = {}) {
  const user = useSessionUser();
  const signOut = useSignOut();
  const scope = signOut.isPending ? signOut.variables : null;

  return (
    <Screen title="Account">
      {user ? (
        <Card testID="account-card">
          <AppText variant="heading">{user.name}</AppText>
          <AppText variant="mono">{user.email}</AppText>
          <View style={styles.row}>
            <AppText variant="label">Organisation</AppText>
            <AppText>{user.organisation.name}</AppText>
            {user.isOrgAdmin ? <Badge label="Organisation admin" strong /> : null}
          </View>
        </Card>
      ) : null}
      <LinkedSignIns linkResult={linkResult} linkProvider={linkProvider} />
      <NotificationList />
      <MailPreferencesCard />
      <AccessTokens />
      <Card>
        <AppText variant="heading">Sign out</AppText>
        <AppText variant="muted">“Sign out everywhere” ends your sessions on every device and browser.</AppText>
        <FormError message={signOut.error?.message} />
        <View style={styles.actions}>
          <Button
            label="Sign out"
            busy={scope === 'this-session'}
            disabled={signOut.isPending}
            onPress={() => signOut.mutate('this-session')}
            testID="sign-out"
          />
          <Button
            label="Sign out everywhere"
            tone="secondary"
            busy={scope === 'everywhere'}
            disabled={signOut.isPending}
            onPress={() => signOut.mutate('everywhere')}
            testID="sign-out-everywhere"
          />
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
