import { usePathname } from 'expo-router';
import { createContext, type ReactNode,useCallback, useContext, useMemo, useRef, useState } from 'react';
import type { NativeScrollEvent, NativeSyntheticEvent } from 'react-native';

/** Scrolled this far down, the phone header folds away; scrolling back up this far (or to the top) brings it back. */
const FOLD_AFTER_PX = 32;
const UNFOLD_AFTER_PX = 24;

interface HeaderCollapse {
  /** True while the phone header is folded away. */
  collapsed: boolean;
  setCollapsed: (collapsed: boolean) => void;
}

const HeaderCollapseContext = createContext<HeaderCollapse>({ collapsed: false, setCollapsed: () => undefined });

/** Holds whether the signed-in shell's phone header is folded away; screens' scroll views report to it. */
export function HeaderCollapseProvider({ children }: { children: ReactNode }) {
  // Folding belongs to the screen it happened on: another screen starts at its top, with the header shown.
  const pathname = usePathname();
  const [foldedOn, setFoldedOn] = useState<string | null>(null);
  const collapsed = foldedOn === pathname;
  const value = useMemo(() => ({ collapsed, setCollapsed: (c: boolean) => setFoldedOn(c ? pathname : null) }), [collapsed, pathname]);
  return <HeaderCollapseContext.Provider value={value}>{children}</HeaderCollapseContext.Provider>;
}

/** Whether the phone header is folded away now. */
export function useHeaderCollapsed(): boolean {
  return useContext(HeaderCollapseContext).collapsed;
}

/**
 * Scroll props for a screen's main scroll view: scrolling down folds the phone header away so the
 * content gets the screen; scrolling up or reaching the top unfolds it. Outside the shell they do nothing.
 */
export function useCollapseOnScroll(): { onScroll: (e: NativeSyntheticEvent<NativeScrollEvent>) => void; scrollEventThrottle: number } {
  const { collapsed, setCollapsed } = useContext(HeaderCollapseContext);
  const turn = useRef(0);
  const onScroll = useCallback(
    (e: NativeSyntheticEvent<NativeScrollEvent>) => {
      const y = e.nativeEvent.contentOffset.y;
      if (!collapsed) {
        // Track the lowest point since unfolding; fold once this far below it.
        turn.current = Math.min(turn.current, y);
        if (y - turn.current > FOLD_AFTER_PX) {
          turn.current = y;
          setCollapsed(true);
        }
      } else {
        turn.current = Math.max(turn.current, y);
        if (y <= 4 || turn.current - y > UNFOLD_AFTER_PX) {
          turn.current = y;
          setCollapsed(false);
        }
      }
    },
    [collapsed, setCollapsed],
  );
  return { onScroll, scrollEventThrottle: 32 };
}
