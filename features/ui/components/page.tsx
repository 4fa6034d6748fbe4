import { ScrollView, StyleSheet, View, type ScrollViewProps } from 'react-native';
import { CONTENT_MAX_WIDTH, useBreakpoints } from '../breakpoints';
import { usePageTitle } from '../page-title';
import { colors, space } from '../theme';

/**
 * A scrolling page whose content is centred and capped in width on wide screens. `title` names the
 * browser tab; screens whose title comes from data (a round, an athlete) set it with usePageTitle.
 */
export function Page({ children, narrow = false, title, contentContainerStyle, ...rest }: ScrollViewProps & { narrow?: boolean; title?: string }) {
  const { isTabletUp } = useBreakpoints();
  usePageTitle(title);
  return (
    <ScrollView
      {...rest}
      style={styles.scroll}
      contentContainerStyle={[styles.content, isTabletUp && styles.contentWide, contentContainerStyle]}
      keyboardShouldPersistTaps="handled"
    >
      <View style={[styles.column, narrow && styles.narrow]}>{children}</View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { padding: space.lg, paddingBottom: space.xxl * 2, alignItems: 'center' },
  contentWide: { padding: space.xxl },
  column: { width: '100%', maxWidth: CONTENT_MAX_WIDTH, gap: space.lg },
  narrow: { maxWidth: 460 },
});
