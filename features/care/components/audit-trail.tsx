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
import { auditActionInWords, auditDetailsInWords, auditSubjectInWords } from '../audit-details';

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
};
const SUBJECT_OPTIONS = (['all', ...AUDIT_SUBJECTS] as const).map((s) => ({ value: s, label: SUBJECT_LABELS[s]! }));

/** Who viewed or changed what: filters, a table on wide screens, rows on phones, and the CSV export. */
export function AuditTrail() {
  const [subject, setSubject] = useState<string>('all');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const filters: AuditFilters = { subject: subject === 'all' ? undefined : subject, from: from || undefined, to: to || undefined };
  const query = useAuditQuery(filters);
  const { isWide } = useBreakpoints();
  const csvHref = `/api/audit${auditSearch(filters, 'csv')}`;
  return (
    <View style={styles.wrap} testID="audit-trail">
      <Text variant="title" accessibilityRole="header">
        Audit trail
      </Text>
      <Text variant="small">Who viewed or changed athletes, screens, notes, clearance and consent, which e-mails went out, and which photos were deleted.</Text>
      <Card>
        <Chips label="Kind of record" options={SUBJECT_OPTIONS} value={subject} onChange={setSubject} testID="audit-subject" />
        <View style={[styles.dates, isWide && styles.datesWide]}>
          <View style={styles.date}>
            <TextField label="From (YYYY-MM-DD)" value={from} onChangeText={setFrom} testID="audit-from" autoCapitalize="none" />
          </View>
          <View style={styles.date}>
            <TextField label="To (YYYY-MM-DD)" value={to} onChangeText={setTo} testID="audit-to" autoCapitalize="none" />
          </View>
        </View>
        {Platform.OS === 'web' ? (
          <Button
            label="Export as CSV"
            tone="secondary"
            testID="audit-csv"
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
      ) : (
        <Text>Loading…</Text>
      )}
    </View>
  );
}

const when = (iso: string) => iso.slice(0, 16).replace('T', ' ');
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
