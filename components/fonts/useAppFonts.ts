/**
 * Loads the four Inter weights on native with expo-font, one file per weight (importing the
 * package root would bundle all eighteen). The web build uses useAppFonts.web.ts instead.
 */
import { Inter_400Regular } from '@expo-google-fonts/inter/400Regular';
import { Inter_500Medium } from '@expo-google-fonts/inter/500Medium';
import { Inter_600SemiBold } from '@expo-google-fonts/inter/600SemiBold';
import { Inter_700Bold } from '@expo-google-fonts/inter/700Bold';
import { useFonts } from 'expo-font';

/** True once the fonts are loaded or failed to load (text then falls back to the system font). */
export function useAppFonts(): boolean {
  const [loaded, error] = useFonts({ Inter_400Regular, Inter_500Medium, Inter_600SemiBold, Inter_700Bold });
  return loaded || error != null;
}
