/** /downloads/:token: a buyer's download link from the receipt e-mail (no sign-in). */
import { useLocalSearchParams } from 'expo-router';
import { DownloadScreen } from '../../components/packs/download-screen';

export default function DownloadRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <DownloadScreen token={String(token)} />;
}
