import { useLocalSearchParams } from 'expo-router';
import { BuildScreen } from '../../../components/builds/build-screen';

export default function BuildRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <BuildScreen buildId={String(id)} shopId={typeof shop === 'string' && shop ? shop : null} />;
}
