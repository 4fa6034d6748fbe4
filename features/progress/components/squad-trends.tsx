import { useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { biggestSquadId, useSquadsQuery } from '@/features/athletes/api/get-squads';
import type { MaturityBand, PatternId, Sex } from '@/features/screening/engine';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { squadTrendsCsvUrl, useSquadTrendsQuery } from '../api/get-squad-trends';
import { BAND_LABELS, filterWords, kneeAngleName, PATTERN_SHORT } from '../labels';
import {
  AGE_GROUPS,
  defaultRoundPair,
  filterAthletes,
  kneeMeasurementIds,
  sortAthletes,
  type SortKey,
  type TrendFilters,
  type TrendsResponse,
} from '../trends';
import { Chips } from '@/features/ui/components/chips';
import { canPrint, downloadFile, printPage, PRINT_HIDE, PRINT_ROOT, usePrintStyles } from '@/features/ui/print';
import { PRINT_FLOW, PRINT_FLOW_PARENT, PRINT_FULL, PRINT_THIRD, useFitToOnePage, usePrinting } from '@/features/ui/print-fit';
import { ChangeChart, ChartPrintWidth, FlagShareChart, KneeDistributionChart, patternsIn } from './trend-charts';
import { TrendsCards, TrendsTable } from './trends-table';
import { formatDate } from '@/features/ui/format-date';

const SORT_LABELS: Record<SortKey, string> = {
  name: 'Name',
  ageGroup: 'Age group',
  maturityBand: 'Maturity',
  flags: 'Flags',
  daysSinceLastScreen: 'Last screen',
  rescreenDue: 'Re-screen due',
  clearance: 'Clearance',
  sessions: 'Sessions taken part in',
};

/** The squad over the season: filterable table beside the charts on wide screens, cards then charts on a phone. */
/** Where a link asks the table to start: a sort, a maturity band (unknown values are ignored). */
export type TrendsStart = { sort?: string; band?: string };

export default function SquadTrends({ initialSquadId, start }: { initialSquadId?: string; start?: TrendsStart }) {
  usePrintStyles();
  useFitToOnePage();
  const squads = useSquadsQuery();
  const [squadId, setSquadId] = useState<string | null>(initialSquadId ?? null);
  const [compareId, setCompareId] = useState<string>('');
  const router = useRouter();
  useEffect(() => {
    if (!squadId && squads.data) setSquadId(biggestSquadId(squads.data.squads));
  }, [squadId, squads.data]);
  const chooseSquad = (v: string) => {
    setSquadId(v);
    // In the address too: a reload or a shared link opens the same squad.
    router.setParams({ squad: v });
  };
  const trends = useSquadTrendsQuery(squadId);
  const other = useSquadTrendsQuery(compareId || null);

  if (squads.error) return <Notice tone="error">{squads.error.message}</Notice>;
  if (squads.isPending) return <Text>Loading squads…</Text>;
  if (squads.data.squads.length === 0) return <Notice>No squad yet: add one under Athletes.</Notice>;
  const squadOptions = squads.data.squads.map((s) => ({ value: s.id, label: s.name }));

  return (
    <View style={styles.wrap} {...PRINT_ROOT} testID="squad-trends">
      <Text variant="title" accessibilityRole="header">
        Squad trends{trends.data ? `: ${trends.data.squad.name}` : ''}
      </Text>
      <View {...PRINT_HIDE}>
        <Chips label="Squad" options={squadOptions} value={squadId ?? ''} onChange={chooseSquad} testID="squad-choice" />
      </View>
      {trends.error ? <Notice tone="error">{trends.error.message}</Notice> : null}
      {trends.isPending ? <Text>Loading the season…</Text> : null}
      {trends.data ? (
        <TrendsBody
          key={trends.data.squad.id}
          data={trends.data}
          start={trends.data.squad.id === initialSquadId ? start : undefined}
          compare={
            <View style={styles.compare}>
              <View {...PRINT_HIDE}>
                <Chips
                  label="Compare with another squad"
                  options={[{ value: '', label: 'None' }, ...squadOptions.filter((s) => s.value !== squadId)]}
                  value={compareId}
                  onChange={setCompareId}
                  testID="compare-choice"
                />
              </View>
              {compareId && other.data ? <TwoSquads a={trends.data} b={other.data} /> : compareId && other.isPending ? <Text>Loading…</Text> : null}
            </View>
          }
        />
      ) : null}
    </View>
  );
}

function TwoSquads({ a, b }: { a: TrendsResponse; b: TrendsResponse }) {
  const { isTabletUp } = useBreakpoints();
  return (
    <View style={[styles.stack, isTabletUp && styles.row]} testID="two-squads">
      <View style={styles.flex}>
        <FlagShareChart rounds={a.rounds} title={`${a.squad.name}: share flagged per round`} />
      </View>
      <View style={styles.flex}>
        <FlagShareChart rounds={b.rounds} title={`${b.squad.name}: share flagged per round`} />
      </View>
    </View>
  );
}

function TrendsBody({ data, compare, start }: { data: TrendsResponse; compare: React.ReactNode; start?: TrendsStart }) {
  // Printed from a phone, the report takes the wide layout (the table, not the cards) for the page.
  const printing = usePrinting();
  const breakpoints = useBreakpoints();
  const isWide = breakpoints.isWide || printing;
  const isTabletUp = breakpoints.isTabletUp || printing;
  const [filters, setFilters] = useState<Required<TrendFilters>>(() => ({
    sex: '',
    ageGroup: '',
    maturityBand: start?.band && start.band in BAND_LABELS ? (start.band as MaturityBand | 'unknown') : '',
    flag: '',
  }));
  const [sort, setSort] = useState<SortKey>(() => (start?.sort && start.sort in SORT_LABELS ? (start.sort as SortKey) : 'name'));
  const [descending, setDescending] = useState(false);
  const [showFilters, setShowFilters] = useState(false);
  const rows = useMemo(() => sortAthletes(filterAthletes(data.athletes, filters), sort, descending), [data.athletes, filters, sort, descending]);

  const kneeIds = useMemo(() => kneeMeasurementIds(data.kneeAngles), [data.kneeAngles]);
  const [kneeId, setKneeId] = useState(() => kneeIds.find((k) => k.startsWith('single-leg-squat-left')) ?? kneeIds[0] ?? '');
  const screenedRounds = data.rounds.filter((r) => r.screened > 0);
  const [fromId, setFromId] = useState(() => defaultRoundPair(data.rounds).from);
  const [toId, setToId] = useState(() => defaultRoundPair(data.rounds).to);
  const from = data.rounds.find((r) => r.id === fromId);
  const to = data.rounds.find((r) => r.id === toId);

  const patterns = patternsIn(data.rounds);
  const ageGroups = AGE_GROUPS.filter((g) => data.athletes.some((a) => a.ageGroup === g));
  const set =
    <K extends keyof TrendFilters>(key: K) =>
    (value: string) =>
      setFilters((f) => ({ ...f, [key]: value }));
  const onSort = (key: SortKey) => {
    if (key === sort) setDescending((d) => !d);
    else {
      setSort(key);
      setDescending(false);
    }
  };

  const active = Object.values(filters).filter(Boolean).length;
  const controls =
    !isTabletUp && !showFilters ? (
      <View style={styles.actions} {...PRINT_HIDE}>
        <Button label={`Filter and sort${active ? ` (${active} on)` : ''}`} tone="secondary" testID="toggle-filters" onPress={() => setShowFilters(true)} />
        <Button label="Download CSV" tone="quiet" testID="download-csv" onPress={() => downloadFile(squadTrendsCsvUrl(data.squad.id, filters))} />
      </View>
    ) : (
      <View style={[styles.filters, isWide && styles.filtersWide]} {...PRINT_HIDE} testID="trend-filters">
        <Chips
          label="Sex"
          value={filters.sex}
          onChange={set('sex')}
          testID="filter-sex"
          options={[
            { value: '', label: 'All' },
            { value: 'female' as Sex, label: 'Female' },
            { value: 'male' as Sex, label: 'Male' },
          ]}
        />
        <Chips
          label="Age group"
          value={filters.ageGroup}
          onChange={set('ageGroup')}
          testID="filter-age"
          options={[{ value: '', label: 'All' }, ...ageGroups.map((g) => ({ value: g, label: g }))]}
        />
        <Chips
          label="Maturity band"
          value={filters.maturityBand}
          onChange={set('maturityBand')}
          testID="filter-band"
          options={[
            { value: '', label: 'All' },
            ...(['pre', 'circa', 'post', 'unknown'] as (MaturityBand | 'unknown')[]).map((b) => ({ value: b, label: BAND_LABELS[b] })),
          ]}
        />
        <Chips
          label="Latest flag"
          value={filters.flag}
          onChange={set('flag')}
          testID="filter-flag"
          options={[
            { value: '', label: 'All' },
            { value: 'any', label: 'Any movement flag' },
            { value: 'none', label: 'No movement flag' },
            ...(Object.keys(PATTERN_SHORT) as PatternId[])
              .filter((p) => patterns.includes(p) || data.athletes.some((a) => Object.values(a.latestFlags).flat().includes(p)))
              .map((p) => ({ value: p, label: PATTERN_SHORT[p] })),
          ]}
        />
        {!isWide ? (
          <Chips
            label="Sort by"
            value={sort}
            onChange={(k) => onSort(k)}
            testID="sort-choice"
            options={(Object.keys(SORT_LABELS) as SortKey[]).map((k) => ({ value: k, label: SORT_LABELS[k] }))}
          />
        ) : null}
        <View style={styles.actions}>
          <Button label="Download CSV" tone="secondary" testID="download-csv" onPress={() => downloadFile(squadTrendsCsvUrl(data.squad.id, filters))} />
          {canPrint ? <Button label="Print one-page report" tone="quiet" testID="print-report" onPress={printPage} /> : null}
          {!isTabletUp ? <Button label="Done" tone="quiet" testID="toggle-filters" onPress={() => setShowFilters(false)} /> : null}
        </View>
      </View>
    );

  const table = (
    <View style={styles.stack}>
      <Text variant="small" testID="row-count">
        {rows.length} of {data.athletes.length} athletes
        {active > 0 ? ` · only ${filterWords(filters).join(', ')}` : ''} · counted on {formatDate(data.today)}
      </Text>
      {rows.length === 0 && active > 0 ? (
        <Notice title="No athlete matches these filters" testID="trends-no-match">
          <View style={styles.stack}>
            <Text>Choose “All” in a filter, or clear them all.</Text>
            <Button
              label="Clear the filters"
              tone="secondary"
              testID="clear-filters"
              onPress={() => setFilters({ sex: '', ageGroup: '', maturityBand: '', flag: '' })}
            />
          </View>
        </Notice>
      ) : isTabletUp ? (
        <TrendsTable rows={rows} sort={sort} descending={descending} onSort={onSort} onPaper={printing} />
      ) : (
        <TrendsCards rows={rows} />
      )}
    </View>
  );

  const shareChart = (
    <View style={styles.stack}>
      {active > 0 ? (
        <Text variant="small" testID="charts-filter-note">
          The flag shares and knee angles count the whole squad; the change per athlete shows the athletes the filters keep.
        </Text>
      ) : null}
      <FlagShareChart rounds={data.rounds} title="Share of the squad with each flag, per round" testID="flag-share-chart" />
    </View>
  );
  const kneeChoice = kneeIds.length ? (
    <View {...PRINT_HIDE}>
      <Chips
        label="Knee angle shown"
        value={kneeId}
        onChange={setKneeId}
        testID="knee-choice"
        options={kneeIds.map((k) => ({ value: k, label: kneeAngleName(k) }))}
      />
    </View>
  ) : null;
  const distribution = kneeIds.length ? (
    <KneeDistributionChart rounds={data.rounds} kneeAngles={data.kneeAngles} measurementId={kneeId} name={kneeAngleName(kneeId)} />
  ) : null;
  const change =
    kneeIds.length && screenedRounds.length >= 2 ? (
      <View style={styles.stack}>
        <View style={styles.stack} {...PRINT_HIDE}>
          <Chips label="From round" value={fromId} onChange={setFromId} options={screenedRounds.map((r) => ({ value: r.id, label: r.name }))} />
          <Chips label="To round" value={toId} onChange={setToId} options={screenedRounds.map((r) => ({ value: r.id, label: r.name }))} />
        </View>
        {from && to && from.id !== to.id && rows.length === 0 ? (
          <Text variant="small">No athlete matches the filters, so there is no change to draw.</Text>
        ) : from && to && from.id !== to.id ? (
          <ChangeChart
            athletes={rows}
            rounds={data.rounds}
            kneeAngles={data.kneeAngles}
            from={from}
            to={to}
            measurementId={kneeId}
            name={kneeAngleName(kneeId)}
          />
        ) : null}
      </View>
    ) : null;

  return (
    <ChartPrintWidth.Provider value={printing ? 340 : 0}>
      <View style={styles.stack} {...PRINT_FLOW_PARENT}>
        {controls}
        {isWide ? (
          // The width used: the table beside the season's flag shares, then the knee angles' two charts
          // side by side under both (they stacked in the narrow column, leaving the table's side empty).
          // On paper: the table across the page, the three charts in one row under it.
          <>
            <View style={styles.row} {...PRINT_FLOW}>
              <View style={styles.tableCol} {...PRINT_FULL}>
                {table}
              </View>
              <View style={styles.chartCol} {...PRINT_THIRD}>
                {shareChart}
              </View>
            </View>
            {kneeChoice}
            <View style={styles.row} {...PRINT_FLOW}>
              <View style={styles.flex} {...PRINT_THIRD}>
                {distribution}
              </View>
              <View style={styles.flex} {...PRINT_THIRD}>
                {change}
              </View>
            </View>
          </>
        ) : (
          <>
            {table}
            {shareChart}
            {kneeChoice}
            {distribution}
            {change}
          </>
        )}
        {compare}
        <Text variant="small">
          Flags use adult norms (Herrington and Munro 2010) applied to juniors; a change counts only beyond the smallest detectable difference of Munro,
          Herrington and Carolan 2012. Screening is not a diagnosis: refer pain to a physiotherapist or doctor.
        </Text>
      </View>
    </ChartPrintWidth.Provider>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  stack: { gap: space.md },
  row: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  flex: { flex: 1, minWidth: 0 },
  // Two thirds for the table: at 1440 px its flag columns then hold "dorsiflexion" whole (with 3:2
  // they broke it, and "Asymmetry", mid-word); the charts keep a phone's width.
  // The table has ten columns: nearly three quarters of the width, so that no header or flag name breaks
  // inside a word at 1440 px ("Asymmetry", "Clearance" broke at 2.3).
  tableCol: { flex: 2.7, minWidth: 0 },
  chartCol: { flex: 1, minWidth: 0, gap: space.md },
  filters: { gap: space.sm },
  filtersWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl, rowGap: space.sm, alignItems: 'flex-end' },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  compare: { gap: space.md },
});
