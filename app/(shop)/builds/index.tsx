/** /builds: the current shop's builds. */
import { BuildsListScreen } from '../../../components/builds/builds-list-screen';

export default function BuildsRoute() {
  return <BuildsListScreen />;
}
