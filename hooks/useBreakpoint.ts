/** The named breakpoint (phone, tablet, wide) for the current window width. */
import { useWindowDimensions } from 'react-native';

import type { Breakpoint } from '@/constants/theme';
import { breakpointForWidth } from './breakpointForWidth';

export { breakpointForWidth };

/** @returns the named breakpoint of the window, updated as it resizes */
export function useBreakpoint(): Breakpoint {
  return breakpointForWidth(useWindowDimensions().width);
}
