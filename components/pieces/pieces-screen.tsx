/**
 * The pieces page: the flattened pieces drawn with their marks and, for the picked piece, its stretch and
 * settings. On a wide screen the panel sits beside the board; on a phone it follows below it.
 */
import { useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { usePieceSelection } from '../../hooks/use-piece-selection';
import { useStretchBudget } from '../../hooks/use-pattern';
import { usePieces, type PieceState } from '../../hooks/use-pieces';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { BuildSubpage, type BuildPageContext } from './build-subpage';
import { MarksLegend } from './marks-legend';
import { PatternGate } from './pattern-status';
import { PiecePanel } from './piece-panel';
import { PiecesBoard } from './pieces-board';

/** Route screen for /builds/:id/pieces. */
export function PiecesScreen({ buildId, shopParam }: { buildId: string; shopParam: string | null }) {
  return (
    <BuildSubpage buildId={buildId} shopParam={shopParam} section="pieces">
      {(ctx) => <PiecesBody ctx={ctx} />}
    </BuildSubpage>
  );
}

function PiecesBody({ ctx }: { ctx: BuildPageContext }) {
  const wide = useWideLayout();
  const { width } = useWindowDimensions();
  const shared = usePieceSelection();
  const [ownPick, setOwnPick] = useState<string | null>(null);
  // Inside the studio the pick is shared with the 3D view; on this page alone it is the page's own.
  const selectedLabel = shared.selectedLabel ?? ownPick;
  const select = (label: string | null) => {
    setOwnPick(label);
    shared.select(label);
  };
  const pieces = usePieces(ctx.shopId, ctx.buildId);
  return (
    <PatternGate shopId={ctx.shopId} buildId={ctx.buildId} canEdit={ctx.canEdit}>
      {(doc, pattern) => (
        <PiecesLayout
          ctx={ctx}
          doc={doc}
          sculptId={pattern.sculptId}
          wide={wide}
          windowWidth={width}
          selectedLabel={doc.pieces.some((p) => p.label === selectedLabel) ? selectedLabel : null}
          onSelect={select}
          states={pieces.data ?? []}
          piecesError={pieces.error?.message ?? null}
        />
      )}
    </PatternGate>
  );
}

function PiecesLayout({
  ctx,
  doc,
  sculptId,
  wide,
  windowWidth,
  selectedLabel,
  onSelect,
  states,
  piecesError,
}: {
  ctx: BuildPageContext;
  doc: PatternDoc;
  sculptId: string;
  wide: boolean;
  windowWidth: number;
  selectedLabel: string | null;
  onSelect: (label: string | null) => void;
  states: PieceState[];
  piecesError: string | null;
}) {
  const budget = useStretchBudget(ctx.shopId, ctx.buildId, sculptId);
  const over = doc.pieces.filter((p) => p.stretch.maxPct > budget);
  const panelWidth = wide ? 380 : Math.min(windowWidth - 2 * space.lg - 2 * space.lg, 560);
  const panel = selectedLabel ? (
    <PiecePanel
      key={selectedLabel}
      shopId={ctx.shopId}
      buildId={ctx.buildId}
      doc={doc}
      label={selectedLabel}
      state={states.find((s) => s.label === selectedLabel) ?? null}
      canEdit={ctx.canEdit}
      stretchBudgetPct={budget}
      widthPx={panelWidth - 2 * space.lg}
    />
  ) : (
    <View style={styles.hint}>
      <Text variant="bodyStrong">Pick a piece</Text>
      <Text variant="small">Tap a piece to see its stretch and to set its foam thickness, surface, copies and mirroring.</Text>
    </View>
  );
  return (
    <View style={styles.gap}>
      <Text variant="mono">
        {doc.pieces.length} pieces · {doc.pieces.reduce((n, p) => n + p.quantity, 0)} copies to cut · {doc.seams.length} seams · stretch budget {budget} %
      </Text>
      {over.length > 0 ? (
        <Notice tone="caution" title={`${over.length} piece${over.length === 1 ? '' : 's'} over the ${budget} % stretch budget`}>
          {`${over.map((p) => `${p.label} (${p.stretch.maxPct.toFixed(1)} %)`).join(', ')}. Pick one to see the suggested dart.`}
        </Notice>
      ) : null}
      {doc.warnings.length > 0 ? (
        <Notice tone="note" title="Notes from flattening">
          {doc.warnings.slice(0, 6).join('\n')}
        </Notice>
      ) : null}
      {piecesError ? <Notice tone="error" title="Piece settings did not load">{piecesError}</Notice> : null}
      <View style={wide ? styles.wideRow : styles.gap}>
        <View style={wide ? styles.boardWide : undefined}>
          <PiecesBoard doc={doc} selectedLabel={selectedLabel} onSelect={onSelect} stretchBudgetPct={budget} compact={!wide && windowWidth < 480} />
        </View>
        <View style={wide ? { width: panelWidth } : undefined}>{panel}</View>
      </View>
      <MarksLegend />
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.lg },
  wideRow: { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' },
  boardWide: { flex: 1 },
  hint: { padding: space.lg, borderWidth: 1, borderStyle: 'dashed', borderColor: palette.ruleStrong, borderRadius: 6, gap: space.xs },
});
