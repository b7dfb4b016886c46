/** /packs/:slug: one pattern pack; `?paid=1` or `?cancelled=1` when coming back from the payment page. */
import { useLocalSearchParams } from 'expo-router';
import { PackScreen } from '../../components/packs/pack-screen';

export default function PackRoute() {
  const { slug, paid, cancelled } = useLocalSearchParams<{ slug: string; paid?: string; cancelled?: string }>();
  return <PackScreen slug={String(slug)} returned={paid ? 'paid' : cancelled ? 'cancelled' : null} />;
}
