import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { useSession } from './queries';

export type SessionGateProps = {
  /** Renders the navigator once it is known whether someone is signed in. */
  children: (signedIn: boolean) => ReactNode;
};

/** Holds the app back until the session is known; shows why if the session cannot be fetched. */
export function SessionGate({ children }: SessionGateProps) {
  const session = useSession();
  if (session.isPending) {
    return (
      <View style={styles.page}>
        <LoadingState label="Opening Trimsheet…" />
      </View>
    );
  }
  if (session.isError && session.data === undefined) {
    return (
      <View style={styles.page}>
        <ErrorState title="Trimsheet cannot reach its server" message={session.error.message} onRetry={() => void session.refetch()} />
      </View>
    );
  }
  return children(Boolean(session.data?.user));
}

const styles = StyleSheet.create({
  page: { flex: 1, justifyContent: 'center', padding: space.lg, backgroundColor: colors.ground },
});
