import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card } from '@/features/ui/components/card';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, space } from '@/features/ui/theme';

/** The frame of the signed-out screens: the wordmark, then one card. */
export function PublicCard({ title, subtitle, children }: { title: string; subtitle?: string; children: ReactNode }) {
  return (
    <Page narrow title={title} contentContainerStyle={styles.page}>
      <View style={styles.brand}>
        <View style={styles.mark} />
        <Text style={styles.word}>Squadline</Text>
      </View>
      <Card role="main">
        <Text variant="title" accessibilityRole="header">
          {title}
        </Text>
        {subtitle ? <Text variant="small">{subtitle}</Text> : null}
        {children}
      </Card>
    </Page>
  );
}

const styles = StyleSheet.create({
  page: { paddingTop: space.xxl * 1.5 },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  mark: { width: 22, height: 22, borderRadius: 4, backgroundColor: colors.pine, transform: [{ rotate: '45deg' }] },
  word: { fontFamily: fonts.bold, fontSize: 24, color: colors.pineDark },
});
