/**
 * A one-field form that opens another shop.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { shopCreateBody } from '../../db/validation';
import { applyServerErrors } from '../../hooks/form-errors';
import { useCreateShop } from '../../hooks/use-create-shop';
import { Button } from '../ui/button';
import { FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { space } from '../ui/theme';

/**
 * Asks for a shop name (checked by shopCreateBody, as on the server), creates the shop with the person as its
 * owner, and calls `onCreated` with the new shop's id; `onCancel` closes the form unchanged.
 */
export function NewShopForm({ onCreated, onCancel }: { onCreated: (shopId: string) => void; onCancel: () => void }) {
  const createShop = useCreateShop();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(shopCreateBody), defaultValues: { name: '' } });
  const submit = handleSubmit((body) => {
    setFormError(null);
    createShop.mutate(body, {
      onSuccess: ({ shop }) => onCreated(shop.id),
      onError: (e) => setFormError(applyServerErrors(e, ['name'], setError)),
    });
  });
  return (
    <View style={styles.wrap}>
      <FormTextField control={control} name="name" label="New shop name" onSubmitEditing={submit} autoFocus />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <View style={styles.row}>
        <Button label="Open shop" onPress={submit} busy={createShop.isPending} compact />
        <Button label="Cancel" tone="secondary" onPress={onCancel} compact />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { paddingTop: space.sm },
  row: { flexDirection: 'row', gap: space.sm },
});
