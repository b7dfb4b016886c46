/** /builds/:id/sheets?shop=:shopId — stock, sheet plan and print set of the build. */
import { useLocalSearchParams } from 'expo-router';
import { SheetsScreen } from '../../../../components/sheets/sheets-screen';

export default function SheetsRoute() {
  const { id, shop } = useLocalSearchParams<{ id: string; shop?: string }>();
  return <SheetsScreen buildId={String(id)} shopParam={typeof shop === 'string' && shop ? shop : null} />;
}
