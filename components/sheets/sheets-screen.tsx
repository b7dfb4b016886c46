/**
 * The sheets and print page: the shop's stock per thickness, the sheet plan (how many sheets, how full, what the
 * foam costs, and where each piece sits), and the print set files.
 */
import { StyleSheet, View } from 'react-native';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { BuildSubpage, type BuildPageContext } from '../pieces/build-subpage';
import { PatternGate } from '../pieces/pattern-status';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { PrintSetPanel } from './print-set-panel';
import { SheetPlanPanel } from './sheet-plan-panel';
import { StockEditor } from './stock-editor';

/** Route screen for /builds/:id/sheets. */
export function SheetsScreen({ buildId, shopParam }: { buildId: string; shopParam: string | null }) {
  return (
    <BuildSubpage buildId={buildId} shopParam={shopParam} section="sheets">
      {(ctx) => <SheetsBody ctx={ctx} />}
    </BuildSubpage>
  );
}

function SheetsBody({ ctx }: { ctx: BuildPageContext }) {
  const wide = useWideLayout();
  return (
    <PatternGate shopId={ctx.shopId} buildId={ctx.buildId} canEdit={ctx.canEdit}>
      {(doc, pattern) => (
        <View style={wide ? styles.wideRow : styles.gap}>
          <View style={[styles.gap, wide && styles.main]}>
            <Card style={styles.gap}>
              <Text variant="heading" heading={2}>
                Stock sheets
              </Text>
              <StockEditor shopId={ctx.shopId} canEdit={ctx.canEdit} patternThicknesses={[...new Set(doc.pieces.map((p) => p.thickness))]} />
            </Card>
            <Card style={styles.gap}>
              <Text variant="heading" heading={2}>
                Sheet plan
              </Text>
              <SheetPlanPanel shopId={ctx.shopId} buildId={ctx.buildId} pattern={pattern} canEdit={ctx.canEdit} maxWidthPx={wide ? 720 : 560} />
            </Card>
          </View>
          <Card style={[styles.gap, wide && styles.side]}>
            <Text variant="heading" heading={2}>
              Print set
            </Text>
            <PrintSetPanel shopId={ctx.shopId} buildId={ctx.buildId} pattern={pattern} canEdit={ctx.canEdit} />
          </Card>
        </View>
      )}
    </PatternGate>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.lg },
  wideRow: { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' },
  main: { flex: 1 },
  side: { width: 380 },
});
