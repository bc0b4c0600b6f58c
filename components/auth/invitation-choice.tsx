import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { assignPageLocation } from './page-navigation';
import { useSession } from './queries';

/**
 * After a sign-in that proved an address several organisations invited: one button per organisation. The
 * invitee chooses; pressing one signs in again and accepts that invitation. Nothing shows otherwise.
 */
export function InvitationChoiceList() {
  const choice = useSession().data?.invitationChoice ?? null;
  if (choice === null || choice.invitations.length === 0) return null;
  return (
    <View style={styles.list} testID="invitation-choice">
      <AppText variant="heading">Invitations for {choice.email}</AppText>
      {choice.invitations.map((invitation) => (
        <View key={invitation.id} style={styles.option}>
          <AppText variant="muted">Invited by {invitation.invitedBy}</AppText>
          <Button
            label={`Join ${invitation.organisation}`}
            tone="secondary"
            testID={`accept-invitation-${invitation.id}`}
            onPress={() => assignPageLocation(invitation.startUrl)}
          />
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  option: { gap: space.xs },
});
