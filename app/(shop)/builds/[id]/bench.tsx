/** /builds/:id/bench?shop=:shopId — the bench view for the crew. */
import { useLocalSearchParams } from 'expo-router';
import { BenchScreen } from '../../../../components/bench/bench-screen';

export default function BenchRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <BenchScreen buildId={String(id)} shopParam={typeof shop === 'string' && shop ? shop : null} />;
}
