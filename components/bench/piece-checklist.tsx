/**
 * One piece on the bench: its label and copies, the three checklist boxes (cut, shaped, glued) shared by the
 * crew, and its notes behind a toggle.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View, type PressableStateCallbackType } from 'react-native';
import { CHECKLIST_STEPS, type ChecklistStep, type ProgressPatch } from '../../hooks/use-pieces';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';
import { copiesText, type BenchPiece } from './bench-model';
import { PieceNotes } from './piece-notes';

const STEP_WORDS: Record<ChecklistStep, string> = { cut: 'Cut', shaped: 'Shaped', glued: 'Glued' };

type PressState = PressableStateCallbackType & { focused?: boolean };


export interface PieceChecklistProps {
  shopId: string;
  buildId: string;
  piece: BenchPiece;
  canEdit: boolean;
  onTick: (label: string, patch: ProgressPatch) => void;
}

/** Renders the row; the boxes are checkboxes named "Piece A cut" etc., disabled for clients. */
export function PieceChecklist({ shopId, buildId, piece, canEdit, onTick }: PieceChecklistProps) {
  const [notesOpen, setNotesOpen] = useState(false);
  const done = piece.cut && piece.shaped && piece.glued;
  return (
    <View style={[styles.row, done && styles.rowDone]} accessibilityLabel={`Piece ${piece.label}`}>
      <View style={styles.head}>
        <Text style={styles.label}>{piece.label}</Text>
        <Text variant="small" style={styles.grow}>
          {copiesText(piece.quantity, piece.spares)}
          {piece.mirroredCopies > 0 ? ` · ${piece.mirroredCopies} mirrored` : ''}
          {done ? ' · done' : ''}
        </Text>
        <Pressable
          role="button"
          aria-expanded={notesOpen}
          accessibilityLabel={`Notes on piece ${piece.label} (${piece.notes})`}
          onPress={() => setNotesOpen((o) => !o)}
          style={(s: PressState) => [styles.notesBtn, s.focused && styles.focus]}
        >
          <Text variant="label">
            Notes{piece.notes > 0 ? ` (${piece.notes})` : ''} {notesOpen ? '▴' : '▾'}
          </Text>
        </Pressable>
      </View>
      <View style={styles.steps}>
        {CHECKLIST_STEPS.map((step) => {
          const checked = piece[step];
          return (
            <Pressable
              key={step}
              role="checkbox"
              aria-checked={checked}
              aria-disabled={!canEdit}
              disabled={!canEdit}
              accessibilityLabel={`Piece ${piece.label} ${STEP_WORDS[step].toLowerCase()}`}
              onPress={() => onTick(piece.label, { [step]: !checked })}
              style={(s: PressState) => [styles.step, checked && styles.stepOn, !canEdit && styles.stepReadOnly, s.focused && styles.focus]}
            >
              <View style={[styles.box, checked && styles.boxOn]}>{checked ? <Text style={styles.tick}>✓</Text> : null}</View>
              <Text style={[styles.stepText, checked && styles.stepTextOn]}>{STEP_WORDS[step]}</Text>
            </Pressable>
          );
        })}
      </View>
      {notesOpen ? <PieceNotes shopId={shopId} buildId={buildId} label={piece.label} canEdit={canEdit} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { padding: space.md, backgroundColor: palette.sheet, borderRadius: radius.md, borderWidth: 1, borderColor: palette.rule, gap: space.sm },
  rowDone: { borderColor: palette.sage, backgroundColor: '#eef2e8' },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  label: { fontFamily: fonts.display, fontSize: 30, lineHeight: 34, minWidth: 44, color: palette.ink },
  grow: { flex: 1 },
  notesBtn: { minHeight: 44, justifyContent: 'center', paddingHorizontal: space.sm },
  steps: { flexDirection: 'row', gap: space.sm },
  step: {
    flex: 1,
    minHeight: 52,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.sm,
    borderWidth: 1,
    borderColor: palette.ruleStrong,
    borderRadius: radius.md,
    backgroundColor: palette.paper,
  },
  stepOn: { backgroundColor: palette.ok, borderColor: palette.ok },
  stepReadOnly: { opacity: 0.8 },
  box: { width: 22, height: 22, borderRadius: 4, borderWidth: 2, borderColor: palette.inkSoft, alignItems: 'center', justifyContent: 'center', backgroundColor: palette.sheet },
  boxOn: { borderColor: palette.sheet, backgroundColor: palette.sheet },
  tick: { color: palette.ok, fontSize: 16, lineHeight: 18, fontWeight: '800' },
  stepText: { fontSize: 16, fontFamily: fonts.bodyStrong, color: palette.ink },
  stepTextOn: { color: palette.sheet },
  focus: { outlineColor: palette.slate, outlineWidth: 3, outlineStyle: 'solid', outlineOffset: 2 },
});
