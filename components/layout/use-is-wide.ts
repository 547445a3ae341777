import { useWindowDimensions } from 'react-native';

import { layout } from '@/components/theme';

/** True when the window is at least `layout.wideBreakpoint` (1024 px) wide: side-by-side layouts apply. */
export function useIsWide(): boolean {
  const { width } = useWindowDimensions();
  return width >= layout.wideBreakpoint;
}
