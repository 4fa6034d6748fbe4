import { useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, space } from '@/features/ui/theme';
import { auditSearch, useAuditQuery, type AuditFilters } from '../api/get-audit';
import { AUDIT_SUBJECTS } from '../choices';
import type { AuditRow } from '../types';
import { Chips } from '@/features/ui/components/chips';
import { auditActionInWords, auditDateErrors, auditDetailsInWords, auditSubjectInWords } from '../audit-details';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { formatDateTime } from '@/features/ui/format-date';

const SUBJECT_LABELS: Record<string, string> = {
  all: 'Everything',
  athlete: 'Athletes',
  assessment: 'Screens',
  note: 'Notes',
  clearance: 'Clearance',
  consent: 'Consent',
  email: 'E-mails',
  photo: 'Photos',
  settings: 'Settings',
  member: 'Members',
};
const SUBJECT_OPTIONS = (['all', ...AUDIT_SUBJECTS] as const).map((s) => ({ value: s, label: SUBJECT_LABELS[s]! }));

/** Who viewed or changed what: filters, a table on wide screens, rows on phones, and the CSV export. */
export function AuditTrail() {
  const { role } = useActiveClub().membership;
  if (!can(role, 'audit.read')) return <Notice tone="error">The audit trail is for the club’s admins.</Notice>;
  return <Trail />;
}

const SHOW_OPTIONS = [
  { value: 'changes', label: 'Changes only' },
  { value: 'all', label: 'Views and changes' },
] as const;

function Trail() {
  const [subject, setSubject] = useState<string>('all');
  // Changes first: one visit to a child's page records three or four views, which buried who changed what.
  const [show, setShow] = useState<'changes' | 'all'>('changes');
  // From an athlete's page: that athlete's records only, until cleared.
  const params = useLocalSearchParams<{ athleteId?: string }>();
  const [athleteId, setAthleteId] = useState(typeof params.athleteId === 'string' ? params.athleteId : '');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  // Days being typed are sent once they are whole days; meanwhile the list keeps the last good filters.
  const dateErrors = auditDateErrors(from, to);
  const datesOk = !dateErrors.from && !dateErrors.to;
  const [sent, setSent] = useState({ from: '', to: '' });
  if (datesOk && (sent.from !== from.trim() || sent.to !== to.trim())) setSent({ from: from.trim(), to: to.trim() });
  const filters: AuditFilters = {
    subject: subject === 'all' ? undefined : subject,
    from: sent.from || undefined,
    to: sent.to || undefined,
    athleteId: athleteId || undefined,
    changes: show === 'changes' ? 'true' : undefined,
  };
  const query = useAuditQuery(filters);
  const athleteName = query.data?.events.find((e) => e.athleteName)?.athleteName ?? 'one athlete';
  const { isWide } = useBreakpoints();
  const csvHref = `/api/audit${auditSearch(filters, 'csv')}`;
  return (
    <View style={styles.wrap} testID="audit-trail">
      <Text variant="title" accessibilityRole="header">
        Audit trail
      </Text>
      <Text variant="small">
        Who viewed or changed athletes, screens, notes, clearance, consent and the club’s members, which e-mails went out, and which photos were deleted.
      </Text>
      <Card>
        {athleteId ? (
          <View style={styles.only} testID="audit-athlete">
            <Text>{`Only the records of ${athleteName}.`}</Text>
            <Button label="Show every athlete" tone="quiet" testID="audit-athlete-clear" onPress={() => setAthleteId('')} />
          </View>
        ) : null}
        <Chips label="Show" options={SHOW_OPTIONS} value={show} onChange={setShow} testID="audit-show" />
        <Chips label="Kind of record" options={SUBJECT_OPTIONS} value={subject} onChange={setSubject} testID="audit-subject" />
        <View style={[styles.dates, isWide && styles.datesWide]}>
          <View style={styles.date}>
            <TextField label="From (YYYY-MM-DD)" value={from} onChangeText={setFrom} testID="audit-from" autoCapitalize="none" error={dateErrors.from} />
          </View>
          <View style={styles.date}>
            <TextField label="To (YYYY-MM-DD)" value={to} onChangeText={setTo} testID="audit-to" autoCapitalize="none" error={dateErrors.to} />
          </View>
        </View>
        {Platform.OS === 'web' ? (
          <Button
            label="Export as CSV"
            tone="secondary"
            testID="audit-csv"
            disabled={!datesOk}
            onPress={() => {
              window.location.assign(csvHref);
            }}
          />
        ) : null}
      </Card>
      {query.error ? <Notice tone="error">{query.error.message}</Notice> : null}
      {query.data ? (
        query.data.events.length === 0 ? (
          <Text>Nothing recorded for these filters.</Text>
        ) : (
          <View style={styles.table} testID="audit-rows" accessibilityRole={isWide ? undefined : 'list'}>
            {isWide ? (
              <View style={[styles.tr, styles.th]}>
                {['When', 'Who', 'What', 'Record', 'Athlete', 'Details'].map((h, i) => (
                  <Text key={h} variant="label" style={[styles.td, COLS[i]]}>
                    {h}
                  </Text>
                ))}
              </View>
            ) : null}
            {query.data.events.map((e) => (isWide ? <WideRow key={e.id} e={e} /> : <PhoneRow key={e.id} e={e} />))}
          </View>
        )
      ) : query.error ? null : (
        <Text>Loading…</Text>
      )}
    </View>
  );
}

// In the reader's locale and time zone, as every other date of the app (the CSV keeps UTC, and says so).
const when = (iso: string) => formatDateTime(iso);
const details = auditDetailsInWords;

function WideRow({ e }: { e: AuditRow }) {
  const cells = [when(e.at), e.actorName ?? 'System', auditActionInWords(e.action), auditSubjectInWords(e.subjectKind), e.athleteName ?? '', details(e.detail)];
  return (
    <View style={styles.tr} testID="audit-row">
      {cells.map((c, i) => (
        <Text key={i} variant={i === 5 ? 'small' : 'body'} style={[styles.td, COLS[i]]}>
          {c}
        </Text>
      ))}
    </View>
  );
}

function PhoneRow({ e }: { e: AuditRow }) {
  return (
    <View style={styles.phoneRow} testID="audit-row">
      <Text variant="label">{`${e.actorName ?? 'System'}: ${auditActionInWords(e.action)} ${auditSubjectInWords(e.subjectKind)}`}</Text>
      <Text variant="small">{`${when(e.at)}${e.athleteName ? ` · ${e.athleteName}` : ''}`}</Text>
      {details(e.detail) ? <Text variant="small">{details(e.detail)}</Text> : null}
    </View>
  );
}

const COLS = [{ flex: 1.3 }, { flex: 1.2 }, { flex: 1 }, { flex: 0.9 }, { flex: 1.2 }, { flex: 2.6 }];

const styles = StyleSheet.create({
  only: { gap: space.xs },
  wrap: { gap: space.lg },
  dates: { gap: space.md },
  datesWide: { flexDirection: 'row' },
  date: { flex: 1 },
  table: { backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: 10 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line, paddingVertical: space.sm, paddingHorizontal: space.md, gap: space.md },
  th: { backgroundColor: colors.paper },
  td: { minWidth: 0 },
  phoneRow: { padding: space.md, borderBottomWidth: 1, borderBottomColor: colors.line, gap: 2 },
});
