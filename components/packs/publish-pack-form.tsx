/**
 * The owner's form to sell or give away a build's print set as a pattern pack: which finished print set, title,
 * description, licence, price (0 = free), currency, and a cover (picked file, or a PNG data URL the studio made
 * with renderCoverFromCanvas). Creating makes a draft; the list below publishes or withdraws each pack.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';
import { currencyField, MAX_PRICE_CENTS, packDescriptionField, packLicenceField, packTitleField } from '../../db/validation-packs';
import { applyServerErrors } from '../../hooks/form-errors';
import { useCreatePack, useSetPackCover, useShopPacks, useUpdatePack } from '../../hooks/use-packs';
import { usePrintSets } from '../../hooks/use-print-sets';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { CoverFileInput } from './cover-file-input';
import { PackOrders } from './pack-orders';

const formSchema = z.object({
  title: packTitleField,
  description: packDescriptionField,
  licence: packLicenceField,
  price: z
    .string()
    .trim()
    .regex(/^\d{1,5}(\.\d{1,2})?$/, 'Enter the price like 12.50, or 0 for free')
    .refine((v) => Math.round(Number(v) * 100) <= MAX_PRICE_CENTS, `The price can be at most ${MAX_PRICE_CENTS / 100}`),
  currency: currencyField,
});
type FormValues = z.input<typeof formSchema>;

/** Renders the publish form and the build's packs for shop `shopId`, build `buildId`. */
export function PublishPackForm({ shopId, buildId, coverDataUrl }: { shopId: string; buildId: string; coverDataUrl?: string | null }) {
  const sets = usePrintSets(shopId, buildId);
  const packs = useShopPacks(shopId);
  const create = useCreatePack(shopId);
  const setCover = useSetPackCover(shopId);
  const update = useUpdatePack(shopId);
  const [printSetId, setPrintSetId] = useState<string | null>(null);
  const [coverFile, setCoverFile] = useState<Blob | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { title: '', description: '', licence: 'For your own builds; do not share or resell the pattern files.', price: '0', currency: 'eur' },
  });
  const done = (sets.data ?? []).filter((s) => s.status === 'done');
  const chosen = printSetId ?? done[0]?.id ?? null;
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    if (!chosen) {
      setFormError('This build has no finished print set yet; make one on the Sheets & print screen first.');
      return;
    }
    try {
      const pack = await create.mutateAsync({
        printSetId: chosen,
        title: values.title,
        description: values.description,
        licence: values.licence,
        priceCents: Math.round(Number(values.price) * 100),
        currency: values.currency,
      });
      const cover = coverFile ?? coverDataUrl ?? null;
      if (cover) await setCover.mutateAsync({ packId: pack.id, cover });
      reset();
      setCoverFile(null);
    } catch (e) {
      setFormError(applyServerErrors(e, ['title', 'description', 'licence', 'currency'], setError));
    }
  });
  const buildPacks = (packs.data ?? []).filter((p) => p.buildId === buildId);
  return (
    <Card edge>
      <Text variant="heading" heading={2}>Pattern packs</Text>
      {buildPacks.map((p) => (
        <View key={p.id} style={styles.packRow}>
          <View style={{ flex: 1 }}>
            <Text variant="bodyStrong">{p.title}</Text>
            <Text variant="small">
              {p.status} · {p.priceCents === 0 ? 'free' : p.priceLabel} · {p.paidOrders} taken{p.refundedOrders ? ` · ${p.refundedOrders} refunded` : ''}
            </Text>
          </View>
          {p.status === 'published' ? (
            <Button label="Withdraw" tone="secondary" compact accessibilityLabel={`Withdraw ${p.title}`} busy={update.isPending} onPress={() => update.mutate({ packId: p.id, body: { status: 'withdrawn' } })} />
          ) : (
            <Button label="Publish" compact accessibilityLabel={`Publish ${p.title}`} busy={update.isPending} onPress={() => update.mutate({ packId: p.id, body: { status: 'published' } })} />
          )}
        </View>
      ))}
      {update.error ? <Notice tone="error">{update.error.message}</Notice> : null}
      {buildPacks.length > 0 ? <PackOrders shopId={shopId} slugs={buildPacks.map((p) => p.slug)} /> : null}
      <Text variant="label" style={styles.gap}>Print set to sell</Text>
      {done.length === 0 ? <Text variant="small">No finished print set yet.</Text> : null}
      <View style={styles.chips}>
        {done.map((s) => (
          <Button
            key={s.id}
            label={`${s.name} · ${s.formats.join('/')} · ${s.page}`}
            tone={s.id === chosen ? 'primary' : 'secondary'}
            compact
            accessibilityLabel={`Sell print set ${s.name} made ${new Date(s.createdAt).toLocaleString()}`}
            onPress={() => setPrintSetId(s.id)}
          />
        ))}
      </View>
      <FormTextField control={control} name="title" label="Title" />
      <FormTextField control={control} name="description" label="Description" multiline numberOfLines={4} />
      <FormTextField control={control} name="licence" label="Licence note" multiline numberOfLines={2} />
      <View style={styles.row}>
        <View style={{ flex: 2 }}>
          <FormTextField control={control} name="price" label="Price (0 = free)" inputMode="decimal" keyboardType="decimal-pad" />
        </View>
        <View style={{ flex: 1 }}>
          <FormTextField control={control} name="currency" label="Currency" autoCapitalize="none" maxLength={3} />
        </View>
      </View>
      <CoverFileInput onPick={setCoverFile} />
      {coverDataUrl && !coverFile ? <Text variant="small">The cover will be the picture taken from the 3D view.</Text> : null}
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      {setCover.error ? <Notice tone="error">{setCover.error.message}</Notice> : null}
      <Button label="Create pack (draft)" accessibilityLabel="Create pack" onPress={submit} busy={create.isPending || setCover.isPending} />
    </Card>
  );
}

const styles = StyleSheet.create({
  packRow: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: palette.rule },
  gap: { marginTop: space.lg, marginBottom: space.xs },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginBottom: space.md },
  row: { flexDirection: 'row', gap: space.md },
});
