/** The named breakpoint (phone, tablet, wide) a window width reaches. */
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
