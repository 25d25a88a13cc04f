/**
 * The HTML document around every statically exported page (web only; runs in Node at export).
 * Sets the language, a viewport that lets phones zoom, and the background grey so no white
 * flashes before the app draws. On web the four Inter weights come as WOFF2 subsets from
 * public/fonts (copied from @fontsource/inter, the content hash in each name so they cache for
 * a year), declared under the family names the styles use; native loads them with expo-font.
 */
import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

import { colors } from '@/constants/theme';

/** Unicode ranges of the @fontsource/inter subsets: a browser downloads only the subsets a page uses. */
const subsets = {
  latin:
    'U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,' +
    'U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD',
  'latin-ext':
    'U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,' +
    'U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF',
  greek: 'U+0370-0377,U+037A-037F,U+0384-038A,U+038C,U+038E-03A1,U+03A3-03FF',
} as const;

/** Family name the styles use → the content hash of each subset file of that weight. */
const interFonts: Record<string, { weight: number; files: Record<keyof typeof subsets, string> }> = {
  Inter_400Regular: {
    weight: 400,
    files: {
      latin: 'da03732a27e16543f09d6a6a62b0cdd4',
      'latin-ext': '0a6ff1a7c1e4c9608b7754285ec9c944',
      greek: 'e4998c9e328a3b87ba9fb11e39a5e9b1',
    },
  },
  Inter_500Medium: {
    weight: 500,
    files: {
      latin: '51205681a1ba304816fc629e8989256b',
      'latin-ext': '90ff4f7e8bcb4856837418526e5cee75',
      greek: 'b0154f8ec2fab048c83f7f4fe7e3b15c',
    },
  },
  Inter_600SemiBold: {
    weight: 600,
    files: {
      latin: '2ede57db1a3a5f41f40467e7a43a1dd4',
      'latin-ext': '65aed4e1ef6306c7ed47669144eed4e3',
      greek: 'c3a34dcac111dc1d914ee70d3870bebe',
    },
  },
  Inter_700Bold: {
    weight: 700,
    files: {
      latin: '8ca0a51552960933d0fd52c19175cbe9',
      'latin-ext': 'aa4c26661f6463f774f9f3471b87bb5c',
      greek: 'be8feba98af271a78c4b671a2d9c220c',
    },
  },
};

const fontUrl = (subset: string, weight: number, hash: string) =>
  `/fonts/inter-${subset}-${weight}-normal.${hash}.woff2`;

// No font-weight descriptor: like the expo-font faces these replace, each family is one weight.
const fontFaces = Object.entries(interFonts)
  .flatMap(([family, { weight, files }]) =>
    (Object.keys(subsets) as (keyof typeof subsets)[]).map(
      (subset) =>
        `@font-face{font-family:${family};font-style:normal;font-display:swap;` +
        `src:url(${fontUrl(subset, weight, files[subset])}) format('woff2');unicode-range:${subsets[subset]}}`,
    ),
  )
  .join('');

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
        {[400, 600].map((weight) => (
          <link
            key={weight}
            rel="preload"
            href={fontUrl(
              'latin',
              weight,
              interFonts[weight === 400 ? 'Inter_400Regular' : 'Inter_600SemiBold'].files.latin,
            )}
            as="font"
            type="font/woff2"
            crossOrigin=""
          />
        ))}
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: fontFaces }} />
        <style dangerouslySetInnerHTML={{ __html: `body { background-color: ${colors.background}; }` }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
