/**
 * The panel beside the pieces board for the picked piece: its drawing at a readable size, its stretch against
 * the budget (with the suggested dart), and its settings — thickness, surface, quantity, mirrored — which editors
 * change (each change re-flattens the pattern) and clients only read.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { useUpdatePieceSettings, type PieceSettingsPatch, type PieceState } from '../../hooks/use-pieces';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { palette, radius, space } from '../ui/theme';
import { formatBevel } from '../bench/bench-model';
import { ChoiceChips } from './choice-chips';
import { PIECE_FILLS } from './mark-styles';
import { PieceSvg } from './piece-svg';
import { pieceSvgModel } from './piece-svg-model';
import { pieceSeamRows } from './piece-seams';
import { SURFACE_HELP, THICKNESS_CHOICES_MM, parseQuantity, parseThickness, stretchVerdict } from './piece-settings-input';

export interface PiecePanelProps {
  shopId: string;
  buildId: string;
  doc: PatternDoc;
  label: string;
  /** The crew's row for this piece, when the server has one. */
  state: PieceState | null;
  canEdit: boolean;
  stretchBudgetPct: number;
  /** Width available for the drawing, px. */
  widthPx: number;
}

/**
 * Renders the panel of piece `label`. Nothing is rendered when the document has no such piece. The parent keys it
 * by label, so typed values start afresh when another piece is picked.
 */
export function PiecePanel({ shopId, buildId, doc, label, state, canEdit, stretchBudgetPct, widthPx }: PiecePanelProps) {
  const index = doc.pieces.findIndex((p) => p.label === label);
  const model = useMemo(() => (index >= 0 ? pieceSvgModel(doc, index) : null), [doc, index]);
  const update = useUpdatePieceSettings(shopId, buildId);
  // On a phone the panel sits under the board: bring it into view when a piece is picked (web only).
  const top = useRef<View>(null);
  useEffect(() => {
    (top.current as unknown as { scrollIntoView?: (o: object) => void } | null)?.scrollIntoView?.({ block: 'nearest', behavior: 'smooth' });
  }, []);
  const piece = index >= 0 ? doc.pieces[index] : null;
  const thickness = state?.thicknessMm ?? piece?.thickness ?? 6;
  const surface = state?.surface ?? piece?.surface ?? 'outer';
  const quantity = state?.quantity ?? piece?.quantity ?? 1;
  const mirrored = state?.mirrored ?? piece?.mirrored ?? false;
  const custom = !THICKNESS_CHOICES_MM.some((t) => t === thickness);
  const [customText, setCustomText] = useState(custom ? String(thickness) : '');
  const [customOpen, setCustomOpen] = useState(custom);
  const [customError, setCustomError] = useState<string | undefined>();
  const [qtyText, setQtyText] = useState(String(quantity));
  const [qtyError, setQtyError] = useState<string | undefined>();
  useEffect(() => {
    setQtyText(String(quantity));
    setQtyError(undefined);
  }, [quantity]);

  if (!piece || !model) return null;
  const save = (patch: PieceSettingsPatch) => update.mutate({ label, patch });
  const verdict = stretchVerdict(piece, stretchBudgetPct);
  const pxPerMm = Math.min(widthPx / model.viewBox[2], 360 / model.viewBox[3], 4);

  return (
    <Card style={styles.card}>
      <View ref={top} />
      <Text variant="title" heading={2}>
        Piece {piece.label}
      </Text>
      <Text variant="mono">
        {Math.round(piece.area2d / 100) / 100} dm² · {piece.faces} faces · {piece.thickness} mm · ×{piece.quantity}
        {piece.mirrored ? ` (${piece.mirroredCopies ?? 1} mirrored)` : ''}
      </Text>
      <View style={styles.drawing}>
        <PieceSvg model={model} pxPerMm={pxPerMm} fill={PIECE_FILLS.plain} title={`Drawing of piece ${piece.label} with its marks`} />
      </View>

      <Notice tone={verdict.over ? 'caution' : 'note'} title={verdict.over ? 'Over the stretch budget' : 'Stretch'}>
        {verdict.message}
      </Notice>
      <PieceSeamList doc={doc} label={piece.label} />
      {piece.scoreLines && piece.scoreLines.length > 0 ? (
        <Text variant="small">
          {piece.scoreLines.length} score line{piece.scoreLines.length === 1 ? '' : 's'} (dash-dot): cut a shallow V-groove on the inner face, then fold.
        </Text>
      ) : null}

      <View style={styles.section}>
        <Text variant="label">Foam thickness</Text>
        <ChoiceChips
          label={`Foam thickness of piece ${piece.label}`}
          disabled={!canEdit || update.isPending}
          value={customOpen ? 'custom' : String(thickness)}
          choices={[...THICKNESS_CHOICES_MM.map((t) => ({ value: String(t), label: `${t} mm`, name: `${t} mm foam` })), { value: 'custom', label: 'Custom', name: 'Custom thickness' }]}
          onChange={(v) => {
            if (v === 'custom') {
              setCustomOpen(true);
              return;
            }
            setCustomOpen(false);
            save({ thicknessMm: Number(v) });
          }}
        />
        {customOpen && canEdit ? (
          <View style={styles.inline}>
            <View style={styles.grow}>
              <TextField
                label="Custom thickness, mm"
                keyboardType="decimal-pad"
                inputMode="decimal"
                value={customText}
                onChangeText={setCustomText}
                error={customError}
                onSubmitEditing={() => applyCustom()}
              />
            </View>
            <Button label="Use" compact onPress={() => applyCustom()} accessibilityLabel="Use this thickness" />
          </View>
        ) : null}
      </View>

      <View style={styles.section}>
        <Text variant="label">Pattern follows</Text>
        <ChoiceChips
          label={`Surface the pattern of piece ${piece.label} follows`}
          disabled={!canEdit || update.isPending}
          value={surface}
          choices={(['outer', 'mid', 'inner'] as const).map((s) => ({ value: s, label: SURFACE_HELP[s].label }))}
          onChange={(s) => save({ surface: s })}
        />
        <Text variant="small">{SURFACE_HELP[surface].help}</Text>
      </View>

      <View style={styles.section}>
        <Text variant="label">Copies to cut</Text>
        {canEdit ? (
          <View style={styles.inline}>
            <Button label="−" tone="secondary" compact accessibilityLabel="One copy fewer" disabled={quantity <= 1 || update.isPending} onPress={() => save({ quantity: quantity - 1 })} />
            <View style={styles.qty}>
              <TextField
                label={`Copies of piece ${piece.label}`}
                keyboardType="number-pad"
                inputMode="numeric"
                value={qtyText}
                onChangeText={setQtyText}
                error={qtyError}
                onBlur={() => applyQuantity()}
                onSubmitEditing={() => applyQuantity()}
              />
            </View>
            <Button label="+" tone="secondary" compact accessibilityLabel="One copy more" disabled={update.isPending} onPress={() => save({ quantity: quantity + 1 })} />
          </View>
        ) : (
          <Text>{quantity}</Text>
        )}
      </View>

      <View style={styles.section}>
        <Pressable
          role="switch"
          aria-checked={mirrored}
          disabled={!canEdit || update.isPending}
          accessibilityLabel={`Cut every second copy of piece ${piece.label} mirrored`}
          onPress={() => save({ mirrored: !mirrored })}
          style={styles.switchRow}
        >
          <View style={[styles.switchTrack, mirrored && styles.switchOn]}>
            <View style={[styles.switchKnob, mirrored && styles.knobOn]} />
          </View>
          <Text style={styles.grow}>Mirrored: every second copy is cut with the template turned over (left and right sides).</Text>
        </Pressable>
      </View>

      {update.isPending ? <Text variant="small">Saving… the pieces are flattened again with the new setting.</Text> : null}
      {update.error ? (
        <Notice tone="error" title={`Piece ${piece.label} was not changed`}>
          {update.error.message}
        </Notice>
      ) : null}
      {!canEdit ? <Text variant="small">You follow this build as a client: settings are shown, not changed.</Text> : null}
    </Card>
  );

  function applyCustom() {
    const r = parseThickness(customText);
    if (!r.ok) {
      setCustomError(r.error);
      return;
    }
    setCustomError(undefined);
    save({ thicknessMm: r.value });
  }

  function applyQuantity() {
    const r = parseQuantity(qtyText);
    if (!r.ok) {
      setQtyError(r.error);
      return;
    }
    setQtyError(undefined);
    if (r.value !== quantity) save({ quantity: r.value });
  }
}

/** The piece's seams as a small table: number, other piece, bevel on this edge, corner. */
function PieceSeamList({ doc, label }: { doc: PatternDoc; label: string }) {
  const rows = pieceSeamRows(doc, label);
  if (rows.length === 0) return null;
  return (
    <View role="table" accessibilityLabel={`Seams of piece ${label}`} style={styles.seams}>
      <View role="row" style={styles.seamRow}>
        <Text role="columnheader" variant="label" style={styles.seamNo}>Seam</Text>
        <Text role="columnheader" variant="label" style={styles.seamCell}>Joins</Text>
        <Text role="columnheader" variant="label" style={styles.seamCell}>Bevel here</Text>
        <Text role="columnheader" variant="label" style={styles.seamCell}>Corner</Text>
      </View>
      {rows.map((r) => (
        <View role="row" key={r.seam} style={styles.seamRow}>
          <Text role="cell" variant="mono" style={[styles.seamNo, styles.seamNumber]}>{r.seam}</Text>
          <Text role="cell" style={styles.seamCell}>{r.joins === label ? 'itself' : r.joins}</Text>
          <Text role="cell" variant="mono" style={styles.seamCell}>{r.face === 'none' ? 'square' : `${formatBevel(r.bevelDeg)} ${r.face}`}</Text>
          <Text role="cell" style={styles.seamCell}>{r.corner === 'outside' ? '△ outside' : '▲ inside'}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  seams: { borderWidth: 1, borderColor: palette.rule, borderRadius: radius.sm },
  seamRow: { flexDirection: 'row', paddingHorizontal: space.sm, paddingVertical: space.xxs, borderBottomWidth: 1, borderBottomColor: palette.sheetSunk },
  seamNo: { width: 52 },
  seamNumber: { color: '#00756f', fontWeight: '700' },
  seamCell: { flex: 1 },
  drawing: { alignItems: 'center', paddingVertical: space.sm, backgroundColor: palette.sheet, borderRadius: radius.sm, borderWidth: 1, borderColor: palette.rule, overflow: 'hidden' },
  section: { gap: space.xs },
  inline: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  grow: { flex: 1 },
  qty: { width: 120 },
  switchRow: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: 44 },
  switchTrack: { width: 44, height: 26, borderRadius: 13, backgroundColor: palette.ruleStrong, padding: 3 },
  switchOn: { backgroundColor: palette.ember },
  switchKnob: { width: 20, height: 20, borderRadius: 10, backgroundColor: palette.sheet },
  knobOn: { transform: [{ translateX: 18 }] },
});
