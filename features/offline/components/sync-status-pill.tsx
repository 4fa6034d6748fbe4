import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '@/features/ui/components/button';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { budgetText } from '../budget';
import { outbox } from '../device-handle';
import { useOutboxState, usePhotoBytesOnDevice, useSyncStatus } from '../hooks';
import type { OutboxKind } from '../outbox';
import { syncStatusDetail, syncStatusText, type SyncStatus } from '../sync-status';

const KIND_WORD: Record<OutboxKind, string> = { draft: 'Draft save', photo: 'Photo', submit: 'Submit', attendance: 'Session record' };

const TONE: Record<SyncStatus['kind'], 'ok' | 'busy' | 'off' | 'bad'> = {
  saved: 'ok',
  sending: 'busy',
  syncing: 'busy',
  online: 'busy',
  offline: 'off',
  attention: 'bad',
};

/**
 * On every screen: online, offline with N changes waiting, syncing, or all saved. Tapping it says what
 * that means, how much of the photo budget is used, and offers to send now.
 */
export function SyncStatusPill({ align = 'left' }: { align?: 'left' | 'right' }) {
  const status = useSyncStatus();
  const [open, setOpen] = useState(false);
  const tone = TONE[status.kind];
  return (
    <View style={styles.wrap}>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`${syncStatusText(status)}. ${open ? 'Hide details' : 'Show details'}`}
        accessibilityLiveRegion="polite"
        onPress={() => setOpen((o) => !o)}
        style={[styles.pill, styles[tone]]}
        testID="sync-status"
      >
        <View style={[styles.dot, styles[`${tone}Dot`]]} />
        <Text style={[styles.text, tone === 'bad' && styles.badText]} numberOfLines={2} testID="sync-status-text">
          {syncStatusText(status)}
        </Text>
      </Pressable>
      {open ? <Details status={status} align={align} onClose={() => setOpen(false)} /> : null}
    </View>
  );
}

function Details({ status, align, onClose }: { status: SyncStatus; align: 'left' | 'right'; onClose(): void }) {
  const bytes = usePhotoBytesOnDevice();
  const refused = useOutboxState().entries.filter((e) => e.state === 'refused');
  return (
    <View style={[styles.panel, align === 'right' ? styles.panelRight : styles.panelLeft]} testID="sync-status-details">
      <Text>{syncStatusDetail(status)}</Text>
      <Text variant="small">Photos kept on this phone: {budgetText(bytes)}.</Text>
      {refused.map((e) => (
        <View key={e.seq} style={styles.refused} testID={`refused-${e.seq}`}>
          <Text variant="label">{KIND_WORD[e.kind]} refused</Text>
          <Text variant="small">{e.error?.message}</Text>
          <View style={styles.row}>
            <Button tone="secondary" label="Send again" onPress={() => void outbox.sendAgain(e.seq)} style={styles.grow} />
            <Button tone="quiet" label="Discard" onPress={() => void outbox.discard(e.seq)} style={styles.grow} />
          </View>
        </View>
      ))}
      <View style={styles.row}>
        {status.kind === 'online' ? <Button tone="secondary" label="Send now" onPress={() => outbox.kick()} style={styles.grow} /> : null}
        <Button tone="quiet" label="Close" onPress={onClose} style={styles.grow} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { position: 'relative', flexShrink: 1, zIndex: 20 },
  pill: {
    minHeight: TOUCH_MIN,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingHorizontal: space.sm,
    borderRadius: radius.lg,
    borderWidth: 1,
    alignSelf: 'flex-start',
  },
  ok: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  busy: { borderColor: colors.line, backgroundColor: colors.surface },
  off: { borderColor: colors.amber, backgroundColor: colors.amberSoft },
  bad: { borderColor: colors.brick, backgroundColor: colors.brickSoft },
  dot: { width: 10, height: 10, borderRadius: 5 },
  okDot: { backgroundColor: colors.pine },
  busyDot: { backgroundColor: colors.focus },
  offDot: { backgroundColor: colors.amber },
  badDot: { backgroundColor: colors.brick },
  text: { fontFamily: fonts.bold, fontSize: 15, lineHeight: 20, color: colors.ink, flexShrink: 1 },
  badText: { color: colors.brick },
  // Floats over the screen below instead of pushing it down.
  panel: {
    position: 'absolute',
    top: '100%',
    width: 280,
    zIndex: 30,
    shadowColor: '#000',
    shadowOpacity: 0.18,
    shadowRadius: 12,
    shadowOffset: { width: 0, height: 4 },
    marginTop: space.xs,
    padding: space.md,
    gap: space.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  panelLeft: { left: 0 },
  panelRight: { right: 0 },
  row: { flexDirection: 'row', gap: space.sm },
  refused: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm },
  grow: { flexGrow: 1 },
});
