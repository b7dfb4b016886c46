/**
 * The browser tab's title for the page on screen.
 */
import Head from 'expo-router/head';

/** Sets the document title to "`title` · Sheetsmith" while the page is focused (web only; no-op elsewhere). */
export function PageTitle({ title }: { title: string }) {
  return (
    <Head>
      <title>{`${title} · Sheetsmith`}</title>
    </Head>
  );
}
