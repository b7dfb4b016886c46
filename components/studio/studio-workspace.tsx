/**
 * The studio's working area for one processed sculpt: the 3D view with its tools (draw, erase and pick modes,
 * undo/redo, mirror, crease suggestions, suggested pieces, stretch map), the save line, and the flat pieces beside
 * the 3D view on a wide screen or one toggle away on a phone. Loaded lazily with three.js.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Platform, ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import type { SeamLine } from '../../db/schema-sculpts';
import type { WorkingMesh } from '../../geometry/io/working-mesh';
import { buildTwins } from '../../geometry/mesh/half-edges';
import { usePieceSelection } from '../../hooks/use-piece-selection';
import { isJobActive, patternQueryKey, usePattern, usePatternFaces } from '../../hooks/use-pattern';
import { putSeams, seamsPath, type SeamSetView } from '../../hooks/use-seams';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { PiecesBoard } from '../pieces/pieces-board';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { seamBadges } from './seam-badges';
import { SeamRequestCancelled, startSeamEngine, type SeamEngine } from './seam-engine-client';
import { pushHistory, redoHistory, resetHistory, startHistory, undoHistory, type History } from './seam-history';
import { createSeamSaver, type SeamSaveStatus, type SeamSaver } from './seam-saver';
import {
  acceptSuggestions,
  addSeam,
  applySymmetry,
  eraseSeam,
  extendPath,
  nextSeamId,
  removeSymmetry,
  seamNearPoint,
  seamsWithoutCopy,
  type SeamSetDraft,
} from './seam-set-edits';
import { CoverPictureButton } from './cover-picture-button';
import { useStudioKeys, type StudioKeyAction } from './studio-keys';
import StudioViewport, { type SurfacePick } from './studio-viewport';
import { BudgetChooser, SaveLine, saveStatusText, ShortcutsHelp, StretchLegend, ToolButton, ToolGroup } from './studio-tools';

export interface StudioWorkspaceProps {
  shopId: string;
  buildId: string;
  sculptId: string;
  mesh: WorkingMesh;
  seams: SeamSetView;
  canEdit: boolean;
}

type Mode = 'draw' | 'erase' | 'pick';
type Busy = { what: string; cancellable: boolean } | null;
type Candidates = { source: 'crease' | 'auto'; lines: number[][] } | null;

/** Quiet spell before seams are sent to the server, ms (the studio brief: about 800 ms). */
const SAVE_DELAY_MS = 800;
/** Crease suggestions: edges bent at least this far from flat, degrees (the engine's crease border default). */
const CREASE_DEG = 40;

const draftOf = (v: SeamSetView): SeamSetDraft => ({ seams: v.seams, symmetry: v.symmetry, stretchBudgetPct: v.stretchBudgetPct });

/** Renders the workspace; `seams` is the server's seam set when the page opened. */
export default function StudioWorkspace({ shopId, buildId, sculptId, mesh, seams: initial, canEdit }: StudioWorkspaceProps) {
  const wide = useWideLayout();
  const { height } = useWindowDimensions();
  const [history, setHistoryState] = useState<History<SeamSetDraft>>(() => startHistory(draftOf(initial)));
  const historyRef = useRef(history);
  const [mode, setMode] = useState<Mode>(canEdit ? 'draw' : 'pick');
  const [drawing, setDrawing] = useState<{ picks: number[]; path: number[] }>({ picks: [], path: [] });
  const [candidates, setCandidates] = useState<Candidates>(null);
  const [busy, setBusy] = useState<Busy>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [saveStatus, setSaveStatus] = useState<SeamSaveStatus>({ state: 'saved' });
  const [stretchOn, setStretchOn] = useState(false);
  const [showHelp, setShowHelp] = useState(false);
  const [phoneView, setPhoneView] = useState<'3d' | 'pieces'>('3d');
  const { selectedLabel, select } = usePieceSelection();
  const queryClient = useQueryClient();

  const engine = useMemo<SeamEngine>(() => startSeamEngine(mesh.positions, mesh.triangles), [mesh]);
  useEffect(() => () => engine.dispose(), [engine]);

  const setHistory = useCallback((h: History<SeamSetDraft>) => {
    historyRef.current = h;
    setHistoryState(h);
  }, []);

  const saver = useMemo<SeamSaver>(
    () =>
      createSeamSaver<SeamSetView>(
        {
          delayMs: SAVE_DELAY_MS,
          put: (base, draft) => putSeams(seamsPath(shopId, buildId, sculptId), base, draft),
          onStatus: setSaveStatus,
          // A save queues a new pattern: ask for it now, so its progress is polled until the pieces are made.
          onSaved: () => void queryClient.invalidateQueries({ queryKey: patternQueryKey(shopId, buildId) }),
          onConflict: (current) => {
            // Their save queued its own pattern: read it too.
            void queryClient.invalidateQueries({ queryKey: patternQueryKey(shopId, buildId) });
            setDrawing({ picks: [], path: [] });
            setHistory(resetHistory(draftOf(current)));
          },
        },
        initial.revision,
      ),
    // One saver per sculpt: the initial revision is only where it starts, and later ones come from its own saves.
    [shopId, buildId, sculptId],
  );
  useEffect(() => {
    const flushOnLeave = () => void saver.flush();
    if (Platform.OS === 'web' && typeof window !== 'undefined') window.addEventListener('pagehide', flushOnLeave);
    return () => {
      if (Platform.OS === 'web' && typeof window !== 'undefined') window.removeEventListener('pagehide', flushOnLeave);
      void saver.flush().finally(() => saver.dispose());
    };
  }, [saver]);

  const commit = useCallback(
    (next: SeamSetDraft) => {
      const h = historyRef.current;
      if (next === h.present) return;
      setHistory(pushHistory(h, next));
      saver.change(next);
    },
    [saver, setHistory],
  );
  const step = useCallback(
    (dir: 'undo' | 'redo') => {
      const h = historyRef.current;
      const next = dir === 'undo' ? undoHistory(h) : redoHistory(h);
      if (next === h) return;
      setHistory(next);
      saver.change(next.present);
    },
    [saver, setHistory],
  );

  const report = (err: unknown) => {
    if (err instanceof SeamRequestCancelled) return;
    setProblem(err instanceof Error ? err.message : String(err));
  };

  const finishSeam = useCallback(async () => {
    const path = drawing.path;
    setDrawing({ picks: [], path: [] });
    if (path.length < 2) return;
    const present = historyRef.current.present;
    const seam: SeamLine = { id: nextSeamId(present.seams, 'picked-'), picks: drawing.picks, path, source: 'picked' };
    let copy: SeamLine | null = null;
    if (present.symmetry) {
      try {
        [copy] = await engine.ask({ kind: 'mirror', seams: [seam], plane: present.symmetry });
      } catch (err) {
        report(err);
      }
    }
    commit(addSeam(historyRef.current.present, seam, copy));
  }, [drawing, engine, commit]);

  const onPick = async (pick: SurfacePick) => {
      setProblem(null);
      const present = historyRef.current.present;
      if (mode === 'pick' || !canEdit) {
        const i = faces.data && pick.face < faces.data.pieceIndex.length ? faces.data.pieceIndex[pick.face] : -1;
        const label = doc && i >= 0 ? doc.pieces[i]?.label ?? null : null;
        select(label === selectedLabel ? null : label);
        return;
      }
      if (mode === 'erase') {
        const hit = seamNearPoint(present.seams, mesh.positions, pick.point, 3 * meanEdge);
        if (hit) commit(eraseSeam(present, hit.id));
        else setProblem('No seam there to erase: click on a dark seam line.');
        return;
      }
      const findPath = async (from: number, to: number) => engine.ask({ kind: 'path', from, to });
      const last = drawing.path[drawing.path.length - 1];
      const leg = last === undefined ? null : await findPath(last, pick.vertex).catch((err: unknown) => (report(err), null));
      const path = last === undefined ? [pick.vertex] : leg ? extendPath(drawing.path, pick.vertex, () => leg) : null;
      if (!path) {
        setProblem('That point is on a part of the model the seam cannot reach along its edges; pick a point on the same part.');
        return;
      }
      setDrawing({ picks: [...drawing.picks, pick.vertex], path });
  };

  const undoPick = () => {
    if (drawing.picks.length <= 1) {
      setDrawing({ picks: [], path: [] });
      return;
    }
    const picks = drawing.picks.slice(0, -1);
    // Rebuild from the kept picks: the path is cut back to the last kept pick.
    const lastKept = picks[picks.length - 1];
    const idx = drawing.path.lastIndexOf(lastKept);
    setDrawing({ picks, path: drawing.path.slice(0, idx + 1) });
  };

  const toggleSymmetry = async () => {
    const present = historyRef.current.present;
    if (present.symmetry) {
      commit(removeSymmetry(present));
      return;
    }
    setBusy({ what: 'Looking for the symmetry plane…', cancellable: false });
    try {
      const plane = await engine.ask({ kind: 'symmetry' });
      if (!plane) {
        setProblem('This sculpt has no mirror plane within 1 % of its size, so seams cannot be mirrored.');
        return;
      }
      const now = historyRef.current.present;
      const copies = await engine.ask({ kind: 'mirror', seams: seamsWithoutCopy(now), plane });
      commit(applySymmetry(historyRef.current.present, plane, copies));
    } catch (err) {
      report(err);
    } finally {
      setBusy(null);
    }
  };

  const suggestCreases = async () => {
    if (candidates?.source === 'crease') {
      setCandidates(null);
      return;
    }
    setBusy({ what: 'Finding creases…', cancellable: true });
    try {
      const lines = await engine.ask({ kind: 'creases', minDeviationDeg: CREASE_DEG });
      if (lines.length === 0) setProblem(`No edge of this sculpt bends more than ${CREASE_DEG}° from flat, so there are no creases to suggest.`);
      setCandidates(lines.length ? { source: 'crease', lines } : null);
    } catch (err) {
      report(err);
    } finally {
      setBusy(null);
    }
  };

  const suggestPieces = async () => {
    const present = historyRef.current.present;
    setBusy({ what: `Working out pieces within ${present.stretchBudgetPct}% stretch…`, cancellable: true });
    try {
      const lines = await engine.ask({ kind: 'auto', stretchBudgetPct: present.stretchBudgetPct, symmetric: present.symmetry !== null });
      setCandidates({ source: 'auto', lines });
    } catch (err) {
      report(err);
    } finally {
      setBusy(null);
    }
  };

  const cancelBusy = () => {
    engine.cancel();
    setBusy(null);
  };

  const acceptAll = () => {
    if (!candidates) return;
    commit(acceptSuggestions(historyRef.current.present, candidates.lines, candidates.source));
    setCandidates(null);
  };
  const acceptOne = (i: number) => {
    if (!candidates) return;
    commit(acceptSuggestions(historyRef.current.present, [candidates.lines[i]], candidates.source));
    const rest = candidates.lines.filter((_, k) => k !== i);
    setCandidates(rest.length ? { ...candidates, lines: rest } : null);
  };

  const setBudget = (pct: number) => commit({ ...historyRef.current.present, stretchBudgetPct: pct });

  // Pattern of this sculpt (pieces, stretch) from the pattern hooks.
  const pattern = usePattern(shopId, buildId);
  const p = pattern.data && pattern.data.sculptId === sculptId ? pattern.data : null;
  const doc = p?.status === 'done' ? p.doc : null;
  const faces = usePatternFaces(p?.status === 'done' ? p.facesUrl : null);
  const faceCount = mesh.triangles.length / 3;
  const facesOk = faces.data && faces.data.pieceIndex.length === faceCount ? faces.data : null;
  const twin = useMemo(() => buildTwins(mesh.triangles, mesh.positions.length / 3), [mesh]);
  const badges = useMemo(
    () => (doc && facesOk ? seamBadges(doc, mesh.positions, mesh.triangles, twin, facesOk.pieceIndex) : []),
    [doc, facesOk, mesh, twin],
  );
  const meanEdge = useMemo(() => {
    const P = mesh.positions;
    const T = mesh.triangles;
    let s = 0;
    const n = Math.min(T.length / 3, 2000);
    for (let f = 0; f < n; f++) {
      const a = T[3 * f];
      const b = T[3 * f + 1];
      s += Math.hypot(P[3 * a] - P[3 * b], P[3 * a + 1] - P[3 * b + 1], P[3 * a + 2] - P[3 * b + 2]);
    }
    return n ? s / n : 1;
  }, [mesh]);
  const selectedPiece = doc && selectedLabel ? doc.pieces.findIndex((pc) => pc.label === selectedLabel) : -1;

  const present = history.present;

  useStudioKeys(wide, { canEdit, busy: !!busy, drawing: drawing.picks.length > 0 }, (action) => {
    const run: Record<StudioKeyAction, () => void> = {
      help: () => setShowHelp((s) => !s),
      'close-help': () => setShowHelp(false),
      'finish-seam': () => void finishSeam(),
      'drop-pick': undoPick,
      undo: () => step('undo'),
      redo: () => step('redo'),
      'erase-mode': () => setMode('erase'),
      'draw-mode': () => setMode('draw'),
      'pick-mode': () => setMode('pick'),
      mirror: () => void toggleSymmetry(),
      creases: () => void suggestCreases(),
      'stretch-map': () => setStretchOn((s) => !s),
    };
    run[action]();
  });

  const seamCount = present.seams.length;
  const description = `3D view of the sculpt with ${seamCount} seam${seamCount === 1 ? '' : 's'}${doc ? ` and ${doc.pieces.length} pieces` : ''}${stretchOn && facesOk ? ', stretch map shown' : ''}.`;
  const colourMode = stretchOn && facesOk ? 'stretch' : facesOk ? 'pieces' : 'plain';
  const viewHeight = wide ? Math.max(420, Math.min(760, height - 260)) : Math.max(340, Math.min(520, height - 300));
  const patternLine = !p
    ? 'No pieces yet: mark seams and the pattern is made from them.'
    : isJobActive(p.status)
      ? `Making pieces from seam revision ${p.seamRevision}… ${p.progress}%`
      : p.status === 'failed'
        ? `The pieces could not be made: ${p.error ?? 'unknown error'}`
        : `${doc?.pieces.length ?? 0} piece${doc?.pieces.length === 1 ? '' : 's'} from seam revision ${p.seamRevision}.`;

  const seamTools = (
    <View style={styles.tools}>
      {canEdit ? (
        <ToolGroup label="Seam tools">
          <ToolButton label="Draw" hint={wide ? 'D' : undefined} on={mode === 'draw'} onPress={() => setMode('draw')} accessibilityLabel="Draw seams" />
          <ToolButton label="Erase" hint={wide ? 'E' : undefined} on={mode === 'erase'} onPress={() => setMode('erase')} accessibilityLabel="Erase seams" />
          <ToolButton label="Pick piece" hint={wide ? 'P' : undefined} on={mode === 'pick'} onPress={() => setMode('pick')} />
          <ToolButton
            label={`Finish seam${drawing.picks.length ? ` (${drawing.picks.length})` : ''}`}
            hint={wide ? 'Enter' : undefined}
            disabled={drawing.path.length < 2}
            onPress={() => void finishSeam()}
            accessibilityLabel="Finish seam"
          />
          <ToolButton label="Undo" hint={wide ? 'Z' : undefined} disabled={history.past.length === 0 || !!busy} onPress={() => step('undo')} />
          <ToolButton label="Redo" hint={wide ? '⇧Z' : undefined} disabled={history.future.length === 0 || !!busy} onPress={() => step('redo')} />
        </ToolGroup>
      ) : (
        <ToolGroup label="View tools">
          <Text variant="small">You can look and pick pieces; your role does not allow changing seams.</Text>
        </ToolGroup>
      )}
    </View>
  );
  const moreTools = (
    <View style={styles.tools}>
      <ToolGroup label="Suggestions and views">
        {canEdit ? (
          <>
            <ToolButton label="Mirror" hint={wide ? 'M' : undefined} on={present.symmetry !== null} disabled={!!busy} onPress={() => void toggleSymmetry()} accessibilityLabel="Mirror seams across the symmetry plane" />
            <ToolButton label="Creases" hint={wide ? 'C' : undefined} on={candidates?.source === 'crease'} disabled={!!busy} onPress={() => void suggestCreases()} accessibilityLabel="Suggest seams along creases" />
            <ToolButton label="Suggest pieces" disabled={!!busy} onPress={() => void suggestPieces()} />
            <BudgetChooser value={present.stretchBudgetPct} onChange={setBudget} disabled={!!busy} />
          </>
        ) : null}
        <ToolButton label="Stretch map" hint={wide ? 'S' : undefined} on={stretchOn} disabled={!facesOk} onPress={() => setStretchOn((s) => !s)} accessibilityLabel="Show the stretch map" />
        {canEdit ? <CoverPictureButton buildId={buildId} /> : null}
        {wide ? <ToolButton label="Keys" hint="?" on={showHelp} onPress={() => setShowHelp((s) => !s)} accessibilityLabel="Keyboard shortcuts" /> : null}
      </ToolGroup>
    </View>
  );

  const view3d = (
    <View style={[styles.viewport, { height: viewHeight }]}>
      <StudioViewport
        mesh={mesh}
        seams={present.seams}
        draft={drawing.path}
        candidates={candidates?.lines ?? []}
        colourMode={colourMode}
        faces={facesOk}
        stretchBudgetPct={present.stretchBudgetPct}
        selectedPiece={selectedPiece >= 0 ? selectedPiece : null}
        badges={stretchOn ? [] : badges}
        onPick={(pick) => void onPick(pick)}
        description={description}
      />
      <View style={styles.overlayTop} pointerEvents="box-none">
        <Text style={styles.modeTag}>
          {mode === 'draw' ? 'Draw: click points on the model' : mode === 'erase' ? 'Erase: click a seam' : 'Pick: click a piece'}
        </Text>
      </View>
    </View>
  );

  const board = doc ? (
    <PiecesBoard doc={doc} selectedLabel={selectedLabel} onSelect={select} compact stretchBudgetPct={present.stretchBudgetPct} />
  ) : (
    <Text variant="small">{patternLine}</Text>
  );

  return (
    <View style={styles.wrap}>
      {seamTools}
      {wide ? moreTools : null}
      <View style={styles.statusRow}>
        {canEdit ? <SaveLine status={saveStatus} /> : null}
        <Text variant="small" accessibilityLabel={`${seamCount} seams`}>
          {seamCount} seam{seamCount === 1 ? '' : 's'}
          {present.symmetry ? ' · mirrored' : ''}
        </Text>
        <Text variant="small">{patternLine}</Text>
      </View>
      {busy ? (
        <View role="status" style={styles.busy}>
          <Text variant="bodyStrong">{busy.what}</Text>
          {busy.cancellable ? <ToolButton label="Cancel" accessibilityLabel="Cancel the suggestion" onPress={cancelBusy} /> : null}
        </View>
      ) : null}
      {problem ? (
        <Notice tone="caution" title="Seam not changed">
          {problem}
        </Notice>
      ) : null}
      {candidates ? (
        <View style={styles.candidates} role="region" accessibilityLabel="Suggested seams">
          <Text variant="bodyStrong">
            {candidates.lines.length} suggested seam{candidates.lines.length === 1 ? '' : 's'} ({candidates.source === 'crease' ? `creases over ${CREASE_DEG}°` : `pieces within ${present.stretchBudgetPct}%`}), dashed in violet
          </Text>
          <View style={styles.candidateRow}>
            <ToolButton label="Accept all" accessibilityLabel="Accept all suggested seams" onPress={acceptAll} />
            <ToolButton label="Dismiss" accessibilityLabel="Dismiss the suggestions" onPress={() => setCandidates(null)} />
            {candidates.lines.slice(0, 12).map((_, i) => (
              <ToolButton key={i} label={`+${i + 1}`} accessibilityLabel={`Accept suggested seam ${i + 1}`} onPress={() => acceptOne(i)} />
            ))}
          </View>
        </View>
      ) : null}
      {showHelp ? <ShortcutsHelp onClose={() => setShowHelp(false)} /> : null}
      {stretchOn && facesOk ? <StretchLegend budgetPct={present.stretchBudgetPct} /> : null}
      {wide ? (
        <View style={styles.side}>
          <View style={styles.sideMain}>{view3d}</View>
          <ScrollView style={[styles.sideBoard, { height: viewHeight }]} accessibilityLabel="Flat pieces">
            {board}
          </ScrollView>
        </View>
      ) : (
        <>
          <View style={styles.phoneSwitch} role="tablist" accessibilityLabel="Studio view">
            <ToolButton label="3D view" on={phoneView === '3d'} onPress={() => setPhoneView('3d')} />
            <ToolButton label="Flat pieces" on={phoneView === 'pieces'} onPress={() => setPhoneView('pieces')} />
          </View>
          {/* The 3D view stays mounted while the pieces show: its WebGL context and badge overlays live on. */}
          <View style={phoneView === '3d' ? undefined : styles.hidden}>{view3d}</View>
          {phoneView === 'pieces' ? <View style={styles.phoneBoard}>{board}</View> : null}
          {/* On a phone the model comes first; suggestions and views sit under it, with a repeat of a save problem. */}
          {saveStatus.state === 'conflict' || saveStatus.state === 'failed' ? (
            <Notice tone="caution">{saveStatusText(saveStatus)}</Notice>
          ) : null}
          {moreTools}
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  tools: { gap: space.xs },
  statusRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'center' },
  busy: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    padding: space.sm,
    backgroundColor: palette.cautionWash,
    borderRadius: radius.sm,
  },
  candidates: { gap: space.xs, padding: space.sm, borderWidth: 1, borderColor: '#6d28d9', borderStyle: 'dashed', borderRadius: radius.sm },
  candidateRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  viewport: { width: '100%', borderRadius: radius.md, overflow: 'hidden', borderWidth: 1, borderColor: palette.ruleStrong, backgroundColor: palette.sheetSunk },
  overlayTop: { position: 'absolute', top: space.sm, left: space.sm },
  modeTag: { fontSize: 12, color: palette.onBench, backgroundColor: 'rgba(47,41,37,0.82)', paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.sm },
  side: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  sideMain: { flex: 3 },
  sideBoard: { flex: 2, borderLeftWidth: 1, borderLeftColor: palette.rule, paddingLeft: space.sm },
  phoneSwitch: { flexDirection: 'row', gap: space.xs },
  phoneBoard: { minHeight: 200 },
  hidden: { display: 'none' },
});
