/** /builds/:id/studio?shop=:shopId — mark seams on the build's sculpt in 3D and see its pieces. */
import { useLocalSearchParams } from 'expo-router';
import { StudioScreen } from '../../../../components/studio/studio-screen';

export default function StudioRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <StudioScreen buildId={String(id)} shopId={typeof shop === 'string' && shop ? shop : null} />;
}
