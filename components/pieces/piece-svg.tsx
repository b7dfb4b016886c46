/**
 * One pattern piece on a native device: react-native-svg is not part of the app, so the native build shows the
 * piece's name and size in words; the web build (piece-svg.web.tsx) draws it.
 */
import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import type { PieceSvgModel } from './piece-svg-model';

export interface PieceSvgProps {
  model: PieceSvgModel;
  pxPerMm: number;
  fill: string;
  outlineBoost?: number;
  title: string;
  thumbnail?: boolean;
}

/** Renders a box of the piece's drawn size with its description. */
export function PieceSvg({ model, pxPerMm, fill, title }: PieceSvgProps) {
  return (
    <View style={[styles.box, { width: Math.max(80, model.viewBox[2] * pxPerMm), minHeight: 48, backgroundColor: fill }]} role="img" accessibilityLabel={title}>
      <Text variant="small">{title}</Text>
      <Text variant="mono">
        {Math.round(model.viewBox[2])} × {Math.round(model.viewBox[3])} mm
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({ box: { borderWidth: 1, borderColor: palette.ruleStrong, padding: space.sm, gap: space.xxs } });
