/**
 * The bench view, made for a phone at the bench: the safety cautions one tap away, seam look-up by number, and
 * the pieces to cut grouped by foam thickness with the crew's shared checklist and notes. Ticks show at once and
 * are undone with a notice when the server refuses them; other members' ticks appear within 10 s.
 */
import { StyleSheet, View } from 'react-native';
import { useBench } from '../../hooks/use-bench';
import { usePieceProgress } from '../../hooks/use-pieces';
import { BuildSubpage, type BuildPageContext } from '../pieces/build-subpage';
import { PatternGate } from '../pieces/pattern-status';
import { CautionsButton } from '../safety/cautions-sheet';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { PieceChecklist } from './piece-checklist';
import { SeamLookup } from './seam-lookup';

/** "1 copy", "12 copies". */
function copyCount(n: number): string {
  return `${n} ${n === 1 ? 'copy' : 'copies'}`;
}

/** Route screen for /builds/:id/bench. */
export function BenchScreen({ buildId, shopParam }: { buildId: string; shopParam: string | null }) {
  return (
    <BuildSubpage buildId={buildId} shopParam={shopParam} section="bench" maxWidth={640}>
      {(ctx) => <BenchBody ctx={ctx} />}
    </BuildSubpage>
  );
}

function BenchBody({ ctx }: { ctx: BuildPageContext }) {
  const bench = useBench(ctx.shopId, ctx.buildId);
  const tick = usePieceProgress(ctx.shopId, ctx.buildId);
  const doc = bench.doc;
  return (
    <View style={styles.gap}>
      <CautionsButton cautions={doc?.cautions} />
      <PatternGate shopId={ctx.shopId} buildId={ctx.buildId} canEdit={ctx.canEdit}>
        {(d) => {
          const total = d.pieces.length;
          const done = bench.groups.reduce((n, g) => n + g.done, 0);
          return (
            <View style={styles.gap}>
              <SeamLookup doc={d} />
              <View style={styles.summary}>
                <Text variant="heading" heading={2}>
                  Pieces to cut
                </Text>
                <Text variant="mono">
                  {done} of {total} {total === 1 ? 'piece' : 'pieces'} done · {copyCount(d.pieces.reduce((n, p) => n + p.quantity, 0))}
                </Text>
              </View>
              {!ctx.canEdit ? <Notice tone="note">You follow this build as a client: the checklist is shown, not changed.</Notice> : null}
              {tick.error ? (
                <Notice tone="error" title={`The tick on piece ${tick.variables?.label ?? ''} was not saved`}>
                  {`${tick.error.message} The box shows what the server has.`}
                </Notice>
              ) : null}
              {bench.pieces.isPending ? <Loading label="Loading the checklist" /> : null}
              {bench.pieces.error ? (
                <View>
                  <Notice tone="error" title="The checklist did not load">
                    {bench.pieces.error.message}
                  </Notice>
                  <Button label="Try again" tone="secondary" compact onPress={() => bench.pieces.refetch()} />
                </View>
              ) : null}
              {bench.groups.map((g) => (
                <View key={g.thicknessMm} style={styles.group} role="group" accessibilityLabel={`${g.thicknessMm} mm foam`}>
                  <View style={styles.groupHead}>
                    <Text style={styles.thickness}>{g.thicknessMm} mm</Text>
                    <Text variant="small">
                      {g.pieces.length} piece{g.pieces.length === 1 ? '' : 's'} · {g.copies} cop{g.copies === 1 ? 'y' : 'ies'} · {g.done} done
                    </Text>
                  </View>
                  {g.pieces.map((p) => (
                    <PieceChecklist
                      key={p.label}
                      shopId={ctx.shopId}
                      buildId={ctx.buildId}
                      piece={p}
                      canEdit={ctx.canEdit && !bench.pieces.error}
                      onTick={(label, patch) => tick.mutate({ label, patch })}
                    />
                  ))}
                </View>
              ))}
            </View>
          );
        }}
      </PatternGate>
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.lg },
  summary: { gap: space.xxs },
  group: { gap: space.sm },
  groupHead: { flexDirection: 'row', alignItems: 'baseline', gap: space.md, borderBottomWidth: 3, borderBottomColor: palette.slate, paddingBottom: space.xs },
  thickness: { fontSize: 26, fontWeight: '800', color: palette.slate },
});
