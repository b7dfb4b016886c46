import { BuildsListScreen } from '../../../components/builds/builds-list-screen';

export default function BuildsRoute() {
  return <BuildsListScreen />;
}
