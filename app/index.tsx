import { Redirect } from 'expo-router';

/** The start page is the craft list (the root layout only lets signed-in people reach it). */
export default function Index() {
  return <Redirect href="/crafts" />;
}
