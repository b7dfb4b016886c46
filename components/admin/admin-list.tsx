/**
 * A list for the admin pages: a table with a header row on wide screens, a stack of cards on phones (each card
 * shows every column as "label: value"), and a pager under it. Columns are data, so every admin list looks
 * and behaves the same.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

export interface AdminColumn<T> {
  label: string;
  /** Relative width on wide screens. */
  flex: number;
  render: (row: T) => ReactNode;
}

/** Renders a cell's content: plain strings and numbers as text, anything else as given. */
function Cell({ value }: { value: ReactNode }) {
  return typeof value === 'string' || typeof value === 'number' ? <Text variant="small">{value}</Text> : <>{value}</>;
}

/**
 * Renders `rows` with `columns` (table when wide, cards on phones), `empty` when there are none, and the
 * pager for `page` of `pageSize` rows out of `total` (page changes through `onPage`). `caption` names the list
 * for screen readers and the browser tests.
 */
export function AdminList<T>({
  caption,
  columns,
  rows,
  rowKey,
  empty,
  page,
  pageSize,
  total,
  onPage,
}: {
  caption: string;
  columns: AdminColumn<T>[];
  rows: T[];
  rowKey: (row: T) => string;
  empty: string;
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
}) {
  const wide = useWideLayout();
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <View style={styles.wrap}>
      {rows.length === 0 ? (
        <Text variant="small">{empty}</Text>
      ) : wide ? (
        <View role="table" accessibilityLabel={caption} style={styles.table}>
          <View role="row" style={[styles.row, styles.headRow]}>
            {columns.map((c) => (
              <View key={c.label} role="columnheader" style={[styles.cell, { flex: c.flex }]}>
                <Text variant="overline">{c.label}</Text>
              </View>
            ))}
          </View>
          {rows.map((r) => (
            <View key={rowKey(r)} role="row" style={styles.row}>
              {columns.map((c) => (
                <View key={c.label} role="cell" style={[styles.cell, { flex: c.flex }]}>
                  <Cell value={c.render(r)} />
                </View>
              ))}
            </View>
          ))}
        </View>
      ) : (
        <View role="list" accessibilityLabel={caption} style={styles.cards}>
          {rows.map((r) => (
            <View key={rowKey(r)} role="listitem" style={styles.card}>
              {columns.map((c) => (
                <View key={c.label} style={styles.cardLine}>
                  <Text variant="overline" style={styles.cardLabel}>
                    {c.label}
                  </Text>
                  <View style={styles.cardValue}>
                    <Cell value={c.render(r)} />
                  </View>
                </View>
              ))}
            </View>
          ))}
        </View>
      )}
      <View style={styles.pager}>
        <Text variant="mono">{total === 0 ? 'none' : `${first}–${last} of ${total}`}</Text>
        <Button label="Previous" accessibilityLabel={`${caption}: previous page`} tone="secondary" compact disabled={page <= 1} onPress={() => onPage(page - 1)} />
        <Button label="Next" accessibilityLabel={`${caption}: next page`} tone="secondary" compact disabled={page >= pages} onPress={() => onPage(page + 1)} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  table: { borderWidth: 1, borderColor: palette.rule, borderRadius: radius.md, backgroundColor: palette.sheet, overflow: 'hidden' },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: palette.rule, alignItems: 'center' },
  headRow: { backgroundColor: palette.sheetSunk },
  cell: { paddingHorizontal: space.sm, paddingVertical: space.sm, minWidth: 0 },
  cards: { gap: space.sm },
  card: { borderWidth: 1, borderColor: palette.rule, borderLeftWidth: 4, borderLeftColor: palette.slate, borderRadius: radius.md, backgroundColor: palette.sheet, padding: space.md, gap: space.xs },
  cardLine: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  cardLabel: { width: 96, paddingTop: 2 },
  cardValue: { flex: 1, minWidth: 0 },
  pager: { flexDirection: 'row', alignItems: 'center', gap: space.sm, justifyContent: 'flex-end', flexWrap: 'wrap' },
});
