import { createContext, type ReactNode, useContext } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { useIsWide } from '@/components/layout/use-is-wide';
import { colors, layout, spacing } from '@/components/theme';

import { Titles } from './Titles';

/** Props of {@link Screen}. */
export interface ScreenProps {
  /** Screen title (a level-1 heading). */
  title?: string;
  /** One line under the title. */
  subtitle?: string;
  /** Elements at the right of the title row (e.g. a primary Button). */
  actions?: ReactNode;
  children: ReactNode;
  /** Wrap the content in a ScrollView; default true. Turn off for screens that manage their own scrolling (SplitView). */
  scroll?: boolean;
  /**
   * On phones, hand the title row to the SplitView inside (with `scroll={false}`): it scrolls away
   * at the top of the list and is left out beside a selected item, whose back bar names the list,
   * so the item gets the screen.
   */
  headInList?: boolean;
}

const ScreenHeadContext = createContext<ReactNode>(null);

/** The title row a Screen with `headInList` hands to the list it contains (phones only; else null). */
export function useScreenHead(): ReactNode {
  return useContext(ScreenHeadContext);
}

/** The body of a tab screen: title row, consistent padding, max width, optional scrolling. */
export function Screen({ title, subtitle, actions, children, scroll = true, headInList = false }: ScreenProps) {
  const wide = useIsWide();
  const head =
    title || actions ? (
      <View style={styles.head}>
        <Titles title={title} subtitle={subtitle} level={1} style={styles.titles} />
        {actions ? <View style={styles.actions}>{actions}</View> : null}
      </View>
    ) : null;
  if (!scroll) {
    const handOver = headInList && !wide;
    return (
      <View style={styles.root}>
        <View style={[styles.inner, styles.fill]}>
          {handOver ? null : head}
          <ScreenHeadContext.Provider value={handOver ? head : null}>{children}</ScreenHeadContext.Provider>
        </View>
      </View>
    );
  }
  return (
    <ScrollView style={styles.root} contentContainerStyle={styles.scrollContent}>
      <View style={styles.inner}>
        {head}
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.background },
  scrollContent: { flexGrow: 1 },
  inner: {
    width: '100%',
    maxWidth: layout.maxContentWidth,
    alignSelf: 'center',
    padding: spacing.lg,
    gap: spacing.lg,
  },
  fill: { flex: 1, minHeight: 0 },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
  titles: { minWidth: 200 },
  actions: { flexDirection: 'row', gap: spacing.sm },
});
