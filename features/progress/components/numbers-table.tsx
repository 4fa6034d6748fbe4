import { useState } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';
import { PRINT_HIDE } from '@/features/ui/print';

/**
 * A chart's text alternative: its numbers as a table. Always in the page for screen readers; shown on
 * screen when asked ("Show numbers"), for anyone who prefers numbers to a picture.
 */
export function NumbersTable({ caption, columns, rows, testID }: { caption: string; columns: string[]; rows: (string | number)[][]; testID?: string }) {
  const [shown, setShown] = useState(false);
  return (
    <View>
      <Pressable accessibilityRole="button" onPress={() => setShown((s) => !s)} style={styles.toggle} {...PRINT_HIDE}>
        <Text variant="small" style={styles.toggleText}>
          {shown ? 'Hide numbers' : 'Show numbers'}
        </Text>
      </Pressable>
      {/* Hidden, it stays off paper too (print unrolls every clipped box, and it ran on into a blank page). */}
      {/* Cells of one width per column, so that each figure stands under its heading whatever the words;
          a table wider than the card scrolls sideways instead of running past its edge. */}
      <ScrollView horizontal style={shown ? undefined : styles.hidden} {...(shown ? {} : PRINT_HIDE)}>
        <View role="table" aria-label={caption} style={shown ? styles.table : undefined} testID={testID}>
          <View role="row" style={styles.row}>
            {columns.map((c, j) => (
              <Text key={c} role="columnheader" variant="label" style={[styles.cell, j === 0 && styles.first]}>
                {c}
              </Text>
            ))}
          </View>
          {rows.map((r, i) => (
            <View key={i} role="row" style={styles.row}>
              {r.map((v, j) => (
                <Text key={j} role="cell" variant="small" style={[styles.cell, j === 0 && styles.first]}>
                  {String(v)}
                </Text>
              ))}
            </View>
          ))}
        </View>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  toggle: { minHeight: TOUCH_MIN, justifyContent: 'center', alignSelf: 'flex-start' },
  toggleText: { color: colors.pine, textDecorationLine: 'underline' },
  table: { borderTopWidth: 1, borderColor: colors.line },
  // Visually hidden, still read by screen readers.
  hidden: { position: 'absolute', width: 1, height: 1, overflow: 'hidden', opacity: 0 },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.line, paddingVertical: 2 },
  cell: { width: 96, flexShrink: 0, paddingHorizontal: space.xs },
  first: { width: 136 },
});
