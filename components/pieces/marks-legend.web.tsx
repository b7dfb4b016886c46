/**
 * What the marks on a piece mean, each with a small drawing in the same pens as the board and the print set.
 */
import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';
import { SCREEN_PENS, SCREEN_TEXT_COLORS } from './mark-styles';
import { LEGEND_ENTRIES, type LegendKey } from './marks-legend-entries';

const pen = (style: keyof typeof SCREEN_PENS) => ({
  stroke: SCREEN_PENS[style].color,
  strokeWidth: SCREEN_PENS[style].widthPx,
  strokeDasharray: SCREEN_PENS[style].dash?.join(' '),
  fill: 'none',
});

/** A 56 × 28 px sample of mark `key`; the edge of the piece runs along the bottom where it matters. */
function Sample({ k }: { k: LegendKey }) {
  const edge = <path d="M2 24 L54 24" {...pen('cut')} />;
  let body;
  switch (k) {
    case 'cut':
      body = <path d="M4 24 L20 4 L52 8 L50 24 Z" {...pen('cut')} />;
      break;
    case 'match':
      body = (
        <>
          {edge}
          <path d="M20 24 L20 11 M24 24 L24 17 M28 24 L28 17" {...pen('match')} />
          <rect x="36" y="6" width="12" height="12" {...pen('match')} />
          <text x="42" y="13" fontSize="9" fontFamily={fonts.display} fill={SCREEN_TEXT_COLORS.match} textAnchor="middle" dominantBaseline="middle">
            12
          </text>
        </>
      );
      break;
    case 'outside':
    case 'inside':
      body = (
        <>
          {edge}
          {[10, 26, 42].map((x) => (
            <path key={x} d={`M${x} 22 L${x + 4} 15 L${x - 4} 15 Z`} {...pen('bevel')} fill={k === 'inside' ? SCREEN_PENS.bevel.color : 'none'} />
          ))}
        </>
      );
      break;
    case 'station':
      body = (
        <>
          {edge}
          <path d="M28 27 L28 14" {...pen('station')} />
          <text x="28" y="8" fontSize="8" fontFamily={fonts.mono} fill={SCREEN_TEXT_COLORS.station} textAnchor="middle" dominantBaseline="middle">
            18°
          </text>
        </>
      );
      break;
    case 'score':
      body = <path d="M4 14 L52 14" {...pen('score')} />;
      break;
    case 'dart':
      body = <path d="M6 14 L46 14 M41 10 L46 14 L41 18" {...pen('dart')} />;
      break;
  }
  return (
    <svg width={56} height={28} viewBox="0 0 56 28" aria-hidden="true" style={{ display: 'block', flexShrink: 0 }}>
      {body}
    </svg>
  );
}

/** Renders the legend: one row per mark with its sample drawing, name and meaning. */
export function MarksLegend() {
  return (
    <View style={styles.box}>
      <Text variant="overline" heading={2}>
        Marks on the pieces
      </Text>
      <View role="list" accessibilityLabel="What the marks mean" style={styles.list}>
        {LEGEND_ENTRIES.map((e) => (
          <View key={e.key} role="listitem" style={styles.row}>
            <Sample k={e.key} />
            <Text variant="small" style={styles.text}>
              <Text variant="label">{e.name}</Text> — {e.meaning}
            </Text>
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.lg, backgroundColor: palette.sheet, borderRadius: radius.md, borderWidth: 1, borderColor: palette.rule },
  list: { gap: space.sm },
  row: { flexDirection: 'row', gap: space.md, alignItems: 'center' },
  text: { flex: 1 },
});
