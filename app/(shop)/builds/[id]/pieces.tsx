/** /builds/:id/pieces?shop=:shopId — the build's flattened pieces and their settings. */
import { useLocalSearchParams } from 'expo-router';
import { PiecesScreen } from '../../../../components/pieces/pieces-screen';

export default function PiecesRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <PiecesScreen buildId={String(id)} shopParam={typeof shop === 'string' && shop ? shop : null} />;
}
