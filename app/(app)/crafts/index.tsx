import Head from 'expo-router/head';
import { CraftListScreen } from '@/components/crafts/craft-list-screen';

/** /crafts */
export default function CraftsRoute() {
  return (
    <>
      <Head>
        <title>Crafts · Trimsheet</title>
      </Head>
      <CraftListScreen />
    </>
  );
}
