import { Link, usePathname, useRouter } from 'expo-router';
import { useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { can, ROLE_LABELS } from '@/features/access/permissions';
import { useSignOutMutation } from '@/features/auth/api/sign-out';
import { useMetaQuery } from '@/features/meta/get-meta';
import { SignOutButton } from '@/features/offline/components/sign-out-guard';
import { SyncStatusPill } from '@/features/offline/components/sync-status-pill';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { navFor } from '../nav';
import { Brand, frameStyles } from './shell-frame';

export function AppShell({ children }: { children: ReactNode }) {
  const { isWide } = useBreakpoints();
  const [menuOpen, setMenuOpen] = useState(false);
  // Only people who screen keep changes on the device; a parent or a physio has nothing waiting to sync.
  const syncs = can(useActiveClub().membership.role, 'screening.write');
  // One tree at every width: the screen sits in the same place whether the side bar or the top bar is
  // shown, so a change of width (a tablet turned, a window resized) never remounts it and loses what
  // the person was doing (an open preview, a half-typed note).
  return (
    <View style={isWide ? frameStyles.wideRoot : frameStyles.phoneRoot}>
      {isWide ? <SideBar syncs={syncs} /> : <TopBar syncs={syncs} menuOpen={menuOpen} onToggle={() => setMenuOpen((o) => !o)} />}
      {!isWide && menuOpen ? (
        <View style={styles.sheet} role="navigation">
          <NavList onNavigate={() => setMenuOpen(false)} />
          <AccountBox onNavigate={() => setMenuOpen(false)} />
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

function SideBar({ syncs }: { syncs: boolean }) {
  return (
    <View style={frameStyles.side} role="navigation">
      <Brand />
      {/* Integration point with features/offline: the device's sync status on every screen. */}
      {syncs ? <SyncStatusPill /> : null}
      <NavList onNavigate={() => undefined} />
      <View style={styles.grow} />
      <AccountBox onNavigate={() => undefined} />
    </View>
  );
}

function TopBar({ syncs, menuOpen, onToggle }: { syncs: boolean; menuOpen: boolean; onToggle: () => void }) {
  return (
    <View style={frameStyles.topBar}>
      <Brand />
      <View style={styles.topStatus}>{syncs ? <SyncStatusPill align="right" /> : null}</View>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={menuOpen ? 'Close menu' : 'Open menu'}
        testID="menu-button"
        onPress={onToggle}
        style={frameStyles.menuButton}
      >
        <Text style={frameStyles.menuText}>{menuOpen ? 'Close' : 'Menu'}</Text>
      </Pressable>
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

function AccountBox({ onNavigate }: { onNavigate: () => void }) {
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
      <Link href="/account" onPress={onNavigate} style={styles.accountLink} testID="account-link">
        <Text style={styles.accountLinkText}>Your account and password</Text>
      </Link>
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
  grow: { flex: 1 },
  main: { flex: 1 },
  hidden: { display: 'none' },
  topStatus: { flex: 1, alignItems: 'flex-end', marginHorizontal: space.sm, zIndex: 20 },
  sheet: { padding: space.lg, gap: space.xl, flex: 1 },
  nav: { gap: space.xs },
  navItem: { minHeight: TOUCH_MIN, paddingHorizontal: space.md, paddingVertical: space.md, borderRadius: radius.md },
  navActive: { backgroundColor: colors.pineSoft },
  navLabel: { fontFamily: fonts.bold, fontSize: 18, color: colors.ink },
  navLabelActive: { color: colors.pineDark },
  accountLink: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingVertical: space.sm },
  accountLinkText: { color: colors.pineDark, textDecorationLine: 'underline' },
  account: { gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.lg },
});
