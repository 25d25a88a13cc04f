/**
 * On web the fonts are WOFF2 files declared by @font-face in app/+html.tsx (font-display: swap),
 * so nothing waits for them here and the 1.37 MB of TTF never enters the web bundle.
 */
export function useAppFonts(): boolean {
  return true;
}
