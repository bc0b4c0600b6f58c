import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import type { Craft } from '@/shared/schemas/crafts';
import { myRoleLabel } from './role-label';

/** A craft in the list: name, description and the caller's role; opens the craft. */
export function CraftCard({ craft }: { craft: Craft }) {
  return (
    <Link href={{ pathname: '/crafts/[craftId]', params: { craftId: craft.id } }} asChild>
      <Pressable role="link" testID={`craft-card-${craft.id}`}>
        <Card style={styles.card}>
          <View style={styles.top}>
            <AppText variant="heading" style={styles.name}>
              {craft.name}
            </AppText>
            <Badge label={myRoleLabel(craft.myRole)} strong />
          </View>
          <AppText variant="muted" numberOfLines={3}>
            {craft.description || 'No description yet.'}
          </AppText>
          <AppText variant="mono">Updated {craft.updatedAt.slice(0, 10)}</AppText>
        </Card>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  card: { borderLeftWidth: 4, borderLeftColor: colors.film },
  top: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'center', gap: space.sm },
  name: { flexShrink: 1 },
});
