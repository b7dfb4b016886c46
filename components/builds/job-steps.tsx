/**
 * What happens to a build from here: the job's steps, with the shop-safety cautions.
 */
import { StyleSheet, View } from 'react-native';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

const steps: ReadonlyArray<{ title: string; body: string }> = [
  {
    title: 'Sculpt in',
    body: 'Upload the prop as an OBJ, STL or PLY file, say which units it was modelled in, and scale it to the wearer (head circumference and height for a helmet).',
  },
  {
    title: 'Mark seams',
    body: 'On the 3D view, pick where the piece edges go. Seams follow the mesh edges; a shape that curves two ways needs more seams or a dart, because foam only bends easily one way.',
  },
  {
    title: 'Flatten',
    body: 'Each piece is laid flat with as little stretch as possible. The stretch map shows, in percent, where the foam would have to stretch or squeeze to take the shape.',
  },
  {
    title: 'Bevels and match marks',
    body: 'Every seam gets a number and the bevel to cut on each side, so the outer faces close without a gap. Numbered ticks on both pieces line them up at glue-up.',
  },
  {
    title: 'Print and cut',
    body: 'Print the pattern at true scale on home paper sizes with a check square to measure, or export it for a laser or blade cutter, then trace, cut, bevel, heat-shape and glue.',
  },
];

/** Lists the five job steps for a build, numbered, with the shop-safety cautions for the cutting and gluing. */
export function JobSteps() {
  return (
    <Card>
      <Text variant="heading" heading={2} style={styles.title}>
        From sculpt to foam
      </Text>
      <Text variant="small" style={styles.lead}>
        The road from sculpt to foam, step by step.
      </Text>
      <View role="list">
        {steps.map((s, i) => (
          <View role="listitem" key={s.title} style={styles.step}>
            <Text variant="mono" style={styles.number}>
              {String(i + 1).padStart(2, '0')}
            </Text>
            <View style={styles.stepText}>
              <Text variant="bodyStrong">{s.title}</Text>
              <Text variant="small">{s.body}</Text>
            </View>
          </View>
        ))}
      </View>
      <Notice tone="caution" title="At the bench">
        <Text>
          Sharp blades and rotary tools: cut away from your hands and change blades often. Heat guns: heat-resistant
          surface, and do not scorch the foam (the fumes are harmful). Contact cement: work with good ventilation, a
          respirator rated for organic vapours, eye protection and no flames nearby. The adhesive maker's safety data
          sheet and your local rules come first.
        </Text>
      </Notice>
    </Card>
  );
}

const styles = StyleSheet.create({
  title: { marginBottom: space.xs },
  lead: { marginBottom: space.lg },
  step: { flexDirection: 'row', gap: space.md, paddingBottom: space.lg },
  number: { color: palette.ember, fontSize: 15, lineHeight: 24, width: 24 },
  stepText: { flex: 1, gap: space.xxs },
});
