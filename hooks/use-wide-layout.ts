/**
 * Whether the window is wide enough for the side-bar layout.
 */
import { useWindowDimensions } from 'react-native';
import { wideLayoutMinWidth } from '../components/ui/theme';

/** True when the window is at least the theme's wide-layout width (1024 px); follows window resizes. */
export function useWideLayout(): boolean {
  return useWindowDimensions().width >= wideLayoutMinWidth;
}
