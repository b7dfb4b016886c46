/**
 * The one-field form that names a build, used to start a build and to rename one.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { buildCreateBody, buildRenameBody, type BuildCreateBody } from '../../db/validation';
import { applyServerErrors } from '../../hooks/form-errors';
import { Button } from '../ui/button';
import { FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { space } from '../ui/theme';

export interface BuildNameFormProps {
  /** The server's schema for this request: buildCreateBody to start a build, buildRenameBody to rename one. */
  schema: typeof buildCreateBody | typeof buildRenameBody;
  label: string;
  submitLabel: string;
  initialName?: string;
  placeholder?: string;
  /** Sends the name; a rejected promise puts the server's field errors under the field. */
  onSave: (body: BuildCreateBody) => Promise<unknown>;
  /** Called after a successful save. */
  onSaved?: () => void;
  onCancel?: () => void;
  /** Clears the field after a successful save (for "start a build", not for rename). */
  clearOnSave?: boolean;
  /** Puts the cursor in the field when the form appears (for rename, opened by a button). */
  autoFocus?: boolean;
}

/**
 * A build-name field checked by `schema`, the same one the server applies (1–120 characters after trimming),
 * with a submit button and, when `onCancel` is given, a cancel button.
 */
export function BuildNameForm({ schema, label, submitLabel, initialName = '', placeholder, onSave, onSaved, onCancel, clearOnSave, autoFocus }: BuildNameFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const { control, handleSubmit, setError, reset } = useForm({
    resolver: zodResolver(schema),
    defaultValues: { name: initialName },
  });
  const submit = handleSubmit(async (body) => {
    setFormError(null);
    setSaving(true);
    try {
      await onSave(body);
      if (clearOnSave) reset({ name: '' });
      onSaved?.();
    } catch (e) {
      setFormError(applyServerErrors(e, ['name'], setError));
    } finally {
      setSaving(false);
    }
  });
  return (
    <View>
      <FormTextField control={control} name="name" label={label} placeholder={placeholder} onSubmitEditing={submit} maxLength={140} autoFocus={autoFocus} selectTextOnFocus={autoFocus} />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <View style={styles.row}>
        <Button label={submitLabel} onPress={submit} busy={saving} compact={Boolean(onCancel)} />
        {onCancel ? <Button label="Cancel" tone="secondary" onPress={onCancel} compact /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' } });
