/**
 * Making a print set from the current pattern: page size and layout, which files, "make print set" with the
 * job's progress, and download links for every file of the newest sets.
 */
import { useState } from 'react';
import { Linking, Platform, Pressable, StyleSheet, View } from 'react-native';
import { ApiError } from '../../hooks/api-client';
import { isJobActive, type PatternView } from '../../hooks/use-pattern';
import { PRINT_FORMATS, useCreatePrintSet, usePrintSets, type PrintFormat, type PrintMode, type PrintPage, type PrintSetView } from '../../hooks/use-print-sets';
import { formatBytes } from '../../hooks/use-upload';
import { formatWhen } from '../builds/format-time';
import { ChoiceChips } from '../pieces/choice-chips';
import { JobProgress } from '../pieces/pattern-status';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

const PAGES: ReadonlyArray<{ value: PrintPage; label: string; name: string }> = [
  { value: 'a4', label: 'A4', name: 'A4 page, 210 × 297 mm' },
  { value: 'letter', label: 'Letter', name: 'Letter page, 8.5 × 11 in' },
  { value: 'a3', label: 'A3', name: 'A3 page, 297 × 420 mm' },
  { value: 'tabloid', label: 'Tabloid', name: 'Tabloid page, 11 × 17 in' },
];
const MODES: ReadonlyArray<{ value: PrintMode; label: string; help: string }> = [
  { value: 'tiled', label: 'Tiled', help: 'Pieces packed across pages that overlap; tape the pages together along the marks.' },
  { value: 'piece-per-page', label: 'Piece per page', help: 'Each piece starts on its own pages: easy to sort, more paper.' },
  { value: 'stock-sheet', label: 'Sheet plan', help: 'The pages show the sheet plan: pieces where they sit on the foam sheets.' },
];
const FORMAT_WORDS: Record<PrintFormat, string> = { pdf: 'PDF to print, with the bench card', svg: 'SVG at 1:1 for laser cutters', dxf: 'DXF at 1:1 for CNC and blade cutters' };
const FILE_WORDS: Record<string, string> = {
  'print-set.pdf': 'Print set (PDF)',
  'bench-card.pdf': 'Bench card (PDF)',
  'pattern.svg': 'Pattern (SVG, 1:1)',
  'pattern.dxf': 'Pattern (DXF, 1:1)',
  'sheet-plan.json': 'Sheet plan (JSON)',
};

/** A download link for one file: an anchor with `download` on the web, the system opener elsewhere. */
function FileLink({ name, url, sizeBytes }: { name: string; url: string; sizeBytes: number }) {
  const words = FILE_WORDS[name] ?? name;
  // react-native-web renders `href` + `hrefAttrs` as an <a href download>; its props are not in the native types.
  const webLink: object = Platform.OS === 'web' ? { href: url, hrefAttrs: { download: name } } : {};
  const size = formatBytes(sizeBytes);
  return (
    <Pressable
      role="link"
      accessibilityLabel={`Download ${words}`}
      {...webLink}
      onPress={Platform.OS === 'web' ? undefined : () => Linking.openURL(url)}
      style={styles.file}
    >
      <Text style={styles.fileText}>⤓ {words}</Text>
      <Text variant="mono">{size}</Text>
    </Pressable>
  );
}

function PrintSetRow({ set }: { set: PrintSetView }) {
  return (
    <View style={styles.set}>
      <Text variant="label">
        {set.page.toUpperCase()} · {MODES.find((m) => m.value === set.mode)?.label ?? set.mode} · {set.pieceCount} {set.pieceCount === 1 ? 'piece' : 'pieces'} · {formatWhen(set.createdAt)}
      </Text>
      {isJobActive(set.status) ? <JobProgress label={set.status === 'queued' ? 'Waiting to make the print set' : 'Making the print set'} progress={null} stage={null} /> : null}
      {set.status === 'failed' ? <Notice tone="error" title="This print set failed">{set.error ?? 'The job stopped without a message.'}</Notice> : null}
      {set.status === 'done' ? (
        <View style={styles.files}>
          {set.files.map((f) => (
            <FileLink key={f.name} name={f.name} url={f.url} sizeBytes={f.sizeBytes} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** Renders the print section for `pattern`. Viewers without the shop's print-set grant see a note instead of files. */
export function PrintSetPanel({ shopId, buildId, pattern, canEdit }: { shopId: string; buildId: string; pattern: PatternView; canEdit: boolean }) {
  const sets = usePrintSets(shopId, buildId);
  const create = useCreatePrintSet(shopId, buildId);
  const [page, setPage] = useState<PrintPage>('a4');
  const [mode, setMode] = useState<PrintMode>('tiled');
  const [formats, setFormats] = useState<PrintFormat[]>([...PRINT_FORMATS]);
  const [formatError, setFormatError] = useState<string | null>(null);
  const forbidden = sets.error instanceof ApiError && sets.error.status === 403;

  const make = () => {
    if (formats.length === 0) {
      setFormatError('Pick at least one file type: PDF, SVG or DXF.');
      return;
    }
    setFormatError(null);
    create.mutate({ patternId: pattern.id, formats, page, mode });
  };

  return (
    <View style={styles.gap}>
      {canEdit ? (
        <View style={styles.gap}>
          <Text variant="label">Page size</Text>
          <ChoiceChips label="Page size" choices={PAGES} value={page} onChange={setPage} />
          <Text variant="label">Layout</Text>
          <ChoiceChips label="Layout of the pages" choices={MODES.map((m) => ({ value: m.value, label: m.label }))} value={mode} onChange={setMode} />
          <Text variant="small">{MODES.find((m) => m.value === mode)!.help}</Text>
          <Text variant="label">Files</Text>
          <View style={styles.checks}>
            {PRINT_FORMATS.map((f) => {
              const on = formats.includes(f);
              return (
                <Pressable
                  key={f}
                  role="checkbox"
                  aria-checked={on}
                  accessibilityLabel={FORMAT_WORDS[f]}
                  onPress={() => setFormats((fs) => (on ? fs.filter((x) => x !== f) : [...fs, f]))}
                  style={styles.check}
                >
                  <View style={[styles.box, on && styles.boxOn]}>{on ? <Text style={styles.tick}>✓</Text> : null}</View>
                  <Text>{FORMAT_WORDS[f]}</Text>
                </Pressable>
              );
            })}
          </View>
          {formatError ? <Notice tone="error">{formatError}</Notice> : null}
          <Text variant="small">Print at 100 % (turn off "fit to page") and check the scale square with a ruler before cutting.</Text>
          <View>
            <Button label="Make print set" busy={create.isPending} onPress={make} />
          </View>
          {create.error ? <Notice tone="error" title="The print set was not started">{create.error.message}</Notice> : null}
        </View>
      ) : null}
      {sets.isPending ? <Loading label="Loading print sets" /> : null}
      {forbidden ? <Notice tone="note">The shop's owner has not shared print sets with you.</Notice> : null}
      {sets.error && !forbidden ? <Notice tone="error" title="Print sets did not load">{sets.error.message}</Notice> : null}
      {sets.data && sets.data.length === 0 ? <Text>No print sets yet.</Text> : null}
      {sets.data?.slice(0, 3).map((s) => <PrintSetRow key={s.id} set={s} />)}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.sm },
  checks: { gap: space.xs },
  check: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 44 },
  box: { width: 22, height: 22, borderRadius: 4, borderWidth: 2, borderColor: palette.inkSoft, alignItems: 'center', justifyContent: 'center', backgroundColor: palette.sheet },
  boxOn: { backgroundColor: palette.ink, borderColor: palette.ink },
  tick: { color: palette.sheet, fontSize: 15, lineHeight: 17, fontWeight: '800' },
  set: { gap: space.sm, padding: space.md, borderWidth: 1, borderColor: palette.rule, borderRadius: radius.md, backgroundColor: palette.sheet },
  files: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  file: { flexDirection: 'row', gap: space.sm, alignItems: 'baseline', paddingHorizontal: space.md, paddingVertical: space.sm, minHeight: 44, borderRadius: radius.sm, backgroundColor: palette.emberWash, borderWidth: 1, borderColor: palette.ember },
  fileText: { color: palette.emberDeep, fontWeight: '600' },
});
