/**
 * The shop-safety cautions, one tap away on the bench: heat guns and hot tools, blades, and solvent contact
 * cement (ventilation, a respirator for organic vapours, eye protection, a heat-resistant surface). The text is
 * the engine's own (the pattern's cautions, else the print set's safety notes), and it always ends by deferring
 * to the adhesive maker's safety data sheet and local rules.
 */
import { useEffect, useRef, useState } from 'react';
import { Modal, Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { SAFETY_NOTES } from '../../geometry/export/safety-notes';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

/** The deferral line printed on every print set; shown last whatever the pattern's own cautions say. */
export const DEFER_NOTE = SAFETY_NOTES[SAFETY_NOTES.length - 1];

/**
 * The cautions to show: the pattern's (geometry's SHOP_CAUTIONS, carried in the document) when it has them, else
 * the print set's safety notes; the deferral to the safety data sheet and local rules last, once.
 */
export function cautionLines(patternCautions: readonly string[] | undefined): string[] {
  const base = patternCautions && patternCautions.length > 0 ? [...patternCautions] : SAFETY_NOTES.slice(0, -1);
  return [...base.filter((l) => l !== DEFER_NOTE), DEFER_NOTE];
}

/** A dialog listing `cautionLines(cautions)` with a close button that takes focus when it opens. */
export function CautionsSheet({ visible, onClose, cautions }: { visible: boolean; onClose: () => void; cautions?: readonly string[] }) {
  const closeRef = useRef<View>(null);
  useEffect(() => {
    if (visible) setTimeout(() => (closeRef.current as unknown as { focus?: () => void } | null)?.focus?.(), 50);
  }, [visible]);
  return (
    <Modal visible={visible} transparent animationType="none" onRequestClose={onClose}>
      <View style={styles.backdrop}>
        <View role="dialog" aria-modal accessibilityLabel="Safety cautions" style={styles.sheet}>
          <View style={styles.head}>
            <Text variant="title" heading={2}>
              ⚠ Safety cautions
            </Text>
            <Pressable ref={closeRef} role="button" accessibilityLabel="Close the cautions" onPress={onClose} style={styles.close}>
              <Text variant="bodyStrong">✕</Text>
            </Pressable>
          </View>
          <ScrollView contentContainerStyle={styles.body}>
            {cautionLines(cautions).map((line, i, all) => (
              <View key={i} style={[styles.item, i === all.length - 1 && styles.defer]}>
                <Text style={styles.bullet}>{i === all.length - 1 ? '§' : '•'}</Text>
                <Text style={styles.grow}>{line}</Text>
              </View>
            ))}
          </ScrollView>
          <Button label="Got it" onPress={onClose} accessibilityLabel="Close the cautions and go back" />
        </View>
      </View>
    </Modal>
  );
}

/** A caution-coloured button that opens the cautions sheet. */
export function CautionsButton({ cautions }: { cautions?: readonly string[] }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <Pressable role="button" accessibilityLabel="Safety cautions" onPress={() => setOpen(true)} style={styles.trigger}>
        <Text variant="label" style={styles.triggerText}>
          ⚠ Safety cautions
        </Text>
      </Pressable>
      <CautionsSheet visible={open} onClose={() => setOpen(false)} cautions={cautions} />
    </>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: 'rgba(30,24,20,0.55)', justifyContent: 'flex-end', alignItems: 'center' },
  sheet: {
    width: '100%',
    maxWidth: 560,
    maxHeight: '90%',
    backgroundColor: palette.sheet,
    borderTopLeftRadius: radius.lg,
    borderTopRightRadius: radius.lg,
    padding: space.lg,
    gap: space.md,
    borderTopWidth: 6,
    borderTopColor: palette.caution,
  },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
  close: { minWidth: 44, minHeight: 44, alignItems: 'center', justifyContent: 'center' },
  body: { gap: space.md },
  item: { flexDirection: 'row', gap: space.sm },
  defer: { backgroundColor: palette.cautionWash, padding: space.sm, borderRadius: radius.sm },
  bullet: { width: 16, color: palette.caution, fontWeight: '700' },
  grow: { flex: 1 },
  trigger: {
    minHeight: 44,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.pill,
    backgroundColor: palette.cautionWash,
    borderWidth: 1,
    borderColor: palette.caution,
    alignSelf: 'flex-start',
  },
  triggerText: { color: palette.caution },
});
