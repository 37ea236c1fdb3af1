import { useMemo } from 'react';
import { useWindowDimensions } from 'react-native';
import { breakpointsFor, type Breakpoints } from '@/src/breakpoints';

/** The layout flags for the current window; re-renders when the window is resized. */
export function useBreakpoints(): Breakpoints {
  const { width } = useWindowDimensions();
  return useMemo(() => breakpointsFor(Math.max(0, width)), [width]);
}
