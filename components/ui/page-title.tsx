import Head from 'expo-router/head';

/** "[Co(NH3)6]3+ — Check — Sphereline": the most specific part first, the product name last. */
export function pageTitle(...parts: (string | null | undefined)[]): string {
  return [...parts.filter((part): part is string => !!part && part.trim() !== ''), 'Sphereline'].join(' — ');
}

/**
 * The document title of the focused page (browser tab, history, screen readers' page announcement).
 * A deeper PageTitle wins over the shell's, so a screen can name what it shows.
 */
export function PageTitle({ parts }: { parts: (string | null | undefined)[] }) {
  return (
    <Head>
      <title>{pageTitle(...parts)}</title>
    </Head>
  );
}
