/**
 * Seam look-up for the bench: a big number field (numeric keypad on a phone) and, for the seam typed, the two
 * pieces and the bevel to cut on each side in large type, the kind of corner, and the stations where the bevel
 * changes along the seam.
 */
import { useState } from 'react';
import { StyleSheet, TextInput, View } from 'react-native';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';
import { benchStations, formatBevel, lookUpSeam, normaliseSeamQuery } from './bench-model';

const FACE_WORDS = { inner: 'off the inner face', outer: 'off the outer face', none: 'square, no bevel' } as const;

/** Renders the look-up for `doc`'s seams. */
export function SeamLookup({ doc }: { doc: PatternDoc }) {
  const [typed, setTyped] = useState('');
  const query = normaliseSeamQuery(typed);
  const found = query === null ? null : lookUpSeam(doc, typed);
  const numbers = doc.seams.map((s) => s.label);
  return (
    <View style={styles.card}>
      <Text variant="label" nativeID="seam-number-label" style={styles.inputLabel}>
        Seam number
      </Text>
      <TextInput
        value={typed}
        onChangeText={setTyped}
        accessibilityLabel="Seam number"
        aria-labelledby="seam-number-label"
        keyboardType="number-pad"
        inputMode="numeric"
        placeholder="e.g. 12"
        placeholderTextColor={palette.onBenchSoft}
        maxLength={6}
        style={styles.input}
      />
      <View aria-live="polite">
        {query === null ? (
          <Text style={styles.hintText}>Type the number in the square on a piece's edge. This pattern has seams {rangeText(numbers)}.</Text>
        ) : !found ? (
          <Text role="alert" style={styles.missing}>
            No seam {query} in this pattern. Its seams are {rangeText(numbers)}.
          </Text>
        ) : (
          <View style={styles.result} accessibilityLabel={`Seam ${found.seam.label}`}>
            <Text style={styles.joins}>
              Seam {found.seam.label} joins {found.sides[0].piece === found.sides[1].piece ? `piece ${found.sides[0].piece} to itself` : `${found.sides[0].piece} and ${found.sides[1].piece}`}
            </Text>
            <View style={[styles.corner, found.corner === 'inside' ? styles.inside : styles.outside]}>
              <Text style={styles.cornerText}>
                {found.corner === 'outside' ? '△ Outside corner' : '▲ Inside corner'} · {Math.round(found.seam.length3d)} mm long
              </Text>
            </View>
            <View style={styles.sides}>
              {found.sides.map((s, i) => (
                <View key={i} style={styles.side}>
                  <Text style={styles.pieceName}>Piece {s.piece}</Text>
                  <Text style={styles.bevel} accessibilityLabel={`Bevel ${formatBevel(s.bevelDeg)} on piece ${s.piece}, ${FACE_WORDS[s.face]}`}>
                    {s.face === 'none' ? 'Square' : formatBevel(s.bevelDeg)}
                  </Text>
                  <Text style={styles.face}>{FACE_WORDS[s.face]}</Text>
                </View>
              ))}
            </View>
            {found.varies ? (
              <View style={styles.stations}>
                <Text style={styles.stationHead}>
                  Bevel changes along the seam ({formatBevel(found.seam.bevel.min)}–{formatBevel(found.seam.bevel.max)}). From the seam's start:
                </Text>
                {benchStations(found.seam).map((st) => (
                  <Text key={st.atMm} style={styles.station}>
                    {String(Math.round(st.atMm)).padStart(4, ' ')} mm → {formatBevel(st.bevelDeg)}
                  </Text>
                ))}
              </View>
            ) : null}
          </View>
        )}
      </View>
    </View>
  );
}

/** "1–30" for consecutive numbers, else the list ("1, 2, 5"), or "none" for a pattern without seams. */
export function rangeText(labels: readonly string[]): string {
  if (labels.length === 0) return 'none';
  const nums = labels.map(Number);
  if (nums.every((n) => Number.isInteger(n))) {
    const sorted = [...nums].sort((a, b) => a - b);
    if (sorted.every((n, i) => i === 0 || n === sorted[i - 1] + 1)) return sorted.length === 1 ? String(sorted[0]) : `${sorted[0]}–${sorted[sorted.length - 1]}`;
    return sorted.join(', ');
  }
  return labels.join(', ');
}

const styles = StyleSheet.create({
  card: { backgroundColor: palette.bench, borderRadius: radius.lg, padding: space.lg, gap: space.sm },
  input: {
    fontFamily: fonts.monoStrong,
    fontSize: 44,
    minHeight: 72,
    color: palette.onBench,
    borderWidth: 2,
    borderColor: palette.benchLine,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    backgroundColor: '#3a332e',
  },
  inputLabel: { color: palette.onBench },
  hintText: { color: palette.onBenchSoft, fontSize: 15 },
  missing: { color: '#ffb4a6', fontSize: 17 },
  result: { gap: space.md },
  joins: { color: palette.onBench, fontFamily: fonts.bodyStrong, fontSize: 20 },
  corner: { alignSelf: 'flex-start', paddingHorizontal: space.md, paddingVertical: space.xs, borderRadius: radius.pill },
  outside: { backgroundColor: '#4a413a' },
  inside: { backgroundColor: palette.ember },
  cornerText: { color: palette.onBench, fontSize: 16, fontFamily: fonts.bodyStrong },
  sides: { flexDirection: 'row', gap: space.md },
  side: { flex: 1, backgroundColor: '#3a332e', borderRadius: radius.md, padding: space.md, gap: space.xxs },
  pieceName: { color: palette.onBenchSoft, fontSize: 18, fontFamily: fonts.bodyStrong },
  bevel: { color: palette.onBench, fontSize: 52, lineHeight: 60, fontFamily: fonts.display },
  face: { color: palette.sand, fontSize: 16 },
  stations: { gap: space.xxs, paddingTop: space.xs, borderTopWidth: 1, borderTopColor: palette.benchLine },
  stationHead: { color: palette.onBenchSoft, fontSize: 15 },
  station: { color: palette.onBench, fontFamily: fonts.mono, fontSize: 20 },
});
