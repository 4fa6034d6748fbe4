import { can, ROLE_LABELS } from '@/features/access/permissions';
import { Confirm } from '@/features/ui/components/confirm';
import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { api, fieldErrorsOf, messageOf } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { formatDate } from '@/features/ui/format-date';
import { TextField } from '@/features/ui/components/text-field';
import { colors, space } from '@/features/ui/theme';
import { useQuery } from '@tanstack/react-query';
import type { MembersResponse } from '@/features/people/contract';
import { useLinkGuardianMutation } from '../api/link-guardian';
import type { Athlete } from '../api/types';
import { useUnlinkGuardianMutation } from '../api/unlink-guardian';
import { guardianSchema, type GuardianInput } from '../schemas';

/** The parents and guardians who see this athlete in their account. Staff only. */
export function GuardiansPanel({ athlete }: { athlete: Athlete }) {
  const { membership } = useActiveClub();
  const manage = can(membership.role, 'guardians.manage');
  const unlink = useUnlinkGuardianMutation(athlete.id);
  const [confirming, setConfirming] = useState<string | null>(null);
  const guardians = athlete.guardians ?? [];
  return (
    <Card testID="guardians-panel">
      <Text variant="heading">Parents and guardians</Text>
      {guardians.length === 0 ? <Text variant="small">No parent or guardian is linked yet.</Text> : null}
      {(athlete.invitedGuardians ?? []).map((i) => (
        <Text key={i.email} variant="small" testID="guardian-invited">
          {`Invited on ${formatDate(i.sentAt)}, not joined yet: ${i.email}. Linked to ${athlete.firstName} when they accept.`}
        </Text>
      ))}
      {unlink.error ? <Notice tone="error">{unlink.error.message}</Notice> : null}
      {guardians.map((g) => (
        <View key={g.userId} style={styles.row}>
          <View style={styles.who}>
            <Text variant="label">{g.displayName}</Text>
            <Text variant="small">{g.email}</Text>
          </View>
          {manage && confirming !== g.userId ? (
            <Button label="Unlink" tone="secondary" accessibilityLabel={`Unlink ${g.displayName}`} onPress={() => setConfirming(g.userId)} />
          ) : null}
          {confirming === g.userId ? (
            <Confirm
              text={`${g.displayName} will no longer see ${athlete.firstName} in their account.`}
              confirmLabel="Yes, unlink"
              cancelLabel="Keep"
              testID="guardian-unlink-confirm"
              busy={unlink.isPending && unlink.variables === g.userId}
              onConfirm={() => unlink.mutate(g.userId, { onSettled: () => setConfirming(null) })}
              onCancel={() => setConfirming(null)}
            />
          ) : null}
        </View>
      ))}
      {manage ? (
        <LinkGuardian
          clubId={membership.clubId}
          athleteId={athlete.id}
          name={athlete.firstName}
          linked={guardians.map((g) => g.userId)}
          invited={(athlete.invitedGuardians ?? []).map((i) => i.email)}
        />
      ) : null}
    </Card>
  );
}

function LinkGuardian({ clubId, athleteId, name, linked, invited }: { clubId: string; athleteId: string; name: string; linked: string[]; invited: string[] }) {
  const link = useLinkGuardianMutation(athleteId);
  // The club's people (the roles that link parents read them): the confirmation names the account's holder,
  // so a typo that hits another family's address shows as the wrong name, not only as letters.
  // Asked here rather than through People's query module: a module two lazy screens import is loaded by
  // the sign-in page with the shared chunk (see README, first-chunk budget).
  const members = useQuery({
    queryKey: ['athletes', clubId, 'club-people'],
    queryFn: () => api<MembersResponse>(`/clubs/${clubId}/members`),
    staleTime: 30_000,
  });
  const [failure, setFailure] = useState<string | null>(null);
  // The e-mail checked and waiting for the admin's confirmation: one typo would open a child's record to
  // another family, so what the link gives is said before it is made.
  const [pending, setPending] = useState<string | null>(null);
  const holder = pending ? members.data?.members.find((m) => m.email.toLowerCase() === pending.toLowerCase()) : undefined;
  return (
    <Formik<GuardianInput>
      initialValues={{ email: '' }}
      validationSchema={guardianSchema}
      onSubmit={(values, helpers) => {
        setFailure(null);
        const email = guardianSchema.cast(values).email;
        // Already invited for this child: accepting links them; nothing to confirm or send.
        if (invited.includes(email)) {
          helpers.setErrors({ email: `${email} is invited as ${name}'s parent (above): they are linked as soon as they accept.` });
          return;
        }
        const member = members.data?.members.find((m) => m.email.toLowerCase() === email.toLowerCase());
        if (member && linked.includes(member.userId)) {
          helpers.setErrors({ email: `${member.displayName} (${email}) is already linked to ${name}.` });
          return;
        }
        if (member && member.role !== 'parent') {
          helpers.setErrors({
            email: `This e-mail belongs to ${member.displayName}, the club’s ${ROLE_LABELS[member.role].toLowerCase()}; only parent or guardian accounts can be linked to a child.`,
          });
          return;
        }
        setPending(email);
      }}
    >
      {({ values, errors, touched, handleChange, handleBlur, handleSubmit, setErrors, resetForm }) => (
        <View style={styles.form}>
          {failure ? <Notice tone="error">{failure}</Notice> : null}
          <TextField
            label="Link a parent by e-mail"
            testID="guardian-email"
            hint="They need a parent account in the club: an admin invites them from People first."
            autoCapitalize="none"
            inputMode="email"
            value={values.email}
            onChangeText={(text) => {
              setPending(null);
              handleChange('email')(text);
            }}
            onBlur={handleBlur('email')}
            error={touched.email && errors.email}
          />
          {pending ? (
            <Confirm
              text={`Link ${holder ? `${holder.displayName} (${pending})` : pending} to ${name}? The account then sees ${name}'s shared summaries, family notes and consent decisions, and can change the family's own decisions. Check the address letter by letter.`}
              confirmLabel="Yes, link"
              cancelLabel="Not yet"
              testID="guardian-link-confirm"
              busy={link.isPending}
              onConfirm={() =>
                link.mutate(
                  { email: pending },
                  {
                    onSuccess: () => {
                      setPending(null);
                      resetForm();
                    },
                    onError: (error) => {
                      setPending(null);
                      const fields = fieldErrorsOf(error);
                      if (fields) setErrors(fields);
                      else setFailure(messageOf(error));
                    },
                  },
                )
              }
              onCancel={() => setPending(null)}
            />
          ) : (
            <Button label="Link parent" tone="secondary" testID="guardian-link" onPress={() => handleSubmit()} />
          )}
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  who: { flex: 1, gap: 2, minWidth: 0 },
  form: { gap: space.md },
});
