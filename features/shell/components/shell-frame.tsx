import { usePathname } from 'expo-router';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { CaptureFrame } from '@/features/screening/components/capture/capture-layout';
import { CONTENT_MAX_WIDTH } from '@/features/ui/breakpoints';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { isCapturePath, pageHeadFor } from '../page-heads';

// The shell's frame, apart from the shell: every page loads it before anyone is known (the signed-in
// layout shows it while its own chunk, the session and the device's store load), so it imports nothing
// of the signed-in screens. AppShell (app-shell.tsx) draws its bars with the same pieces.

/**
 * The shell before the session is known: in the pre-rendered HTML of every signed-in page, and while the
 * session and the device's store load. The bars sit where AppShell puts them and the page's own head
 * (page-heads.ts) where the page will put it, so nothing moves when the page arrives. The markup does
 * not depend on the width (the HTML is built once for every screen): both bars are in it and the
 * `data-frame` rules in app/+html.tsx show the one that fits.
 */
export function ShellFrame() {
  const path = usePathname();
  const head = pageHeadFor(path);
  const main = isCapturePath(path) ? (
    <CaptureFrame />
  ) : (
    <View style={frameStyles.frameContent} {...FRAME_CONTENT}>
      <View style={frameStyles.frameColumn}>
        {head?.back ? (
          <View style={frameStyles.frameBack}>
            <Text variant="label" style={frameStyles.frameBackText}>
              {head.back}
            </Text>
          </View>
        ) : null}
        {head ? (
          <View style={frameStyles.frameHead}>
            {/* A head that starts with a line above the title (the home's club and role): its place is kept. */}
            {head.lead ? <Text variant="small">{'\u00a0'}</Text> : null}
            <Text variant="title" accessibilityRole="header">
              {head.title}
            </Text>
            {head.text ? <Text>{head.text}</Text> : null}
          </View>
        ) : null}
        <ActivityIndicator size="large" color={colors.pine} accessibilityLabel="Loading" style={frameStyles.frameBusy} />
      </View>
    </View>
  );
  return (
    <>
      <View style={frameStyles.phoneRoot} {...FRAME_PHONE}>
        <View style={frameStyles.topBar}>
          <Brand />
          <View style={[frameStyles.menuButton, frameStyles.menuWaiting]}>
            <Text style={frameStyles.menuText}>Menu</Text>
          </View>
        </View>
        {main}
      </View>
      <View style={frameStyles.wideRoot} {...FRAME_WIDE}>
        <View style={frameStyles.side}>
          <Brand />
        </View>
        {main}
      </View>
    </>
  );
}

// react-native-web writes `dataSet` as data-* attributes; the rules are in app/+html.tsx.
const FRAME_PHONE = { dataSet: { frame: 'phone' } } as object;
const FRAME_WIDE = { dataSet: { frame: 'wide' } } as object;
const FRAME_CONTENT = { dataSet: { frameContent: 'true' } } as object;

export function Brand() {
  return (
    <View style={frameStyles.brand}>
      <View style={frameStyles.mark} />
      <Text style={frameStyles.word}>Squadline</Text>
    </View>
  );
}

export const frameStyles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  side: { zIndex: 10, width: 248, backgroundColor: colors.surface, borderRightWidth: 1, borderRightColor: colors.line, padding: space.lg, gap: space.xl },
  phoneRoot: { flex: 1, backgroundColor: colors.paper },
  topBar: {
    zIndex: 10,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    paddingHorizontal: space.lg,
    paddingVertical: space.xs,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  menuButton: {
    minHeight: TOUCH_MIN,
    minWidth: 72,
    alignItems: 'center',
    justifyContent: 'center',
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.pine,
  },
  menuText: { fontFamily: fonts.bold, color: colors.pine, fontSize: 17 },
  // Never squeezed by the sync pill beside it on a phone (the pill's words wrap instead).
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexShrink: 0 },
  mark: { width: 18, height: 18, borderRadius: 3, backgroundColor: colors.pine, transform: [{ rotate: '45deg' }] },
  word: { fontFamily: fonts.bold, fontSize: 21, color: colors.pineDark },
  frameContent: { flex: 1, padding: space.lg, alignItems: 'center' },
  frameColumn: { width: '100%', maxWidth: CONTENT_MAX_WIDTH, gap: space.lg },
  frameHead: { gap: space.xs },
  // A page's link back to its list (RoundScreen's, which draws its links with these), drawn as text
  // in the frame until the app starts.
  frameBack: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingVertical: space.md },
  frameBackText: { color: colors.pine },
  frameBusy: { marginTop: space.xl },
  menuWaiting: { opacity: 0.5 },
});
