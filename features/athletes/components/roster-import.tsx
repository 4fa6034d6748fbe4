import { plural } from '@/features/ui/plural';
import { Link } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/features/api/client';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { scrollToId } from '@/features/ui/scroll-to';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useSquadsQuery } from '../api/get-squads';
import { useCheckRosterMutation, useImportRosterMutation, type RosterFile } from '../api/import-roster';
import type { ImportReport, ImportReportRow } from '../api/types';
import { ROSTER_COLUMN_LABELS, ROSTER_HEADER_LINE, type RosterColumn } from '../schemas';
import { ExampleDownload, RosterFilePicker } from './file-picker';

const READY_SHOWN = 30;

/** Choose a CSV, read the per-line report, then import every line at once (only when all are fine). */
export function RosterImport() {
  const { isWide } = useBreakpoints();
  const [file, setFile] = useState<RosterFile | null>(null);
  const check = useCheckRosterMutation();
  const commit = useImportRosterMutation();

  const pick = (picked: RosterFile) => {
    setFile(picked);
    commit.reset();
    check.mutate(picked);
  };
  const runImport = () => {
    if (!file) return;
    commit.mutate(file, {
      // Someone changed the roster since the check: show the fresh report.
      onError: (error) => {
        if (error instanceof ApiError && error.code === 'import_has_errors') check.mutate(file);
      },
    });
  };
  const report = check.data;
  const done = commit.data;
  // The button sat under a long report: on a phone the result would be above the screen's top.
  useEffect(() => {
    if (done) scrollToId(DONE_ANCHOR);
  }, [done]);

  return (
    <View style={[styles.cols, isWide && styles.colsWide]}>
      <Card style={isWide ? styles.mainCol : undefined} nativeID={DONE_ANCHOR}>
        <Text variant="heading">Check and import</Text>
        {done ? (
          <Notice title={importedTitle(done)} testID="import-done">
            <Text>
              They are in their squads now, with their consent answers dated as the report said (a changed answer is added to the athlete&apos;s consent
              history).
            </Text>
            <Link href="/athletes" style={styles.link}>
              <Text variant="label">See the athletes →</Text>
            </Link>
          </Notice>
        ) : (
          <Text>Choose the file: every line is checked first, and nothing is saved until you confirm.</Text>
        )}
        <RosterFilePicker label={file ? 'Choose another file' : 'Choose a CSV file'} onPick={pick} disabled={check.isPending || commit.isPending} />
        {file ? (
          <Text variant="small" testID="roster-file-name">
            {file.name} · {Math.max(1, Math.round(file.size / 1024))} KB
          </Text>
        ) : null}
        {check.isPending ? <Text>Checking every line…</Text> : null}
        {check.error ? (
          <Notice tone="error" title="This file cannot be imported" testID="import-file-error">
            {check.error.message}
          </Notice>
        ) : null}
        {commit.error ? <Notice tone="error">{commit.error.message}</Notice> : null}
        {report && !check.isPending && !done ? <Report report={report} /> : null}
        {report && !check.isPending && !done && report.errorCount === 0 ? (
          toWrite(report) ? (
            <Button label={importLabel(report)} testID="import-commit" busy={commit.isPending} onPress={runImport} />
          ) : (
            <Text testID="import-nothing">Nothing in this file differs from the club&apos;s records: there is nothing to import.</Text>
          )
        ) : null}
      </Card>
      <View style={isWide ? styles.sideCol : undefined}>
        <FileFormat />
      </View>
    </View>
  );
}

const DONE_ANCHOR = 'roster-import-top';

/** Lines that add a child, and lines of children already in the club that change something. */
function toWrite(r: ImportReport): { creates: number; updates: number } | null {
  const creates = r.rows.filter((x) => x.ok && x.action === 'create').length;
  const updates = r.rows.filter((x) => x.ok && x.action === 'update' && (x.changes?.length ?? 0) > 0).length;
  return creates + updates > 0 ? { creates, updates } : null;
}

function importLabel(r: ImportReport): string {
  const { creates, updates } = toWrite(r) ?? { creates: 0, updates: 0 };
  if (updates === 0) return `Import ${plural(creates, 'athlete', 'athletes')}`;
  if (creates === 0) return `Update ${plural(updates, 'athlete', 'athletes')}`;
  return `Import ${creates} new, update ${updates}`;
}

function importedTitle(r: ImportReport): string {
  const { creates, updates } = toWrite(r) ?? { creates: 0, updates: 0 };
  if (updates === 0) return `${plural(creates, 'athlete', 'athletes')} imported`;
  return `${plural(creates, 'new athlete', 'new athletes')} imported, ${updates} updated`;
}

function Report({ report }: { report: ImportReport }) {
  const bad = report.rows.filter((r) => !r.ok);
  const ready = report.rows.filter((r) => r.ok && r.action !== 'update');
  const updates = report.rows.filter((r) => r.ok && r.action === 'update');
  const toCheck = report.rows.filter((r) => r.ok && hasChecks(r));
  // The first lines, and past them every line to look at again.
  const shownReady = [...ready.slice(0, READY_SHOWN), ...ready.slice(READY_SHOWN).filter(hasChecks)];
  const total = report.rows.length;
  return (
    <View style={styles.report} testID="import-report">
      {report.errorCount > 0 ? (
        <Notice tone="caution" title={`${report.errorCount} of ${total} lines need attention`} testID="import-summary">
          Nothing has been imported. Correct these lines in the spreadsheet, save it as CSV again, and choose the file again.
        </Notice>
      ) : (
        <Notice title={`All ${total} lines are ready`} testID="import-summary">
          {toCheck.length > 0
            ? `Check the names below, then import. ${toCheck.length === 1 ? 'One line asks' : `${toCheck.length} lines ask`} for a second look (marked ⚠): the import does not stop for ${toCheck.length === 1 ? 'it' : 'them'}.`
            : 'Check the names below, then import.'}
        </Notice>
      )}
      {bad.map((row) => (
        <ProblemLine key={row.line} row={row} />
      ))}
      {updates.length > 0 ? (
        <View style={styles.readyBox} testID="import-updates">
          <Text variant="label">Already in the club: updated from the file ({updates.length})</Text>
          {updates.map((row) => (
            <View key={row.line} testID="import-update-line">
              <Text variant="small" style={styles.updateName}>
                Line {row.line}: {personOf(row)}
              </Text>
              {row.changes && row.changes.length > 0 ? (
                <>
                  {/* A consent answer changed by a file is what an admin must not read past. */}
                  {row.changes.some(isConsentChange) ? (
                    <Text variant="small" style={styles.consentChange} testID="import-consent-change">
                      {`⚠ ${row.changes.filter(isConsentChange).join(' · ')}`}
                    </Text>
                  ) : null}
                  {row.changes.some((c) => !isConsentChange(c)) ? (
                    <Text variant="small">{row.changes.filter((c) => !isConsentChange(c)).join(' · ')}</Text>
                  ) : null}
                </>
              ) : (
                <Text variant="small">Nothing changes.</Text>
              )}
              <Checks row={row} />
            </View>
          ))}
        </View>
      ) : null}
      {ready.length > 0 ? (
        <View style={styles.readyBox}>
          <Text variant="label">New ({ready.length})</Text>
          <Text variant="small" testID="import-ready-totals">
            {readyTotals(ready)}
          </Text>
          {/* Lines to look at again are listed even past the first few. */}
          {shownReady.map((row) => (
            <View key={row.line} testID="import-ready-line">
              <Text variant="small" style={styles.updateName}>
                Line {row.line}: {personOf(row)}
                {row.values.squad ? ` · ${row.values.squad}` : ''}
              </Text>
              {row.changes && row.changes.length > 0 ? <Text variant="small">{row.changes.join(' · ')}</Text> : null}
              <Checks row={row} />
            </View>
          ))}
          {ready.length > shownReady.length ? <Text variant="small">…and {ready.length - shownReady.length} more.</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

const hasChecks = (row: ImportReportRow) => (row.checks?.length ?? 0) > 0;

/** What a ready line asks to look at again (a child older than the squad's name says). */
function Checks({ row }: { row: ImportReportRow }) {
  if (!row.checks?.length) return null;
  return (
    <Text variant="small" style={styles.consentChange} testID="import-check">
      {`⚠ ${row.checks.join(' · ')}`}
    </Text>
  );
}

/** A changed consent answer, or the day the answers are dated, in an update's list of changes. */
const isConsentChange = (change: string) => change.includes('consent:') || change.startsWith('consent answers dated');

/** Over every new line, shown or not: how many get photo consent and how many a parent account. */
function readyTotals(rows: ImportReportRow[]): string {
  const photos = rows.filter((r) => r.changes?.includes('photo consent: yes')).length;
  const parents = rows.filter((r) => r.changes?.some((c) => c.startsWith('parent account linked'))).length;
  // Who may be screened once imported: only those the file gives a yes.
  const screened = rows.filter((r) => r.changes?.includes('screening and exercises consent: yes')).length;
  return `Screening and exercises agreed for ${screened} of ${rows.length}${screened < rows.length ? ' (the others are not screened until the family agrees)' : ''}; photo consent recorded as yes for ${photos} of ${rows.length}; a parent account linked for ${parents} of ${rows.length}.`;
}

function ProblemLine({ row }: { row: ImportReportRow }) {
  return (
    <View style={styles.problem} testID="import-problem-line">
      <Text variant="label">
        Line {row.line}: {personOf(row)}
      </Text>
      {Object.entries(row.errors).map(([field, message]) => (
        <Text key={field} style={styles.problemText}>
          <Text style={styles.problemField}>{ROSTER_COLUMN_LABELS[field as RosterColumn] ?? field}:</Text> {message}
          {/* What the cell holds, to find it in a long spreadsheet. */}
          {row.values[field as RosterColumn]?.trim() ? ` The file has “${row.values[field as RosterColumn]!.trim()}”.` : ''}
        </Text>
      ))}
    </View>
  );
}

const personOf = (row: ImportReportRow) => `${row.values.first_name ?? ''} ${row.values.last_name ?? ''}`.trim() || '(no name)';

function FileFormat() {
  const squads = useSquadsQuery();
  const squadNames = squads.data?.squads.map((s) => s.name).join(', ');
  return (
    <Card>
      <Text variant="heading">The file</Text>
      <Text>One athlete per line, in a CSV file saved from a spreadsheet (“CSV UTF-8”), at most 1 MB. The first line names the columns, in any order:</Text>
      <Text style={styles.code} selectable testID="roster-header-example">
        {ROSTER_HEADER_LINE}
      </Text>
      <ExampleDownload />
      <View style={styles.columns}>
        <Column name="first_name, last_name" text="The athlete’s names." />
        <Column name="date_of_birth" text="Year-month-day, e.g. 2014-03-09." />
        <Column name="sex" text="F or M (female or male)." />
        <Column name="racket_hand, take_off_leg" text="L or R (left or right)." />
        <Column name="squad" text={squadNames ? `One of: ${squadNames}.` : 'The name of one of the club’s squads.'} />
        <Column name="photo_consent, email_summaries_consent" text="yes or no (y/n also work)." />
        <Column name="guardian_email" text="Optional: the e-mail of a parent account already in the club, to link." />
        <Column
          name="screening_consent"
          text="Optional: yes or no, the family's agreement to screens and corrective exercises. Left empty, nothing is recorded: a new athlete is not screened until it is."
        />
        <Column
          name="consents_decided_on"
          text="Optional: the day the family gave these answers (year-month-day, e.g. the date on their signed form). Left empty, they are dated today."
        />
      </View>
      <Text variant="small">
        A child already in the club (same name and date of birth) is updated from the line: the report lists what changes before anything is saved. A child
        listed twice, or archived, is pointed out and not imported.
      </Text>
    </Card>
  );
}

function Column({ name, text }: { name: string; text: string }) {
  return (
    <View style={styles.column}>
      <Text style={styles.columnName}>{name}</Text>
      <Text variant="small">{text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  consentChange: { fontFamily: fonts.bold, color: colors.amber },
  colsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  sideCol: { flexGrow: 2, flexBasis: 0, minWidth: 0 },
  mainCol: { flexGrow: 3, flexBasis: 0, minWidth: 0 },
  link: { minHeight: TOUCH_MIN, paddingVertical: space.md },
  code: {
    fontFamily: 'monospace',
    fontSize: 14,
    lineHeight: 20,
    color: colors.ink,
    backgroundColor: colors.paper,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.sm,
    padding: space.sm,
    // The header has no spaces: let it wrap anywhere rather than run off a phone's screen.
    wordBreak: 'break-all',
  } as never,
  columns: { gap: space.sm },
  column: { gap: 0 },
  columnName: { fontFamily: 'monospace', fontSize: 14, color: colors.pineDark },
  report: { gap: space.md },
  readyBox: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm },
  updateName: { fontFamily: fonts.bold },
  problem: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 2, borderColor: colors.brick, backgroundColor: colors.brickSoft },
  problemText: { fontFamily: fonts.regular, fontSize: 16, lineHeight: 22, color: colors.ink },
  problemField: { fontFamily: fonts.bold },
});
