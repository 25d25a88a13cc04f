/**
 * The HTML document around every statically exported page (web only; runs in Node at export).
 * Sets the language, a viewport that lets phones zoom, and the background grey so no white
 * flashes before the app draws.
 */
import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

import { colors } from '@/constants/theme';

export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <title>Tallyrun</title>
        <meta name="description" content="Tallyrun: flow data historian for differential-pressure meter runs." />
        <meta name="theme-color" content={colors.navBackground} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: `body { background-color: ${colors.background}; }` }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
