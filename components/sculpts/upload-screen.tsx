/**
 * Uploading a sculpt to a build: choose the file, say its units and the wearer's measures (with the size before
 * and after scaling), send it with a real progress bar, then follow the processing job until the working
 * mesh is ready and open the studio.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { Pressable, StyleSheet, View } from 'react-native';
import { SCULPT_UNITS, sculptUploadFields } from '../../db/validation-sculpts';
import { wearerScale } from '../../geometry/mesh/wearer-scale';
import { useCurrentShop } from '../../hooks/current-shop';
import { buildPermissionsFor } from '../../hooks/role-permissions';
import { useBuild } from '../../hooks/use-builds';
import { useSculpt } from '../../hooks/use-sculpts';
import { checkSculptFile, formatBytes, useSculptUpload } from '../../hooks/use-upload';
import { buildHref } from '../builds/build-row';
import { ProgressBar } from '../builds/progress-bar';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';
import { FilePicker } from './file-picker';
import { MEASURE_BEFORE_UPLOAD_MAX_BYTES, type ModelDims } from './model-dims';
import { measureModelFile } from './model-dims-client';
import { formatLengthMm } from './sculpt-versions';

type PickedFile = Blob & { name: string };
type Units = (typeof SCULPT_UNITS)[number];
const unitNames: Record<Units, string> = { mm: 'millimetres', cm: 'centimetres', m: 'metres', in: 'inches' };

const sizeText = (s: readonly number[]) => s.map(formatLengthMm).join(' × ');

/** Reads a typed number; blank or unreadable text is null (the form's schema reports what is wrong). */
function typedNumber(text: unknown): number | null {
  if (typeof text !== 'string' || text.trim() === '') return null;
  const v = Number(text.trim());
  return Number.isFinite(v) && v > 0 ? v : null;
}

/** The before/after block: model size, and when measures or a factor are given, the scaled size. */
function SizePreview({ dims, circumference, height, factor }: { dims: ModelDims; circumference: number | null; height: number | null; factor: number | null }) {
  let after: { sizeMm: number[]; factor: number; note: string | null } | null = null;
  let problem: string | null = null;
  if ((circumference !== null || height !== null) && dims.section) {
    try {
      const w = wearerScale(dims.section, dims.sizeMm, { headCircumferenceMm: circumference, headHeightMm: height });
      after = { sizeMm: w.after.sizeMm, factor: w.factor, note: w.disagreement };
    } catch (e) {
      problem = e instanceof Error ? e.message : String(e);
    }
  } else if (factor !== null && factor !== 1) {
    after = { sizeMm: dims.sizeMm.map((v) => v * factor), factor, note: null };
  }
  return (
    <View role="group" accessibilityLabel="Model size" style={styles.preview}>
      <Text variant="label">Size as modelled</Text>
      <Text variant="mono" accessibilityLabel="Size before scaling">{sizeText(dims.sizeMm)}</Text>
      <Text variant="small">{`${dims.triangles.toLocaleString('en')} triangles${dims.section ? ` · about ${formatLengthMm(dims.section.circumferenceMm)} round at half height` : ''}`}</Text>
      {after ? (
        <>
          <Text variant="label" style={styles.afterLabel}>{`Scaled ×${after.factor.toFixed(3)}`}</Text>
          <Text variant="mono" accessibilityLabel="Size after scaling">{sizeText(after.sizeMm)}</Text>
          {after.note ? <Notice tone="caution">{after.note}</Notice> : null}
        </>
      ) : null}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </View>
  );
}

/**
 * The upload screen for build `buildId` of shop `shopId` (the current shop when null). Viewers are told they
 * cannot upload. When processing is done the page moves to the studio.
 */
export function UploadScreen({ buildId, shopId }: { buildId: string; shopId: string | null }) {
  const router = useRouter();
  const { membership, memberships } = useCurrentShop();
  const targetShopId = shopId ?? membership?.shopId ?? '';
  const role = memberships.find((m) => m.shopId === targetShopId)?.role ?? 'viewer';
  const build = useBuild(targetShopId, buildId);
  const upload = useSculptUpload(targetShopId, buildId);
  const [file, setFile] = useState<PickedFile | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [dims, setDims] = useState<{ state: 'none' | 'measuring' | 'later' } | { state: 'done'; dims: ModelDims } | { state: 'failed'; message: string }>({ state: 'none' });
  const { control, handleSubmit } = useForm({
    resolver: zodResolver(sculptUploadFields),
    defaultValues: { units: 'mm', scale: '', headCircumferenceMm: '', headHeightMm: '', targetTriangles: '' },
  });
  const units = useWatch({ control, name: 'units' }) as Units;
  const [circText, heightText, scaleText] = useWatch({ control, name: ['headCircumferenceMm', 'headHeightMm', 'scale'] });
  const sculptId = upload.state.phase === 'done' ? upload.state.sculpt.id : null;
  const sculpt = useSculpt(targetShopId, buildId, sculptId);
  const b = useMemo(() => ({ id: buildId, shopId: targetShopId }), [buildId, targetShopId]);

  useEffect(() => {
    if (!file) return;
    if (file.size > MEASURE_BEFORE_UPLOAD_MAX_BYTES) {
      setDims({ state: 'later' });
      return;
    }
    let live = true;
    setDims({ state: 'measuring' });
    measureModelFile(file, file.name, units).then(
      (d) => live && setDims({ state: 'done', dims: d }),
      (e: unknown) => live && setDims({ state: 'failed', message: e instanceof Error ? e.message : String(e) }),
    );
    return () => {
      live = false;
    };
  }, [file, units]);

  useEffect(() => {
    if (sculpt.data?.status === 'done') router.replace(buildHref(b, '/studio'));
  }, [sculpt.data?.status, router, b]);

  const back = (
    <Link href={buildHref(b)} style={styles.back}>
      {`← ${build.data?.name ?? 'The build'}`}
    </Link>
  );
  if (!buildPermissionsFor(role).rename) {
    return (
      <Screen>
        {back}
        <Notice tone="note">Your role in this shop lets you follow the build but not upload sculpts.</Notice>
      </Screen>
    );
  }

  const onPick = (f: PickedFile | null) => {
    upload.reset();
    setFile(f);
    setDims({ state: 'none' });
    setFileError(f ? checkSculptFile(f.name, f.size) : null);
  };
  const submit = handleSubmit(async (fields) => {
    if (!file) {
      setFileError('Choose a model file first (.obj, .stl or .ply).');
      return;
    }
    const problem = checkSculptFile(file.name, file.size);
    setFileError(problem);
    if (!problem) await upload.start(file, fields);
  });
  const st = upload.state;
  const busy = st.phase === 'sending' || st.phase === 'waiting' || (st.phase === 'done' && sculpt.data?.status !== 'failed');
  const measuresGiven = typedNumber(circText) !== null || typedNumber(heightText) !== null;

  return (
    <Screen>
      <PageTitle title={`Upload a sculpt – ${build.data?.name ?? ''}`} />
      {back}
      <Text variant="display" heading={1} style={styles.title}>
        Upload a sculpt
      </Text>
      {build.error ? <Notice tone="error" title="This build did not open">{build.error.message}</Notice> : null}
      <Card style={styles.block}>
        <FilePicker label="Model file (OBJ, STL or PLY, up to 200 MB)" onPick={onPick} disabled={busy} />
        {file ? <Text variant="mono" style={styles.fileLine}>{`${file.name} · ${formatBytes(file.size)}`}</Text> : null}
        {fileError ? <Notice tone="error">{fileError}</Notice> : null}

        <Text variant="label" style={styles.fieldLabel} nativeID="units-label">
          Units the model was made in
        </Text>
        <Controller
          control={control}
          name="units"
          render={({ field: { value, onChange } }) => (
            <View role="radiogroup" aria-labelledby="units-label" style={styles.units}>
              {SCULPT_UNITS.map((u) => (
                <Pressable
                  key={u}
                  role="radio"
                  aria-checked={value === u}
                  accessibilityLabel={unitNames[u]}
                  onPress={() => onChange(u)}
                  style={[styles.unit, value === u && styles.unitOn]}
                >
                  <Text style={[styles.unitText, value === u && styles.unitTextOn]}>{u}</Text>
                </Pressable>
              ))}
            </View>
          )}
        />

        <Text variant="heading" heading={2} style={styles.sub}>
          Scale to the wearer
        </Text>
        <Text variant="small" style={styles.hint}>
          Give the head's circumference (round the brow) and height (crown to chin) in millimetres, or a scale factor. Leave all blank to keep the model's size.
        </Text>
        <View style={styles.pair}>
          <View style={styles.pairCell}>
            <FormTextField control={control} name="headCircumferenceMm" label="Head circumference (mm)" inputMode="decimal" placeholder="e.g. 570" />
          </View>
          <View style={styles.pairCell}>
            <FormTextField control={control} name="headHeightMm" label="Head height (mm)" inputMode="decimal" placeholder="e.g. 230" />
          </View>
        </View>
        {measuresGiven ? null : <FormTextField control={control} name="scale" label="Scale factor" inputMode="decimal" placeholder="1" />}

        {dims.state === 'measuring' ? <Loading label="Measuring the model" /> : null}
        {dims.state === 'later' ? <Text variant="small">{`This file is over ${formatBytes(MEASURE_BEFORE_UPLOAD_MAX_BYTES)}: its size is shown once it has been processed.`}</Text> : null}
        {dims.state === 'failed' ? <Notice tone="error" title="This file does not read as a model">{dims.message}</Notice> : null}
        {dims.state === 'done' ? (
          <SizePreview dims={dims.dims} circumference={typedNumber(circText)} height={typedNumber(heightText)} factor={typedNumber(scaleText)} />
        ) : null}

        <Button label="Upload sculpt" onPress={submit} busy={busy} disabled={!file || Boolean(fileError)} style={styles.submit} />
      </Card>

      {st.phase === 'sending' ? (
        <Card style={styles.block}>
          <Text variant="label">{`Sending ${formatBytes(st.sent)} of ${formatBytes(st.total)}`}</Text>
          <ProgressBar pct={(st.sent / Math.max(1, st.total)) * 100} label="Upload progress" />
          <Button label="Cancel upload" tone="secondary" compact onPress={upload.cancel} style={styles.cancel} />
        </Card>
      ) : null}
      {st.phase === 'waiting' ? <Loading label="Sent; waiting for the server to accept the file" /> : null}
      {st.phase === 'failed' ? (
        <Notice tone="error" title="The upload did not go through">
          {st.error.message}
        </Notice>
      ) : null}
      {st.phase === 'done' ? (
        <Card style={styles.block}>
          <Text variant="heading" heading={2}>{`Version ${st.sculpt.version}: processing`}</Text>
          {sculpt.data ? (
            <>
              <Text variant="mono">{`${sculpt.data.stage ?? (sculpt.data.status === 'queued' ? 'waiting for a worker' : sculpt.data.status)} · ${Math.round(sculpt.data.progress)} %`}</Text>
              <ProgressBar pct={sculpt.data.progress} label="Processing progress" />
            </>
          ) : null}
          {sculpt.data?.status === 'failed' ? (
            <Notice tone="error" title="Processing failed">
              {sculpt.data.error ?? 'The job ended without saying why.'}
            </Notice>
          ) : null}
          {sculpt.data?.status === 'done' ? <Text>Ready. Opening the studio…</Text> : null}
          {sculpt.error ? <Notice tone="error">{sculpt.error.message}</Notice> : null}
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  back: { color: palette.emberDeep, fontSize: 15, marginBottom: space.lg, alignSelf: 'flex-start', textDecorationLine: 'underline' },
  title: { marginBottom: space.xl },
  block: { marginBottom: space.xl },
  fileLine: { marginTop: space.xs },
  fieldLabel: { marginTop: space.lg, marginBottom: space.xs },
  units: { flexDirection: 'row', gap: space.xs, flexWrap: 'wrap' },
  unit: { minHeight: 44, minWidth: 56, justifyContent: 'center', alignItems: 'center', borderWidth: 1, borderColor: palette.ruleStrong, borderRadius: radius.sm, backgroundColor: palette.sheet },
  unitOn: { backgroundColor: palette.ink, borderColor: palette.ink },
  unitText: { fontFamily: fonts.monoStrong, color: palette.ink },
  unitTextOn: { color: palette.sheet },
  sub: { marginTop: space.xl, marginBottom: space.xs },
  hint: { marginBottom: space.md },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  pairCell: { flexGrow: 1, flexBasis: 160 },
  preview: { marginTop: space.md, padding: space.md, backgroundColor: palette.sheetSunk, borderRadius: radius.sm, gap: space.xxs },
  afterLabel: { marginTop: space.sm },
  submit: { marginTop: space.lg },
  cancel: { alignSelf: 'flex-start', marginTop: space.sm },
});
