/**
 * A boxed message: an error from the server, a caution, or a plain note.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Text } from './text';
import { palette, radius, space } from './theme';

export type NoticeTone = 'error' | 'caution' | 'note';

const tones: Record<NoticeTone, { bg: string; bar: string; fg: string }> = {
  error: { bg: palette.dangerWash, bar: palette.danger, fg: palette.danger },
  caution: { bg: palette.cautionWash, bar: palette.caution, fg: palette.ink },
  note: { bg: palette.sheetSunk, bar: palette.slate, fg: palette.ink },
};

/**
 * Renders `children` (text or nodes) with an optional bold `title`. Errors get role "alert" so they are
 * announced when they appear; cautions and notes are role "note".
 */
export function Notice({ tone, title, children }: { tone: NoticeTone; title?: string; children: ReactNode }) {
  const t = tones[tone];
  return (
    <View role={tone === 'error' ? 'alert' : 'note'} style={[styles.box, { backgroundColor: t.bg, borderLeftColor: t.bar }]}>
      {title ? <Text variant="bodyStrong" style={{ color: t.fg }}>{title}</Text> : null}
      {typeof children === 'string' ? <Text style={{ color: t.fg }}>{children}</Text> : children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    borderLeftWidth: 4,
    borderRadius: radius.sm,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    gap: space.xs,
    marginBottom: space.lg,
  },
});
