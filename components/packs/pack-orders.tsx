/**
 * The owner's list of pack orders: who took which pack, for how much, and its state, with a refund button for
 * paid ones (refunding stops the buyer's download link). Shown under the publish form.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useRefundOrder, useShopOrders } from '../../hooks/use-packs';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

function amount(cents: number, currency: string): string {
  return cents === 0 ? 'free' : `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
}

/** Renders the orders of shop `shopId` for the packs whose slugs are in `slugs` (all when omitted). */
export function PackOrders({ shopId, slugs }: { shopId: string; slugs?: readonly string[] }) {
  const orders = useShopOrders(shopId);
  const refund = useRefundOrder(shopId);
  const [confirming, setConfirming] = useState<string | null>(null);
  if (orders.error) return <Notice tone="error">{orders.error.message}</Notice>;
  const list = (orders.data ?? []).filter((o) => o.status !== 'pending' && (!slugs || (o.packSlug && slugs.includes(o.packSlug))));
  if (list.length === 0) return null;
  return (
    <View style={styles.box}>
      <Text variant="label" heading={3}>Orders</Text>
      {list.map((o) => (
        <View key={o.id} style={styles.row}>
          <View style={{ flex: 1 }}>
            <Text variant="small" numberOfLines={1}>{o.email}</Text>
            <Text variant="mono">
              {o.packTitle} · {amount(o.amountCents, o.currency)} · {o.status} · {new Date(o.paidAt ?? o.createdAt).toLocaleDateString()}
            </Text>
          </View>
          {o.status === 'paid' ? (
            confirming === o.id ? (
              <Button
                label="Confirm refund"
                tone="danger"
                compact
                accessibilityLabel={`Confirm refund to ${o.email}`}
                busy={refund.isPending}
                onPress={() => refund.mutate(o.id, { onSettled: () => setConfirming(null) })}
              />
            ) : (
              <Button label="Refund" tone="secondary" compact accessibilityLabel={`Refund the order of ${o.email}`} onPress={() => setConfirming(o.id)} />
            )
          ) : null}
        </View>
      ))}
      {refund.error ? <Notice tone="error">{refund.error.message}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { marginTop: space.lg },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: palette.rule },
});
