/**
 * Making and reading a sheet plan: the cutting gap and spares, "make a sheet plan" with the job's progress, and
 * the newest plan: sheets, used share and cost per thickness, and a drawing of each sheet.
 */
import { useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import { useCreateSheetPlan, useSheetPlans } from '../../hooks/use-sheet-plans';
import { isJobActive, type PatternView } from '../../hooks/use-pattern';
import { useStock } from '../../hooks/use-stock';
import { JobProgress } from '../pieces/pattern-status';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { palette, radius, space } from '../ui/theme';
import { formatMoney } from './sheet-plan-model';
import { SheetDrawing } from './sheet-drawing';

/** Renders the plan section for `pattern`; `maxWidthPx` bounds the sheet drawings. */
export function SheetPlanPanel({ shopId, buildId, pattern, canEdit, maxWidthPx }: { shopId: string; buildId: string; pattern: PatternView; canEdit: boolean; maxWidthPx: number }) {
  const plans = useSheetPlans(shopId, buildId);
  const create = useCreateSheetPlan(shopId, buildId);
  const stock = useStock(shopId);
  const { width } = useWindowDimensions();
  const [gap, setGap] = useState('3');
  const [spares, setSpares] = useState('10');
  const [errors, setErrors] = useState<{ gap?: string; spares?: string }>({});
  const currency = stock.data?.[0]?.currency ?? 'EUR';

  const make = () => {
    const g = Number(gap.replace(',', '.'));
    const s = Number(spares.replace(',', '.'));
    const e: typeof errors = {};
    // Same ranges as the server's sheetPlanCreateBody (db/validation-bench.ts).
    if (!Number.isFinite(g) || g < 0 || g > 50) e.gap = 'Cutting gap must be a number from 0 to 50 mm.';
    if (!Number.isFinite(s) || s < 0 || s > 100) e.spares = 'Spares must be a percentage from 0 to 100.';
    setErrors(e);
    if (e.gap || e.spares) return;
    create.mutate({ patternId: pattern.id, gapMm: g, spares: s });
  };

  const newest = plans.data?.[0] ?? null;
  const plan = newest && newest.status === 'done' ? newest.plan : null;
  // The drawings take the width the card really has (measured), not the window's.
  const [boxWidth, setBoxWidth] = useState(0);
  const drawWidth = Math.max(120, Math.min(maxWidthPx, boxWidth > 0 ? boxWidth : width - 4 * space.lg));
  return (
    <View style={styles.gap}>
      {canEdit ? (
        <View style={styles.controls}>
          <View style={styles.field}>
            <TextField label="Cutting gap, mm" inputMode="decimal" value={gap} onChangeText={setGap} error={errors.gap} hint="Room between pieces for the blade." />
          </View>
          <View style={styles.field}>
            <TextField label="Spares, % of repeated pieces" inputMode="decimal" value={spares} onChangeText={setSpares} error={errors.spares} hint="Extra copies of small repeated parts." />
          </View>
          <Button label="Make a sheet plan" busy={create.isPending} disabled={isJobActive(newest?.status)} onPress={make} />
        </View>
      ) : null}
      {create.error ? <Notice tone="error" title="The sheet plan was not started">{create.error.message}</Notice> : null}
      {plans.isPending ? <Loading label="Loading sheet plans" /> : null}
      {plans.error ? <Notice tone="error" title="Sheet plans did not load">{plans.error.message}</Notice> : null}
      {plans.data && !newest ? <Text>No sheet plan yet.{canEdit ? ' Make one to see how many sheets the pieces need and what the foam costs.' : ''}</Text> : null}
      {newest && isJobActive(newest.status) ? (
        <JobProgress label={newest.status === 'queued' ? 'Waiting to plan the sheets' : 'Nesting the pieces on the sheets'} progress={newest.progress} stage={newest.stage} />
      ) : null}
      {newest && newest.status === 'failed' ? (
        <Notice tone="error" title="The sheet plan failed">
          {newest.error ?? 'The job stopped without a message.'}
        </Notice>
      ) : null}
      {newest && plan ? (
        <View style={styles.gap}>
          {newest.patternId !== pattern.id ? (
            <Notice tone="caution">This plan was made from an earlier version of the pieces. Make a new one to match the current pieces.</Notice>
          ) : null}
          <View role="table" accessibilityLabel="Sheets per thickness" style={styles.table}>
            <View role="row" style={[styles.tr, styles.th]}>
              <Text role="columnheader" variant="label" style={styles.c1}>Thickness</Text>
              <Text role="columnheader" variant="label" style={styles.c}>Sheets</Text>
              <Text role="columnheader" variant="label" style={styles.c}>Used</Text>
              <Text role="columnheader" variant="label" style={styles.c}>Cost</Text>
            </View>
            {plan.byThickness.map((t) => (
              <View role="row" key={t.thicknessMm} style={styles.tr}>
                <Text role="cell" style={styles.c1}>{t.thicknessMm} mm</Text>
                <Text role="cell" variant="mono" style={styles.c}>{t.sheets}</Text>
                <Text role="cell" variant="mono" style={styles.c}>{t.usedPct.toFixed(0)} %</Text>
                <Text role="cell" variant="mono" style={styles.c}>{formatMoney(t.cost, plan.currency ?? currency)}</Text>
              </View>
            ))}
            <View role="row" style={[styles.tr, styles.total]}>
              <Text role="cell" variant="label" style={styles.c1}>All</Text>
              <Text role="cell" variant="mono" style={styles.c}>{plan.sheets.length}</Text>
              <Text role="cell" style={styles.c}> </Text>
              <Text role="cell" variant="label" style={styles.c}>{formatMoney(plan.totalCost, plan.currency ?? currency)}</Text>
            </View>
          </View>
          <Text variant="small">{plan.sparesRule.charAt(0).toUpperCase() + plan.sparesRule.slice(1).replace(/\.?$/, '.')} Spares are drawn dashed; a mark ′ after a label is a mirrored copy.</Text>
          <View style={styles.sheets} onLayout={(e) => setBoxWidth(e.nativeEvent.layout.width)}>
            {plan.sheets.map((s, i) => (
              <View key={i} style={styles.sheet}>
                <Text variant="label">
                  Sheet {i + 1} · {s.thicknessMm} mm · {Math.round(s.widthMm)} × {Math.round(s.heightMm)} mm · {s.usedPct.toFixed(0)} % used
                </Text>
                <SheetDrawing
                  sheet={s}
                  placements={plan.placements.filter((p) => p.sheetIndex === i)}
                  widthPx={Math.min(drawWidth, s.widthMm >= s.heightMm ? drawWidth : drawWidth * 0.6)}
                  title={`Sheet ${i + 1}, ${s.thicknessMm} mm, ${s.copies} copies placed, ${s.usedPct.toFixed(0)} percent used`}
                />
              </View>
            ))}
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.md },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start', columnGap: space.md },
  field: { width: 220 },
  table: { borderWidth: 1, borderColor: palette.rule, borderRadius: radius.md, backgroundColor: palette.sheet },
  tr: { flexDirection: 'row', paddingHorizontal: space.md, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: palette.rule },
  th: { backgroundColor: palette.sheetSunk },
  total: { borderBottomWidth: 0 },
  c1: { flex: 1.2 },
  c: { flex: 1, textAlign: 'right' },
  sheets: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  sheet: { gap: space.xs },
});
