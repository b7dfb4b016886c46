/** /builds/:id/upload?shop=:shopId — upload a new sculpt version to a build. */
import { useLocalSearchParams } from 'expo-router';
import { UploadScreen } from '../../../../components/sculpts/upload-screen';

export default function UploadRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <UploadScreen buildId={String(id)} shopId={typeof shop === 'string' && shop ? shop : null} />;
}
