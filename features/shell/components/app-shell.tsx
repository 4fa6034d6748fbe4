import { Link, usePathname, useRouter } from 'expo-router';
import { useState, type ReactNode } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { useSignOutMutation } from '@/features/auth/api/sign-out';
import { ROLE_LABELS } from '@/features/auth/schemas';
import { useMetaQuery } from '@/features/meta/get-meta';
import { SignOutButton } from '@/features/offline/components/sign-out-guard';
import { SyncStatusPill } from '@/features/offline/components/sync-status-pill';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { CONTENT_MAX_WIDTH } from '@/features/ui/breakpoints';
import { navFor } from '../nav';
import { CaptureFrame } from '@/features/screening/components/capture/capture-layout';
import { isCapturePath, pageHeadFor } from '../page-heads';

export function AppShell({ children }: { children: ReactNode }) {
  const { isWide } = useBreakpoints();
  const [menuOpen, setMenuOpen] = useState(false);
  // Only people who screen keep changes on the device; a parent or a physio has nothing waiting to sync.
  const syncs = can(useActiveClub().membership.role, 'screening.write');
  // One tree at every width: the screen sits in the same place whether the side bar or the top bar is
  // shown, so a change of width (a tablet turned, a window resized) never remounts it and loses what
  // the person was doing (an open preview, a half-typed note).
  return (
    <View style={isWide ? styles.wideRoot : styles.phoneRoot}>
      {isWide ? <SideBar syncs={syncs} /> : <TopBar syncs={syncs} menuOpen={menuOpen} onToggle={() => setMenuOpen((o) => !o)} />}
      {!isWide && menuOpen ? (
        <View style={styles.sheet} role="navigation">
          <NavList onNavigate={() => setMenuOpen(false)} />
          <AccountBox />
        </View>
      ) : null}
      {/* Hidden, not unmounted, under the menu: unmounting the screens resets the router to the home
          route, and a tester who opened the menu mid-screening would lose their place. */}
      <View style={[styles.main, !isWide && menuOpen && styles.hidden]} role="main">
        {children}
      </View>
    </View>
  );
}

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
    <View style={styles.frameContent} {...FRAME_CONTENT}>
      <View style={styles.frameColumn}>
        {head ? (
          <View style={styles.frameHead}>
            {/* A head that starts with a line above the title (the home's club and role): its place is kept. */}
            {head.lead ? <Text variant="small">{'\u00a0'}</Text> : null}
            <Text variant="title" accessibilityRole="header">
              {head.title}
            </Text>
            {head.text ? <Text>{head.text}</Text> : null}
          </View>
        ) : null}
        <ActivityIndicator size="large" color={colors.pine} accessibilityLabel="Loading" style={styles.frameBusy} />
      </View>
    </View>
  );
  return (
    <>
      <View style={styles.phoneRoot} {...FRAME_PHONE}>
        <View style={styles.topBar}>
          <Brand />
          <View style={[styles.menuButton, styles.menuWaiting]}>
            <Text style={styles.menuText}>Menu</Text>
          </View>
        </View>
        {main}
      </View>
      <View style={styles.wideRoot} {...FRAME_WIDE}>
        <View style={styles.side}>
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

function SideBar({ syncs }: { syncs: boolean }) {
  return (
    <View style={styles.side} role="navigation">
      <Brand />
      {/* Integration point with features/offline: the device's sync status on every screen. */}
      {syncs ? <SyncStatusPill /> : null}
      <NavList onNavigate={() => undefined} />
      <View style={styles.grow} />
      <AccountBox />
    </View>
  );
}

function TopBar({ syncs, menuOpen, onToggle }: { syncs: boolean; menuOpen: boolean; onToggle: () => void }) {
  return (
    <View style={styles.topBar}>
      <Brand />
      <View style={styles.topStatus}>{syncs ? <SyncStatusPill align="right" /> : null}</View>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={menuOpen ? 'Close menu' : 'Open menu'}
        testID="menu-button"
        onPress={onToggle}
        style={styles.menuButton}
      >
        <Text style={styles.menuText}>{menuOpen ? 'Close' : 'Menu'}</Text>
      </Pressable>
    </View>
  );
}

function Brand() {
  return (
    <View style={styles.brand}>
      <View style={styles.mark} />
      <Text style={styles.word}>Squadline</Text>
    </View>
  );
}

function NavList({ onNavigate }: { onNavigate: () => void }) {
  const { membership } = useActiveClub();
  const meta = useMetaQuery();
  const path = usePathname();
  const items = navFor(membership.role, { mailbox: meta.data?.mailbox ?? false });
  return (
    <View style={styles.nav}>
      {items.map((item) => {
        const active = item.href === '/' ? path === '/' : path.startsWith(item.href);
        return (
          <Link key={item.href} href={item.href as never} onPress={onNavigate} style={[styles.navItem, active && styles.navActive]}>
            <Text style={[styles.navLabel, active && styles.navLabelActive]}>{item.label}</Text>
          </Link>
        );
      })}
    </View>
  );
}

function AccountBox() {
  const { me, membership, choose } = useActiveClub();
  const signOut = useSignOutMutation();
  const router = useRouter();
  return (
    <View style={styles.account}>
      <Text variant="label" testID="signed-in-name">
        {me.user.displayName}
      </Text>
      <Text variant="small">
        {ROLE_LABELS[membership.role]} · {membership.clubName}
      </Text>
      {me.memberships.length > 1
        ? me.memberships
            .filter((m) => m.clubId !== membership.clubId)
            .map((m) => <Button key={m.clubId} tone="quiet" label={`Switch to ${m.clubName}`} onPress={() => choose(m.clubId)} />)
        : null}
      {/* Integration point with features/offline: warns when changes still wait on this phone. */}
      <SignOutButton busy={signOut.isPending} onSignOut={() => signOut.mutate(undefined, { onSettled: () => router.replace('/sign-in') })} />
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  side: { zIndex: 10, width: 248, backgroundColor: colors.surface, borderRightWidth: 1, borderRightColor: colors.line, padding: space.lg, gap: space.xl },
  grow: { flex: 1 },
  main: { flex: 1 },
  hidden: { display: 'none' },
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
  topStatus: { flex: 1, alignItems: 'flex-end', marginHorizontal: space.sm, zIndex: 20 },
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
  sheet: { padding: space.lg, gap: space.xl, flex: 1 },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  mark: { width: 18, height: 18, borderRadius: 3, backgroundColor: colors.pine, transform: [{ rotate: '45deg' }] },
  word: { fontFamily: fonts.bold, fontSize: 21, color: colors.pineDark },
  nav: { gap: space.xs },
  navItem: { minHeight: TOUCH_MIN, paddingHorizontal: space.md, paddingVertical: space.md, borderRadius: radius.md },
  navActive: { backgroundColor: colors.pineSoft },
  navLabel: { fontFamily: fonts.bold, fontSize: 18, color: colors.ink },
  navLabelActive: { color: colors.pineDark },
  frameContent: { flex: 1, padding: space.lg, alignItems: 'center' },
  frameColumn: { width: '100%', maxWidth: CONTENT_MAX_WIDTH, gap: space.lg },
  frameHead: { gap: space.xs },
  frameBusy: { marginTop: space.xl },
  menuWaiting: { opacity: 0.5 },
  account: { gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.lg },
});
