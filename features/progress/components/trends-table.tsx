import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import type { PatternId } from '@/features/screening/engine';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { BAND_LABELS, BAND_SHORT, daysAgo, PATTERN_SHORT } from '../labels';
import { clearanceWords, type SortKey, type TrendAthlete } from '../trends';
import { formatDate } from '@/features/ui/format-date';
import { PRINT_KEEP } from '@/features/ui/print';
import { capitalise } from '@/features/ui/capitalise';

/**
 * "Due since Jul 20, 2026" (how long overdue), "Due since Jul 20, 2026 · planned" when waiting in an open
 * round (the round's name did not fit the column), "Due" never screened, "from Jan 16, 2027" not yet.
 */
function rescreenCell(a: TrendAthlete): string {
  // Short: the column is narrow (the CSV and the athlete's page say it in full).
  if (!a.takingPart) return a.screeningRefused ? 'Family said no' : 'No consent yet';
  if (!a.rescreenDue) return `from ${a.rescreenDate ? formatDate(a.rescreenDate) : '–'}`;
  // Already waiting in an open round: planned, not forgotten.
  const due = a.rescreenDate ? `Due since ${formatDate(a.rescreenDate)}` : 'Due';
  return a.openRound ? `${due} · planned` : due;
}

/** Red only for a re-screen due that no open round has planned yet. */
const overdue = (a: TrendAthlete) => a.rescreenDue && !a.openRound;

const list = (p: PatternId[]) => (p.length ? p.map((x) => PATTERN_SHORT[x]).join(', ') : '–');
// In the table's narrow columns, one flag a line, each marked where it starts (a name may wrap; with
// commas, a comma after a wrapped name sat alone on a line). A narrow no-break space keeps the mark with
// the name and leaves room for the longest single word.
const lines = (p: PatternId[]) => (p.length ? p.map((x) => `•\u202f${PATTERN_SHORT[x]}`).join('\n') : '–');

/** "3 of 4" sessions since the screen; "none recorded" where the squad recorded none; "–" never screened. */
function sessionsText(a: TrendAthlete): string {
  const s = a.sessionsSinceScreen;
  if (!s) return '–';
  return s.held === 0 ? 'None recorded' : `${s.attended} of ${s.held}`;
}

type Col = { key: SortKey | null; label: string; flex: number; cell: (a: TrendAthlete, onPaper: boolean) => string };
const COLUMNS: Col[] = [
  { key: 'name', label: 'Athlete', flex: 1, cell: (a) => `${a.lastName}, ${a.firstName}` },
  { key: 'ageGroup', label: 'Age', flex: 0.6, cell: (a) => `${a.ageGroup} · ${a.sex === 'female' ? 'F' : 'M'}` },
  { key: 'maturityBand', label: 'Maturity', flex: 0.85, cell: (a) => BAND_SHORT[a.maturityBand ?? 'unknown'] },
  { key: 'flags', label: 'Flags left', flex: 1.35, cell: (a, onPaper) => (onPaper ? list : lines)(a.latestFlags.left) },
  { key: null, label: 'Flags right', flex: 1.35, cell: (a, onPaper) => (onPaper ? list : lines)(a.latestFlags.right) },
  { key: null, label: 'Other flags', flex: 1.35, cell: (a, onPaper) => (onPaper ? list : lines)([...a.latestFlags.both, ...a.latestFlags.unsided]) },
  { key: 'clearance', label: 'Clearance', flex: 1.15, cell: (a) => clearanceWords(a) ?? '–' },
  {
    key: 'daysSinceLastScreen',
    label: 'Last screen',
    flex: 0.8,
    cell: (a) => (a.daysSinceLastScreen === null ? 'Never' : capitalise(daysAgo(a.daysSinceLastScreen))),
  },
  { key: 'sessions', label: 'Sessions since screen', flex: 0.9, cell: sessionsText },
  // Wide enough at 1440 px for "planned" whole (at 0.8 it broke as "planne / d").
  { key: 'rescreenDue', label: 'Re-screen', flex: 1.05, cell: (a) => rescreenCell(a) },
];

type Props = {
  rows: TrendAthlete[];
  sort: SortKey;
  descending: boolean;
  onSort: (key: SortKey) => void;
  /**
   * Laid out for the one-page report: rows as low as their text (no touch height) and the flags in a line,
   * since the page is laid out wider than any screen before it is scaled down (40 athletes ran onto three
   * pages with a flag a line).
   */
  onPaper?: boolean;
};

/** Wide screens: one row per athlete, every column sortable from its header. */
export function TrendsTable({ rows, sort, descending, onSort, onPaper = false }: Props) {
  return (
    <View role="table" aria-label="Squad table" style={styles.table} testID="trends-table">
      <View role="row" style={[styles.row, styles.headRow]}>
        {COLUMNS.map((c) =>
          c.key ? (
            <Pressable
              key={c.label}
              role="columnheader"
              aria-sort={sort === c.key ? (descending ? 'descending' : 'ascending') : 'none'}
              onPress={() => onSort(c.key!)}
              style={[styles.cell, { flex: c.flex }]}
              testID={`sort-${c.key}`}
            >
              <Text variant="label" style={styles.head}>
                {c.label}
                {sort === c.key ? (descending ? ' ▼' : ' ▲') : ''}
              </Text>
            </Pressable>
          ) : (
            <View key={c.label} role="columnheader" style={[styles.cell, { flex: c.flex }]}>
              <Text variant="label" style={styles.head}>
                {c.label}
              </Text>
            </View>
          ),
        )}
      </View>
      {rows.map((a) => (
        <View key={a.id} role="row" style={[styles.row, onPaper && styles.paperRow]} testID="trends-row" {...PRINT_KEEP}>
          {COLUMNS.map((c, i) => (
            <View key={c.label} role="cell" style={[styles.cell, onPaper && styles.paperCell, { flex: c.flex }]}>
              {i === 0 ? (
                <Link href={`/athletes/${a.id}`}>
                  <Text variant="small" style={styles.name}>
                    {c.cell(a, onPaper)}
                  </Text>
                </Link>
              ) : (
                <Text variant="small" style={c.key === 'rescreenDue' && overdue(a) ? styles.due : styles.value}>
                  {c.cell(a, onPaper)}
                </Text>
              )}
            </View>
          ))}
        </View>
      ))}
    </View>
  );
}

/** Phones: one card per athlete, the flags per side first. */
export function TrendsCards({ rows }: { rows: TrendAthlete[] }) {
  return (
    <View style={styles.cards}>
      {rows.map((a) => (
        <View key={a.id} style={styles.card} testID="trends-row">
          <View style={styles.cardHead}>
            <Link href={`/athletes/${a.id}`} style={styles.cardLink}>
              <Text variant="label" style={styles.name}>
                {a.firstName} {a.lastName}
              </Text>
            </Link>
            <Text variant="small" style={overdue(a) ? styles.due : undefined}>
              {a.takingPart ? `Re-screen ${rescreenCell(a).replace(/^Due/, 'due')}` : rescreenCell(a)}
            </Text>
          </View>
          <Text variant="small">
            {a.ageGroup} · {a.sex} · {BAND_LABELS[a.maturityBand ?? 'unknown']} · clearance: {clearanceWords(a) ?? 'not recorded'}
          </Text>
          <Text variant="small">Left: {list(a.latestFlags.left)}</Text>
          <Text variant="small">Right: {list(a.latestFlags.right)}</Text>
          {a.latestFlags.both.length + a.latestFlags.unsided.length ? (
            <Text variant="small">Other: {list([...a.latestFlags.both, ...a.latestFlags.unsided])}</Text>
          ) : null}
          <Text variant="small">{a.daysSinceLastScreen === null ? 'Never screened' : `Last screened ${daysAgo(a.daysSinceLastScreen)}`}</Text>
          {a.sessionsSinceScreen && a.sessionsSinceScreen.held > 0 ? (
            <Text variant="small">{`Took part in ${a.sessionsSinceScreen.attended} of ${a.sessionsSinceScreen.held === 1 ? '1 session' : `the ${a.sessionsSinceScreen.held} sessions`} since that screen`}</Text>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.line, minHeight: 40, alignItems: 'center' },
  headRow: { backgroundColor: colors.paper },
  cell: { paddingHorizontal: space.xs, paddingVertical: space.xs, minWidth: 0 },
  paperRow: { minHeight: 0 },
  paperCell: { paddingVertical: 2 },
  head: { fontSize: 13 },
  name: { color: colors.pine, fontFamily: fonts.bold },
  value: { color: colors.ink },
  due: { color: colors.brick, fontFamily: fonts.bold },
  cards: { gap: space.sm },
  card: { gap: 2, padding: space.md, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
  // The athlete's name is the card's way in: a full touch target on a phone.
  cardLink: { minHeight: TOUCH_MIN, justifyContent: 'center', display: 'flex' },
});
