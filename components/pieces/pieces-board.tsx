/**
 * The 2D pieces board: every piece of a pattern drawn with its print marks (label, match-mark ticks and seam
 * numbers, bevel triangles and notes, score lines, darts) in a wrapping grid at one shared scale, so pieces
 * keep their true relative sizes. A piece is picked by tap, click, or Enter/Space when focused.
 */
import { useMemo } from 'react';
import { Pressable, StyleSheet, View, type PressableStateCallbackType } from 'react-native';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { PIECE_FILLS } from './mark-styles';
import { PieceSvg } from './piece-svg';
import { boardScale, pieceAccessibleName, pieceSvgModel } from './piece-svg-model';

export interface PiecesBoardProps {
  doc: PatternDoc;
  selectedLabel: string | null;
  /** Called with the piece's label; picking the picked piece again clears the pick (`null`). */
  onSelect(label: string | null): void;
  /** Smaller cells for a side panel beside the 3D view. */
  compact?: boolean;
  /** Stretch budget, percent: pieces over it get a warning wash and a note. Default 3 (the engine's default). */
  stretchBudgetPct?: number;
}

/** RN-web passes `focused` to the style callback as well; native passes only `pressed`. */
type PressState = PressableStateCallbackType & { focused?: boolean; hovered?: boolean };

/**
 * Renders the board. Each piece is a button named like "Piece C, 6 mm, 2 copies", marked pressed when it is the
 * picked one; the largest piece fills a 180 px cell (120 px when `compact`).
 */
export function PiecesBoard({ doc, selectedLabel, onSelect, compact, stretchBudgetPct = 3 }: PiecesBoardProps) {
  const models = useMemo(() => doc.pieces.map((_, i) => pieceSvgModel(doc, i)), [doc]);
  const cellPx = compact ? 120 : 180;
  const scale = boardScale(models, cellPx);
  return (
    <View style={styles.board} role="list" accessibilityLabel="Pattern pieces">
      {models.map((m) => {
        const piece = doc.pieces[m.index];
        const selected = piece.label === selectedLabel;
        const over = piece.stretch.maxPct > stretchBudgetPct;
        const name = pieceAccessibleName(piece);
        return (
          <View role="listitem" key={piece.label}>
            <Pressable
              role="button"
              accessibilityLabel={name}
              aria-pressed={selected}
              onPress={() => onSelect(selected ? null : piece.label)}
              style={(state: PressState) => [
                styles.cell,
                compact && styles.cellCompact,
                selected && styles.cellSelected,
                over && !selected && styles.cellOver,
                (state.hovered || state.pressed) && styles.cellHover,
                state.focused && styles.cellFocus,
              ]}
            >
              <PieceSvg
                model={m}
                pxPerMm={scale}
                fill={selected ? PIECE_FILLS.selected : over ? PIECE_FILLS.overBudget : PIECE_FILLS.plain}
                outlineBoost={selected ? 1.8 : 1}
                title={`Drawing of piece ${piece.label}`}
                thumbnail
              />
              <View style={styles.caption}>
                <Text variant="label">{piece.label}</Text>
                <Text variant="mono">
                  {Math.round(piece.thickness * 10) / 10} mm · ×{piece.quantity}
                  {piece.mirrored ? ' · mirror' : ''}
                </Text>
              </View>
              {over ? (
                <Text variant="small" style={styles.over}>
                  Stretch {piece.stretch.maxPct.toFixed(1)} % (over {stretchBudgetPct} %)
                </Text>
              ) : null}
            </Pressable>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  board: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-start' },
  cell: {
    padding: space.sm,
    borderWidth: 1,
    borderColor: palette.rule,
    borderRadius: radius.md,
    backgroundColor: palette.sheet,
    alignItems: 'center',
    gap: space.xs,
    minWidth: 96,
  },
  cellCompact: { padding: space.xs, minWidth: 72 },
  cellSelected: { borderColor: palette.ember, borderWidth: 2, backgroundColor: palette.emberWash },
  cellOver: { borderColor: palette.caution },
  cellHover: { backgroundColor: palette.sheetSunk },
  cellFocus: { outlineColor: palette.slate, outlineWidth: 3, outlineStyle: 'solid', outlineOffset: 2 },
  caption: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  over: { color: palette.caution, textAlign: 'center', maxWidth: 180 },
});
