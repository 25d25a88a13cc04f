/** The named breakpoint (phone, tablet, wide) for the current window width. */
import { useWindowDimensions } from 'react-native';

import { breakpoints, type Breakpoint } from '@/constants/theme';

/**
 * @param widthPx a window width in px
 * @returns the largest named breakpoint the width reaches
 */
export function breakpointForWidth(widthPx: number): Breakpoint {
  if (widthPx >= breakpoints.wide) return 'wide';
  if (widthPx >= breakpoints.tablet) return 'tablet';
  return 'phone';
}

/** @returns the named breakpoint of the window, updated as it resizes */
export function useBreakpoint(): Breakpoint {
  return breakpointForWidth(useWindowDimensions().width);
}
