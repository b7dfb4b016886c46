/** A file picker for a pack's cover: on phones the cover comes from the 3D view instead, so this says so. */
import { Text } from '../ui/text';

/** Renders a note in place of the web file picker; `onPick` is never called here. */
export function CoverFileInput(_props: { onPick: (file: Blob | null) => void }) {
  return <Text variant="small">Pick a cover image on a computer, or take one from the 3D view in the studio.</Text>;
}
