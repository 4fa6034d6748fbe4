import { can } from '@/features/access/permissions';
import { Confirm } from '@/features/ui/components/confirm';
import { Formik } from 'formik';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useAthletesQuery } from '@/features/athletes/api/get-athletes';
import { ApiError, fieldErrorsOf, messageOf } from '@/features/api/client';
import { inviteSchema, MAX_INVITED_CHILDREN, ROLE_LABELS, ROLE_VALUES, type InviteInput } from '@/features/auth/schemas';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useCancelInvitationMutation, useChangeRoleMutation, useInviteMutation, useMembersQuery, useRemoveMemberMutation } from '../api/members';
import type { Member, PendingInvite } from '../contract';
import type { Role } from '@/features/access/permissions';
import { Chips } from '@/features/ui/components/chips';
import { formatDate } from '@/features/ui/format-date';

export function PeoplePanel() {
  const { membership, me } = useActiveClub();
  const manage = can(membership.role, 'members.manage');
  const { isWide } = useBreakpoints();
  const members = useMembersQuery(membership.clubId);
  const headCoaches = members.data?.members.filter((x) => x.role === 'head_coach').length ?? 0;
  return (
    <View style={[styles.cols, isWide && styles.colsWide]}>
      <Card style={isWide ? styles.col : undefined}>
        <Text variant="heading">Members</Text>
        {members.error ? <Notice tone="error">{members.error.message}</Notice> : null}
        {members.data?.members.map((m) => (
          <MemberRow
            key={m.userId}
            member={m}
            manage={manage && m.userId !== me.user.id}
            clubId={membership.clubId}
            onlyHeadCoach={m.role === 'head_coach' && headCoaches === 1}
          />
        ))}
        {members.data && members.data.pending.length > 0 ? (
          <>
            <Text variant="heading">Invited, not joined yet</Text>
            {members.data.pending.map((p) => (
              <PendingRow key={p.id} invite={p} manage={manage} clubId={membership.clubId} />
            ))}
          </>
        ) : null}
      </Card>
      {can(membership.role, 'members.invite') ? (
        <Card style={isWide ? styles.col : undefined}>
          <Text variant="heading">Invite someone</Text>
          <InviteForm clubId={membership.clubId} />
        </Card>
      ) : null}
    </View>
  );
}

/**
 * What a role opens, in plain words, said before a role is changed (from the access table in
 * features/access/permissions.ts; our wording): a parent made a tester sees every child's screens.
 */
export const ROLE_REACH: Record<Role, string> = {
  admin: "every athlete's record, consent and screens with their photos, the club's people, settings and audit trail",
  head_coach: "every squad's athletes, screens with their photos, results, team notes, trends and training sheets",
  tester: "every squad's athletes and screens with their photos, results and training sheets",
  physio: "every squad's athletes, screens with their photos, results, team notes, reviews and clearances",
  parent: 'only what is shared about the children linked to them',
};

/** A member, and for an admin (not on their own row) a change of role or removal, each confirmed. */
function MemberRow({ member: m, manage, clubId, onlyHeadCoach }: { member: Member; manage: boolean; clubId: string; onlyHeadCoach: boolean }) {
  const [mode, setMode] = useState<'idle' | 'role' | 'remove'>('idle');
  const [role, setRole] = useState<Role>(m.role);
  const change = useChangeRoleMutation(clubId);
  const remove = useRemoveMemberMutation(clubId);
  const error = change.error ?? remove.error;
  return (
    <View style={styles.row} testID={`member-${m.userId}`}>
      <Text variant="label">{m.displayName}</Text>
      <Text variant="small">
        {ROLE_LABELS[m.role]} · {m.email}
      </Text>
      {m.children ? (
        <Text variant="small" testID="member-children">
          {m.children.length ? `Linked to ${m.children.join(', ')}` : 'Not linked to any child yet'}
        </Text>
      ) : null}
      {error ? <Notice tone="error">{messageOf(error)}</Notice> : null}
      {manage && mode === 'idle' ? (
        <View style={styles.rowActions}>
          <Button tone="quiet" label="Change role" testID="member-change-role" onPress={() => setMode('role')} />
          <Button tone="quiet" label="Remove from the club" testID="member-remove" onPress={() => setMode('remove')} />
        </View>
      ) : null}
      {mode === 'role' ? (
        <View style={styles.form}>
          <Chips
            label={`New role for ${m.displayName}`}
            value={role}
            onChange={setRole}
            options={ROLE_VALUES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
            testID="member-role"
          />
          {role !== m.role ? (
            <Text variant="small" testID="member-role-effect">
              {`${m.displayName} becomes a ${ROLE_LABELS[role].toLowerCase()} at once and can then open ${ROLE_REACH[role]}.`}
              {onlyHeadCoach ? ' The club then has no head coach: nobody can reopen a closed round.' : ''}
            </Text>
          ) : null}
          <View style={styles.rowActions}>
            <Button
              label="Save the role"
              testID="member-role-save"
              disabled={role === m.role}
              busy={change.isPending}
              onPress={() => change.mutate({ userId: m.userId, role }, { onSuccess: () => setMode('idle') })}
            />
            <Button tone="quiet" label="Cancel" onPress={() => setMode('idle')} />
          </View>
        </View>
      ) : null}
      {mode === 'remove' ? (
        <View style={styles.form}>
          <Text>
            {`Remove ${m.displayName} from the club? They lose access at once${m.role === 'parent' ? ', and their links to the club’s children go too' : ''}. Their account stays; an admin can invite them again.`}
          </Text>
          <Confirm
            confirmLabel="Yes, remove"
            cancelLabel="Keep"
            testID="member-remove-confirm"
            busy={remove.isPending}
            onConfirm={() => remove.mutate(m.userId)}
            onCancel={() => setMode('idle')}
          />
        </View>
      ) : null}
    </View>
  );
}

/** An invitation not yet accepted; an admin can cancel it (its link stops working). */
function PendingRow({ invite: p, manage, clubId }: { invite: PendingInvite; manage: boolean; clubId: string }) {
  const [confirming, setConfirming] = useState(false);
  const cancel = useCancelInvitationMutation(clubId);
  return (
    <View style={styles.row} testID="pending-invite">
      <Text variant="label">{p.email}</Text>
      <Text variant="small">
        {ROLE_LABELS[p.role]}
        {p.children.length > 0 ? ` of ${p.children.join(', ')}` : ''} · link valid until {formatDate(p.expiresAt)}
      </Text>
      {cancel.error ? <Notice tone="error">{messageOf(cancel.error)}</Notice> : null}
      {manage && !confirming ? <Button tone="quiet" label="Cancel the invitation" testID="invite-cancel" onPress={() => setConfirming(true)} /> : null}
      {confirming ? (
        <Confirm
          confirmLabel="Yes, cancel it"
          cancelLabel="Keep it"
          testID="invite-cancel-confirm"
          busy={cancel.isPending}
          onConfirm={() => cancel.mutate(p.id)}
          onCancel={() => setConfirming(false)}
        />
      ) : null}
    </View>
  );
}

function InviteForm({ clubId }: { clubId: string }) {
  const invite = useInviteMutation(clubId);
  // A parent's invitation names the children in its e-mail: the address is checked before it goes.
  const [checking, setChecking] = useState(false);
  const roster = useAthletesQuery();
  const namesOf = (ids: string[]) =>
    (roster.data?.athletes ?? [])
      .filter((a) => ids.includes(a.id))
      .map((a) => `${a.firstName} ${a.lastName}`)
      .join(', ');
  return (
    <Formik<InviteInput>
      // No role chosen in advance (our choice: a parent's address sent with the first role ready, tester,
      // opened every child's screens).
      initialValues={{ email: '', role: '' as InviteInput['role'], athleteIds: [] }}
      validationSchema={inviteSchema}
      onSubmit={async (values, helpers) => {
        try {
          await invite.mutateAsync(inviteSchema.cast(values));
          // Ready for the next person of the same role (a squad's parents, a team of testers).
          helpers.resetForm({ values: { email: '', role: values.role, athleteIds: [] } });
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, setFieldValue, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          {invite.isSuccess ? <Notice>Invitation sent. The link works once, for 7 days.</Notice> : null}
          {invite.error && !(invite.error instanceof ApiError && invite.error.fields) ? <Notice tone="error">{invite.error.message}</Notice> : null}
          <TextField
            label="E-mail"
            testID="invite-email"
            value={values.email}
            onChangeText={handleChange('email')}
            onBlur={handleBlur('email')}
            autoCapitalize="none"
            inputMode="email"
            error={touched.email && errors.email}
          />
          <Text variant="label">Role</Text>
          <View style={styles.choices} accessibilityRole="radiogroup">
            {ROLE_VALUES.map((r) => (
              <Pressable
                key={r}
                accessibilityRole="radio"
                aria-checked={values.role === r}
                onPress={() => {
                  setFieldValue('role', r);
                  if (r !== 'parent') setFieldValue('athleteIds', []);
                }}
                style={[styles.choice, values.role === r && styles.choiceOn]}
              >
                <Text style={values.role === r ? styles.choiceTextOn : undefined}>{ROLE_LABELS[r]}</Text>
              </Pressable>
            ))}
          </View>
          {values.role ? (
            // Said as the role is picked, not only in the last confirmation: who can open what decides the role.
            <Text
              variant="small"
              testID="invite-role-reach"
            >{`A ${ROLE_LABELS[values.role as Role].toLowerCase()} can open ${ROLE_REACH[values.role as Role]}.`}</Text>
          ) : null}
          {touched.role && errors.role ? <Text style={{ color: colors.brick }}>{errors.role}</Text> : null}
          {values.role === 'parent' ? (
            <ChildPicker
              selected={values.athleteIds}
              onChange={(ids) => setFieldValue('athleteIds', ids)}
              error={typeof errors.athleteIds === 'string' ? errors.athleteIds : undefined}
            />
          ) : null}
          {checking ? (
            <Confirm
              text={
                values.role === 'parent'
                  ? `The e-mail to ${values.email.trim()} names ${namesOf(values.athleteIds)}. Check the address letter by letter: a stranger would learn their names.`
                  : `${values.email.trim()} joins as a ${ROLE_LABELS[values.role as Role].toLowerCase()} and can then open ${ROLE_REACH[values.role as Role]}. Check the address and the role.`
              }
              confirmLabel="Yes, send it"
              cancelLabel="Check again"
              testID="invite-send-confirm"
              busy={isSubmitting}
              onConfirm={() => {
                setChecking(false);
                handleSubmit();
              }}
              onCancel={() => setChecking(false)}
            />
          ) : (
            <Button
              label="Send invitation"
              testID="invite-submit"
              busy={isSubmitting}
              onPress={() =>
                // Every invitation with a role and an address is checked before it goes: a parent's names
                // children, a staff role opens every child's records.
                values.email.trim() && values.role && (values.role !== 'parent' || values.athleteIds.length > 0) ? setChecking(true) : handleSubmit()
              }
            />
          )}
        </View>
      )}
    </Formik>
  );
}

const CHILDREN_SHOWN = 8;

/** Which children a parent's invitation links: a name filter over the club's roster, ticked names on top. */
function ChildPicker({ selected, onChange, error }: { selected: string[]; onChange(ids: string[]): void; error?: string }) {
  const athletes = useAthletesQuery();
  const [filter, setFilter] = useState('');
  const all = athletes.data?.athletes ?? [];
  const words = filter.trim().toLowerCase();
  const chosen = all.filter((a) => selected.includes(a.id));
  const matches = words
    ? all.filter((a) => !selected.includes(a.id) && `${a.firstName} ${a.lastName}`.toLowerCase().includes(words)).slice(0, CHILDREN_SHOWN)
    : [];
  const toggle = (id: string) => {
    onChange(selected.includes(id) ? selected.filter((x) => x !== id) : [...selected, id]);
    // Picked: the list of matches closes, ready for a brother or sister's name.
    if (!selected.includes(id)) setFilter('');
  };
  return (
    <View style={styles.form} testID="invite-children">
      <Text variant="label">Their children</Text>
      <Text variant="small">{`The invitation names them, and links them to the parent's account when it is accepted (at most ${MAX_INVITED_CHILDREN}).`}</Text>
      {chosen.map((a) => (
        <Pressable
          key={a.id}
          accessibilityRole="checkbox"
          aria-checked
          onPress={() => toggle(a.id)}
          style={[styles.choice, styles.choiceOn]}
          testID={`invite-child-${a.id}`}
        >
          <Text style={styles.choiceTextOn}>{`✓ ${a.firstName} ${a.lastName}`}</Text>
        </Pressable>
      ))}
      <TextField label="Find a child by name" testID="invite-child-filter" value={filter} onChangeText={setFilter} />
      {matches.map((a) => (
        <Pressable
          key={a.id}
          accessibilityRole="checkbox"
          aria-checked={false}
          onPress={() => toggle(a.id)}
          style={styles.choice}
          testID={`invite-child-${a.id}`}
        >
          <Text>{`${a.firstName} ${a.lastName}${a.squadName ? ` · ${a.squadName}` : ''}`}</Text>
        </Pressable>
      ))}
      {words && matches.length === 0 ? <Text variant="small">No child of the club matches.</Text> : null}
      {chosen.length === 0 && !error ? (
        <Text variant="small" style={styles.caution} testID="invite-no-child">
          No child chosen: the parent will see nothing until a child is linked to them from the child&apos;s page.
        </Text>
      ) : null}
      {error ? <Text style={{ color: colors.brick }}>{error}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  colsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  col: { flex: 1 },
  row: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  rowActions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  form: { gap: space.md },
  choices: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  choice: {
    minHeight: TOUCH_MIN,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  choiceOn: { borderColor: colors.pine, backgroundColor: colors.pine },
  choiceTextOn: { color: '#fff' },
  caution: { color: colors.amber, fontFamily: fonts.bold },
});
