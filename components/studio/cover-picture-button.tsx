/**
 * "Cover picture": takes the studio's current 3D view as the cover of the build's pattern pack (the owner then
 * publishes it from the build page). Reads the WebGL canvas, which the viewport draws with a preserved buffer.
 */
import { useState } from 'react';
import { Text } from '../ui/text';
import { renderCoverFromCanvas } from '../packs/render-cover';
import { usePackCoverPicture } from '../../hooks/use-pack-cover-picture';
import { ToolButton } from './studio-tools';

export function CoverPictureButton({ buildId }: { buildId: string }) {
  const { keep } = usePackCoverPicture(buildId);
  const [said, setSaid] = useState<string | null>(null);
  const take = () => {
    const canvas = typeof document !== 'undefined' ? document.querySelector<HTMLCanvasElement>('canvas[data-studio-view]') : null;
    if (!canvas) {
      setSaid('The 3D view is not drawn yet, so no picture was taken.');
      return;
    }
    try {
      const kept = keep(renderCoverFromCanvas(canvas));
      setSaid(kept ? 'Cover picture taken: the pack form on the build page will use it.' : 'Cover picture taken for this page only (the browser would not keep it).');
    } catch (err) {
      setSaid(err instanceof Error ? err.message : 'The picture could not be taken.');
    }
  };
  return (
    <>
      <ToolButton label="Cover picture" onPress={take} accessibilityLabel="Take this view as the pattern pack's cover picture" />
      {said ? (
        <Text variant="small" accessibilityLiveRegion="polite">
          {said}
        </Text>
      ) : null}
    </>
  );
}
