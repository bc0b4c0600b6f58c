import { useLocalSearchParams } from 'expo-router';
import Head from 'expo-router/head';
import { CraftScreen } from '@/components/crafts/craft-screen';

/** /crafts/:craftId */
export default function CraftRoute() {
  const { craftId } = useLocalSearchParams<{ craftId: string }>();
  return (
    <>
      <Head>
        <title>Craft · Trimsheet</title>
      </Head>
      <CraftScreen craftId={craftId} />
    </>
  );
}
