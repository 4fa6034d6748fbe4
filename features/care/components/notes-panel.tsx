import { useFormik } from 'formik';
import { useState } from 'react';
import { useKeptForm } from '../kept-form';
import { StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { messageOf, showServerError } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, radius, space } from '@/features/ui/theme';
import { useAddNoteMutation, useEditNoteMutation, useNotesQuery } from '../api/notes';
import { NOTE_EDIT_WINDOW_MINUTES, NOTE_VISIBILITY_LABELS, type NoteVisibility } from '../choices';
import { noteSchema } from '../schemas';
import type { NoteView } from '../types';
import { Chips } from '@/features/ui/components/chips';
import { formatDateTime, formatTime } from '@/features/ui/format-date';

const VISIBILITY_OPTIONS = (['team', 'family'] as const).map((v) => ({ value: v, label: NOTE_VISIBILITY_LABELS[v] }));

/** Notes on an athlete (optionally tied to one screen): the list the caller may read, and a form for those who write. */
export function NotesPanel({ athleteId, assessmentId }: { athleteId: string; assessmentId?: string }) {
  const { membership } = useActiveClub();
  const notes = useNotesQuery(athleteId);
  const canWrite = can(membership.role, 'note.write');
  return (
    <Card testID="notes-panel">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Notes
      </Text>
      {notes.error ? <Notice tone="error">{notes.error.message}</Notice> : null}
      {notes.isPending ? <Text variant="small">Loading notes…</Text> : null}
      {notes.data?.notes.length === 0 ? <Text variant="small">No notes yet.</Text> : null}
      {notes.data?.notes.map((n) => (
        <NoteItem key={n.id} note={n} />
      ))}
      {/* The form waits for the list: drawn before it, it jumped down under a finger about to choose who may read the note. */}
      {canWrite && !notes.isPending ? <NoteForm athleteId={athleteId} assessmentId={assessmentId} /> : null}
    </Card>
  );
}

function NoteItem({ note }: { note: NoteView }) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(note.text);
  const [visibility, setVisibility] = useState<NoteVisibility>(note.visibility);
  const edit = useEditNoteMutation();
  return (
    <View style={[styles.note, note.visibility === 'family' ? styles.family : styles.team]} testID="note">
      {/* Told apart at a glance: a note shared by mistake is found while it can still be taken back. */}
      {note.visibility === 'family' ? (
        <View style={styles.familyTag} testID="note-family-tag">
          <Text variant="small" style={styles.familyTagText}>
            The family can read this
          </Text>
        </View>
      ) : null}
      <Text variant="small">
        {NOTE_VISIBILITY_LABELS[note.visibility]} · {note.authorName ?? 'Former member'} · {formatDateTime(note.createdAt)}
        {note.updatedAt !== note.createdAt ? ' · corrected' : ''}
      </Text>
      {editing ? (
        <View style={styles.form}>
          <TextField
            label="Correct the note"
            value={text}
            onChangeText={setText}
            multiline
            numberOfLines={5}
            style={styles.noteBox}
            error={edit.error ? messageOf(edit.error) : undefined}
          />
          {/* Shared with the family by mistake: taken back to the team while it can still be corrected. */}
          <Chips
            variant="form"
            label="Who may read it"
            options={VISIBILITY_OPTIONS}
            value={visibility}
            onChange={setVisibility}
            testID="note-edit-visibility"
          />
          <View style={styles.row}>
            <Button
              label="Save correction"
              busy={edit.isPending}
              onPress={() => edit.mutate({ id: note.id, text, visibility }, { onSuccess: () => setEditing(false) })}
            />
            <Button label="Cancel" tone="quiet" onPress={() => setEditing(false)} />
          </View>
        </View>
      ) : (
        <Text>{note.text}</Text>
      )}
      {note.canEdit && !editing ? (
        <Button label={`Edit this note (until ${formatTime(note.editableUntil)})`} tone="quiet" onPress={() => setEditing(true)} testID="note-correct" />
      ) : null}
    </View>
  );
}

function NoteForm({ athleteId, assessmentId }: { athleteId: string; assessmentId?: string }) {
  const add = useAddNoteMutation(athleteId);
  const initialValues = { text: '', visibility: '' as NoteVisibility | '', assessmentId };
  const form = useFormik({
    initialValues,
    validationSchema: noteSchema,
    onSubmit: async (values, helpers) => {
      try {
        await add.mutateAsync(await noteSchema.validate(values));
        helpers.resetForm();
      } catch (error) {
        showServerError(error, helpers);
      }
    },
  });
  useKeptForm(`note.${athleteId}.${assessmentId ?? 'athlete'}`, form.values, initialValues, (v) => void form.setValues(v));
  return (
    <View style={styles.form}>
      <TextField
        label="New note"
        testID="note-text"
        multiline
        numberOfLines={5}
        style={styles.noteBox}
        value={form.values.text}
        onChangeText={form.handleChange('text')}
        error={form.submitCount > 0 && form.errors.text}
        hint={`You can correct it for ${NOTE_EDIT_WINDOW_MINUTES} minutes; after that it is kept as written.`}
      />
      <Chips
        variant="form"
        label="Who may read it"
        options={VISIBILITY_OPTIONS}
        value={form.values.visibility}
        onChange={(v) => form.setFieldValue('visibility', v)}
        testID="note-visibility"
        error={form.submitCount > 0 && form.errors.visibility}
      />
      {form.status ? <Notice tone="error">{String(form.status)}</Notice> : null}
      <Button label="Add note" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="note-add" />
    </View>
  );
}

const styles = StyleSheet.create({
  note: { gap: space.xs, paddingLeft: space.md, borderLeftWidth: 4, paddingVertical: space.xs },
  team: { borderLeftColor: colors.inkMuted },
  family: { borderLeftColor: colors.pine, backgroundColor: colors.pineSoft, paddingRight: space.sm },
  familyTag: { alignSelf: 'flex-start', backgroundColor: colors.pine, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2 },
  familyTagText: { color: '#fff', fontWeight: '700' },
  form: { gap: space.md },
  row: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  // Five lines or so: a note is proofread before a family reads it.
  noteBox: { minHeight: 120, paddingVertical: 8, textAlignVertical: 'top' },
});
