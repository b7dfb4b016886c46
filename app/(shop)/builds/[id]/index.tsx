/** /builds/:id?shop=:shopId — one build; the shop id travels in the link so it opens in the right shop. */
import { useLocalSearchParams } from 'expo-router';
import { BuildScreen } from '../../../../components/builds/build-screen';

export default function BuildRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <BuildScreen buildId={String(id)} shopId={typeof shop === 'string' && shop ? shop : null} />;
}
