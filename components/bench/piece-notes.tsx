/**
 * The notes the crew leaves on one piece: the list, newest last, and (for editors) a form to add one.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { pieceNoteBody, type PieceNoteBody } from '../../db/validation-bench';
import { applyServerErrors } from '../../hooks/form-errors';
import { useAddPieceNote, usePieceNotes } from '../../hooks/use-pieces';
import { formatWhen } from '../builds/format-time';
import { Button } from '../ui/button';
import { FormTextField } from '../ui/form-text-field';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

/** Renders the notes of piece `label`; `canEdit` shows the add form. */
export function PieceNotes({ shopId, buildId, label, canEdit }: { shopId: string; buildId: string; label: string; canEdit: boolean }) {
  const notes = usePieceNotes(shopId, buildId, label);
  const add = useAddPieceNote(shopId, buildId);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm<PieceNoteBody>({ resolver: zodResolver(pieceNoteBody), defaultValues: { body: '' } });
  const submit = handleSubmit(async (body) => {
    setFormError(null);
    try {
      await add.mutateAsync({ label, body: body.body });
      reset({ body: '' });
    } catch (e) {
      setFormError(applyServerErrors(e, ['body'], setError));
    }
  });
  return (
    <View style={styles.box}>
      {notes.isPending ? <Loading label={`Loading notes on piece ${label}`} /> : null}
      {notes.error ? <Notice tone="error" title="Notes did not load">{notes.error.message}</Notice> : null}
      {notes.data && notes.data.length === 0 ? <Text variant="small">No notes on piece {label} yet.</Text> : null}
      {notes.data && notes.data.length > 0 ? (
        <View role="list" accessibilityLabel={`Notes on piece ${label}`} style={styles.list}>
          {notes.data.map((n) => (
            <View key={n.id} role="listitem" style={styles.note}>
              <Text>{n.body}</Text>
              <Text variant="mono">
                {n.authorName ?? 'A member'} · {formatWhen(n.createdAt)}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
      {canEdit ? (
        <View>
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <FormTextField control={control} name="body" label={`New note on piece ${label}`} multiline placeholder="e.g. left edge needs a second pass" />
          <Button label="Add note" accessibilityLabel={`Add note to piece ${label}`} compact busy={add.isPending} onPress={submit} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, paddingTop: space.sm },
  list: { gap: space.sm },
  note: { padding: space.sm, backgroundColor: palette.sheetSunk, borderRadius: radius.sm, gap: space.xxs },
});
