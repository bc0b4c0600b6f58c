import Head from 'expo-router/head';

/** Sets the browser tab's title for the focused route: "<title> · Trimsheet". */
export function PageTitle({ title }: { title: string }) {
  return (
    <Head>
      <title>{`${title} · Trimsheet`}</title>
    </Head>
  );
}
