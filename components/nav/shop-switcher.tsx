/**
 * Chooses which of the person's shops the app shows.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useCurrentShop } from '../../hooks/current-shop';
import { Text } from '../ui/text';
import { fonts, minTouchTarget, palette, radius, space } from '../ui/theme';
import { NewShopForm } from './new-shop-form';
import { RoleBadge } from './role-badge';

/**
 * A disclosure button showing the current shop and the person's role in it; opened, it lists every shop as a
 * radio choice (the choice is remembered on this device) and offers to open another shop. `dark` styles it for
 * the side bar.
 */
export function ShopSwitcher({ dark }: { dark?: boolean }) {
  const { membership, memberships, choose } = useCurrentShop();
  const [open, setOpen] = useState(false);
  const [adding, setAdding] = useState(false);
  const fg = dark ? palette.onBench : palette.ink;
  const fgSoft = dark ? palette.onBenchSoft : palette.inkSoft;

  return (
    <View style={styles.wrap}>
      <Pressable
        role="button"
        aria-expanded={open}
        accessibilityLabel={`Shop: ${membership?.shopName ?? 'none'}. Change shop`}
        onPress={() => setOpen((o) => !o)}
        style={({ pressed }) => [styles.current, { borderColor: dark ? palette.benchLine : palette.rule }, pressed && styles.pressed]}
      >
        <View style={styles.currentText}>
          <View style={styles.overlineRow}>
            <Text variant="overline" style={{ color: fgSoft }}>
              Shop
            </Text>
            {membership ? <RoleBadge role={membership.role} /> : null}
          </View>
          <Text variant="bodyStrong" numberOfLines={2} style={{ color: fg }}>
            {membership?.shopName ?? 'No shop yet'}
          </Text>
        </View>
        <Text style={[styles.chevron, { color: fgSoft }]} aria-hidden>
          {open ? '▴' : '▾'}
        </Text>
      </Pressable>
      {open ? (
        <View style={[styles.panel, dark ? styles.panelDark : styles.panelLight]}>
          <View role="radiogroup" accessibilityLabel="Your shops">
            {memberships.map((m) => {
              const chosen = m.shopId === membership?.shopId;
              return (
                <Pressable
                  key={m.shopId}
                  role="radio"
                  aria-checked={chosen}
                  accessibilityLabel={m.shopName}
                  onPress={() => {
                    choose(m.shopId);
                    setOpen(false);
                  }}
                  style={({ pressed }) => [styles.option, pressed && styles.pressed]}
                >
                  <View style={[styles.dot, { borderColor: fgSoft }, chosen && styles.dotOn]} />
                  <Text numberOfLines={2} style={[styles.optionName, { color: palette.ink }, chosen && styles.optionChosen]}>
                    {m.shopName}
                  </Text>
                  <RoleBadge role={m.role} />
                </Pressable>
              );
            })}
          </View>
          {adding ? (
            <NewShopForm
              onCreated={(shopId) => {
                choose(shopId);
                setAdding(false);
                setOpen(false);
              }}
              onCancel={() => setAdding(false)}
            />
          ) : (
            <Pressable role="button" onPress={() => setAdding(true)} style={({ pressed }) => [styles.option, pressed && styles.pressed]}>
              <Text style={styles.add}>+ Open another shop</Text>
            </Pressable>
          )}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  current: {
    minHeight: minTouchTarget,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    borderWidth: 1,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
  },
  currentText: { flex: 1, minWidth: 0, gap: space.xxs },
  overlineRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  chevron: { fontSize: 14, width: 16, textAlign: 'center' },
  pressed: { opacity: 0.75 },
  panel: { borderRadius: radius.md, padding: space.sm, gap: space.xxs },
  panelLight: { backgroundColor: palette.sheet, borderWidth: 1, borderColor: palette.rule },
  panelDark: { backgroundColor: palette.sheet },
  option: { minHeight: minTouchTarget, flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.sm },
  dot: { width: 16, height: 16, borderRadius: 8, borderWidth: 2 },
  dotOn: { backgroundColor: palette.ember, borderColor: palette.ember },
  optionName: { flex: 1, fontFamily: fonts.body },
  optionChosen: { fontFamily: fonts.bodyStrong },
  add: { color: palette.emberDeep, fontFamily: fonts.bodyStrong, fontSize: 15 },
});
