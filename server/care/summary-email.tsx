import { Body, Container, Head, Heading, Hr, Html, Link, Preview, render, Section, Text } from '@react-email/components';
import { CLUB_ONLY_WORDS, recheckLine } from '@/features/care/family-words';
import type { FamilySummary } from '@/features/care/types';
import { todayIso } from '@/features/athletes/age';
import { formatDateInWords } from '@/features/ui/format-date';

/**
 * The family-summary e-mail: one React Email template rendered to its HTML part and, through the same
 * renderer's plain-text mode, to its text part. No images (nothing to block, nothing that tracks).
 */
type Props = {
  summary: FamilySummary;
  viewUrl: string;
  unsubscribeUrl: string;
  recipientName: string;
  /** Notes the care team shares with the family about the child (their words stay on the page). */
  familyNotes?: number;
  /** The day the e-mail is written (YYYY-MM-DD; today by default): a next check before it is due now, not a date gone by. */
  today?: string;
};

const styles = {
  body: { backgroundColor: '#f4f6f5', fontFamily: 'Helvetica, Arial, sans-serif', color: '#1d2a24', margin: 0, padding: '16px 0' },
  container: { backgroundColor: '#ffffff', maxWidth: '560px', margin: '0 auto', padding: '24px', borderRadius: '8px' },
  h1: { fontSize: '22px', lineHeight: '28px', margin: '0 0 12px' },
  h2: { fontSize: '17px', lineHeight: '24px', margin: '20px 0 6px' },
  text: { fontSize: '16px', lineHeight: '24px', margin: '0 0 8px' },
  small: { fontSize: '13px', lineHeight: '20px', color: '#4a5a52', margin: '0 0 6px' },
  link: { color: '#0b6b4f', textDecoration: 'underline' },
};

export function SummaryEmail({ summary, viewUrl, unsubscribeUrl, recipientName, familyNotes = 0, today }: Props) {
  const name = summary.athleteFirstName;
  return (
    <Html lang="en">
      <Head />
      <Preview>{`${name}'s movement screen at ${summary.clubName}: what was seen and what to work on`}</Preview>
      <Body style={styles.body}>
        <Container style={styles.container}>
          <Heading as="h1" style={styles.h1}>{`${name}'s movement screen`}</Heading>
          <Text style={styles.text}>{`Hello ${recipientName},`}</Text>
          <Text style={styles.text}>
            {`${name} took part in a movement screen at ${summary.clubName} on ${formatDateInWords(summary.screenedOn)}. Here is what it means in plain words.`}
          </Text>
          <Section>
            <Heading as="h2" style={styles.h2}>
              What was checked
            </Heading>
            {summary.checked.map((c) => (
              <Text key={c} style={styles.text}>{`• ${c}`}</Text>
            ))}
          </Section>
          <Section>
            <Heading as="h2" style={styles.h2}>
              What we saw
            </Heading>
            {summary.seen.map((s) => (
              <Text key={s} style={styles.text}>{`• ${s}`}</Text>
            ))}
          </Section>
          <Section>
            <Heading as="h2" style={styles.h2}>{`What ${name} will work on`}</Heading>
            {/* First: what the family most needs to know, before the list. */}
            {summary.pain ? <Text style={styles.text}>{summary.pain}</Text> : null}
            {summary.exercises.map((e) => (
              <Text
                key={e.name}
                style={styles.text}
              >{`• ${e.name}: ${e.howMuch}, ${e.howOften}.${e.clubOnly ? ` ${CLUB_ONLY_WORDS}` : ''} ${e.purpose}${e.forWhat ? ` ${e.forWhat}` : ''}`}</Text>
            ))}
            {summary.onHold ? <Text style={styles.text}>{summary.onHold}</Text> : null}
            {summary.clearance ? <Text style={styles.text}>{summary.clearance}</Text> : null}
            <Text style={styles.text}>{summary.howOften}</Text>
            {summary.recheckDate ? <Text style={styles.text}>{recheckLine(summary.recheckDate, today ?? todayIso())}</Text> : null}
          </Section>
          <Section>
            <Heading as="h2" style={styles.h2}>
              Please note
            </Heading>
            {/* At the size of the rest: what to do if it hurts is not small print. */}
            {summary.cautions.map((c) => (
              <Text key={c} style={styles.text}>
                {c}
              </Text>
            ))}
          </Section>
          <Section>
            <Heading as="h2" style={styles.h2}>
              {summary.exercises.length > 0 ? 'See how to do each exercise' : `${name}'s page in Squadline`}
            </Heading>
            {familyNotes > 0 ? (
              // Said, not copied: a note's words stay behind the sign-in (the physiotherapist's advice was
              // missed by a parent who read only the e-mail).
              <Text style={styles.text}>
                {familyNotes === 1
                  ? `The care team left you a note about ${name}: read it on ${name}'s page.`
                  : `The care team left you ${familyNotes} notes about ${name}: read them on ${name}'s page.`}
              </Text>
            ) : null}
            <Text style={styles.text}>
              <Link href={viewUrl} style={styles.link}>{`Open ${name}'s page in Squadline`}</Link>
            </Text>
            <Text style={styles.text}>{summary.contact}</Text>
          </Section>
          <Hr />
          <Text style={styles.small}>
            {'You receive this because your club recorded your agreement to e-mailed summaries. '}
            <Link href={unsubscribeUrl} style={styles.link}>
              Stop these e-mails
            </Link>
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

export function summarySubject(summary: FamilySummary): string {
  return `${summary.athleteFirstName}'s movement screen at ${summary.clubName}`;
}

export async function renderSummaryEmail(props: Props): Promise<{ subject: string; html: string; text: string }> {
  const element = <SummaryEmail {...props} />;
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true })]);
  return { subject: summarySubject(props.summary), html, text };
}
