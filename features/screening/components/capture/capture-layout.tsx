import type { ReactNode, Ref } from 'react';
import { ActivityIndicator, ScrollView, StyleSheet, View } from 'react-native';
import { CONTENT_MAX_WIDTH } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';
import { Notice } from '@/features/ui/components/notice';
import { ProgressBar } from '../progress-bar';
import { BEFORE_EACH_ATHLETE } from './before-each-athlete';

type LayoutProps = {
  header: ReactNode;
  children: ReactNode;
  bar: ReactNode;
  /** A line above Back and Next (why Next did not move on), where the thumb is. */
  aboveBar?: ReactNode;
  scrollRef?: Ref<ScrollView>;
  /** Wider side margins from a tablet up; the frame leaves it off, its markup must not depend on the width. */
  wide?: boolean;
};

/**
 * The capture screen's frame: the head (round, step, athlete, progress) above, the step in between, Back
 * and Next at the bottom within thumb reach. One component for the screen and for its frame before the
 * data (CaptureFrame), so nothing moves when the assessment arrives.
 */
export function CaptureLayout({ header, children, bar, aboveBar, scrollRef, wide = false }: LayoutProps) {
  return (
    <View style={styles.root}>
      <View style={styles.header}>
        <View style={[styles.column, styles.headerInner]}>{header}</View>
      </View>
      <ScrollView
        ref={scrollRef}
        style={styles.scroll}
        contentContainerStyle={[styles.content, wide && styles.contentWide]}
        keyboardShouldPersistTaps="handled"
      >
        <View style={[styles.column, styles.body]}>{children}</View>
      </ScrollView>
      <View style={styles.bar}>
        {aboveBar ? <View style={[styles.column, styles.aboveBar]}>{aboveBar}</View> : null}
        <View style={[styles.column, styles.barInner]}>{bar}</View>
      </View>
    </View>
  );
}

/**
 * The capture screen before its assessment is known: in the pre-rendered HTML (through ShellFrame) and
 * while the assessment and the draft load. The head's lines keep their height with a blank, so the
 * round, the step and the athlete fill them in place. The same markup at every width (the HTML is built
 * once for every screen). Meanwhile the body shows the checks to make before each athlete: on a slow
 * connection the tester has the seconds to read them, and being the largest text painted, a phone takes
 * it as the page's main content at its first paint (before-each-athlete.test.ts).
 */
export function CaptureFrame() {
  return (
    <CaptureLayout
      header={
        <>
          <View style={captureStyles.headerTop}>
            <View style={captureStyles.roundLink}>
              <Text variant="small">{'\u00a0'}</Text>
            </View>
          </View>
          <Text variant="heading" accessibilityRole="header">
            Screening
          </Text>
          <View style={captureStyles.who}>
            <Text variant="label">Loading the assessment…</Text>
          </View>
          <ProgressBar fraction={0} label="Loading the assessment" />
        </>
      }
      bar={
        <>
          <Button tone="secondary" label="Back" disabled style={captureStyles.barButton} />
          <Button label="Next" disabled style={[captureStyles.barButton, captureStyles.barPrimary]} />
        </>
      }
    >
      <Notice tone="caution" title={BEFORE_EACH_ATHLETE.title} testID="capture-before">
        {BEFORE_EACH_ATHLETE.text}
      </Notice>
      <ActivityIndicator size="large" color={colors.pine} accessibilityLabel="Loading" style={styles.busy} />
    </CaptureLayout>
  );
}

/** The pieces of the head and the bar, shared by the screen and its frame. */
export const captureStyles = StyleSheet.create({
  who: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', columnGap: space.sm, marginBottom: space.xs },
  headerTop: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  roundLink: { minHeight: TOUCH_MIN, justifyContent: 'center', flexShrink: 1 },
  barButton: { flex: 1, minHeight: TOUCH_MIN + 8 },
  barPrimary: { flex: 2 },
});

const styles = StyleSheet.create({
  aboveBar: { paddingBottom: space.sm },
  root: { flex: 1, backgroundColor: colors.paper },
  column: { width: '100%', maxWidth: CONTENT_MAX_WIDTH, alignSelf: 'center' },
  header: { backgroundColor: colors.surface, borderBottomWidth: 1, borderBottomColor: colors.line, paddingHorizontal: space.lg, paddingVertical: space.sm },
  headerInner: { gap: 2 },
  scroll: { flex: 1 },
  content: { padding: space.lg, paddingBottom: space.xxl },
  contentWide: { paddingHorizontal: space.xxl },
  body: { gap: space.lg },
  bar: { backgroundColor: colors.surface, borderTopWidth: 1, borderTopColor: colors.line, paddingHorizontal: space.lg, paddingVertical: space.sm },
  barInner: { flexDirection: 'row', gap: space.md },
  busy: { marginTop: space.xl },
});
