/**
 * The shop's stock sheets, one per thickness: name, width × height in mm, price and currency. Editors change
 * the list (saved as a whole, checked with the server's own schema first); clients read it.
 */
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSaveStock, useStock, type StockSheet } from '../../hooks/use-stock';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { palette, radius, space } from '../ui/theme';
import { formatMoney, readStockRows, suggestedStockRows, type StockRowText } from './sheet-plan-model';

const toRow = (s: StockSheet): StockRowText => ({
  thicknessMm: String(s.thicknessMm),
  name: s.name,
  widthMm: String(s.widthMm),
  heightMm: String(s.heightMm),
  price: String(s.price),
  currency: s.currency,
});

/** Renders the stock list of `shopId`; `patternThicknesses` lets the editor offer rows for thicknesses without stock. */
export function StockEditor({ shopId, canEdit, patternThicknesses }: { shopId: string; canEdit: boolean; patternThicknesses: readonly number[] }) {
  const stock = useStock(shopId);
  const save = useSaveStock(shopId);
  const [editing, setEditing] = useState(false);
  const [rows, setRows] = useState<StockRowText[]>([]);
  const [errors, setErrors] = useState<Record<string, string>>({});
  useEffect(() => {
    if (!editing && stock.data) setRows(stock.data.map(toRow));
  }, [stock.data, editing]);

  if (stock.isPending) return <Loading label="Loading the stock sheets" />;
  if (stock.error) {
    return (
      <Notice tone="error" title="Stock sheets did not load">
        {stock.error.message}
      </Notice>
    );
  }
  const list = stock.data;
  const missing = patternThicknesses.filter((t) => !list.some((s) => s.thicknessMm === t));

  if (!editing) {
    return (
      <View style={styles.gap}>
        {list.some((s) => s.source === 'default') ? (
          <Text variant="small">Common sheet sizes with example prices, used until the shop sets its own stock.</Text>
        ) : null}
        {list.length === 0 ? (
          <Text>No stock sheets yet. The sheet plan then uses common sheet sizes with no price.</Text>
        ) : (
          <View role="list" accessibilityLabel="Stock sheets" style={styles.table}>
            {list.map((s) => (
              <View key={s.thicknessMm} role="listitem" style={styles.stockRow}>
                <Text style={styles.thick}>{s.thicknessMm} mm</Text>
                <View style={styles.grow}>
                  <Text>{s.name}</Text>
                  <Text variant="mono">
                    {s.widthMm} × {s.heightMm} mm · {formatMoney(s.price, s.currency)} a sheet
                  </Text>
                </View>
              </View>
            ))}
          </View>
        )}
        {missing.length > 0 ? (
          <Notice tone="caution">{`No stock for ${missing.map((t) => `${t} mm`).join(', ')}: the plan uses a common sheet size there, priced at 0.`}</Notice>
        ) : null}
        {canEdit ? <Button label="Edit stock" tone="secondary" compact onPress={() => setEditing(true)} accessibilityLabel="Edit stock sheets" /> : null}
      </View>
    );
  }

  const set = (i: number, field: keyof StockRowText, value: string) => setRows((rs) => rs.map((r, k) => (k === i ? { ...r, [field]: value } : r)));
  const currency = rows[0]?.currency || list[0]?.currency || 'EUR';
  const submit = () => {
    const read = readStockRows(rows);
    if (!read.ok) {
      setErrors(read.errors);
      return;
    }
    setErrors({});
    save.mutate(read.body, { onSuccess: () => setEditing(false) });
  };
  return (
    <View style={styles.gap}>
      {errors.form ? <Notice tone="error">{errors.form}</Notice> : null}
      {rows.map((r, i) => (
        <View key={i} style={styles.editRow} role="group" accessibilityLabel={`Sheet ${i + 1}`}>
          <View style={styles.fields}>
            <View style={styles.small}>
              <TextField label={`Sheet ${i + 1} thickness, mm`} inputMode="decimal" value={r.thicknessMm} onChangeText={(v) => set(i, 'thicknessMm', v)} error={errors[`${i}.thicknessMm`]} />
            </View>
            <View style={styles.wide}>
              <TextField label={`Sheet ${i + 1} name`} value={r.name} onChangeText={(v) => set(i, 'name', v)} error={errors[`${i}.name`]} />
            </View>
            <View style={styles.small}>
              <TextField label={`Sheet ${i + 1} width, mm`} inputMode="decimal" value={r.widthMm} onChangeText={(v) => set(i, 'widthMm', v)} error={errors[`${i}.widthMm`]} />
            </View>
            <View style={styles.small}>
              <TextField label={`Sheet ${i + 1} height, mm`} inputMode="decimal" value={r.heightMm} onChangeText={(v) => set(i, 'heightMm', v)} error={errors[`${i}.heightMm`]} />
            </View>
            <View style={styles.small}>
              <TextField label={`Sheet ${i + 1} price`} inputMode="decimal" value={r.price} onChangeText={(v) => set(i, 'price', v)} error={errors[`${i}.price`]} />
            </View>
            <View style={styles.tiny}>
              <TextField label={`Sheet ${i + 1} currency`} autoCapitalize="characters" maxLength={3} value={r.currency} onChangeText={(v) => set(i, 'currency', v)} error={errors[`${i}.currency`]} />
            </View>
          </View>
          <Button label="Remove" tone="quiet" compact accessibilityLabel={`Remove sheet ${i + 1}`} onPress={() => setRows((rs) => rs.filter((_, k) => k !== i))} />
        </View>
      ))}
      <View style={styles.actions}>
        <Button
          label="Add sheet"
          tone="secondary"
          compact
          onPress={() =>
            setRows((rs) => {
              const blank: StockRowText = { thicknessMm: '', name: '', widthMm: '', heightMm: '', price: '0', currency };
              return [...rs, suggestedStockRows(missing, rs.map((x) => Number(x.thicknessMm)), currency)[0] ?? blank];
            })
          }
        />
        <Button label="Save stock" busy={save.isPending} onPress={submit} />
        <Button
          label="Cancel"
          tone="quiet"
          compact
          onPress={() => {
            setErrors({});
            setEditing(false);
          }}
        />
      </View>
      {save.error ? (
        <Notice tone="error" title="The stock was not saved">
          {save.error.message}
        </Notice>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.md },
  table: { borderWidth: 1, borderColor: palette.rule, borderRadius: radius.md, backgroundColor: palette.sheet },
  stockRow: { flexDirection: 'row', alignItems: 'baseline', gap: space.md, padding: space.md, borderBottomWidth: 1, borderBottomColor: palette.rule },
  thick: { fontWeight: '800', color: palette.slate, minWidth: 56 },
  grow: { flex: 1, minWidth: 120 },
  editRow: { padding: space.md, backgroundColor: palette.sheet, borderRadius: radius.md, borderWidth: 1, borderColor: palette.rule },
  fields: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  small: { width: 140 },
  tiny: { width: 110 },
  wide: { flexGrow: 1, minWidth: 200 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
});
