/** Any address the app does not know. */
import { NotFoundScreen } from '../components/nav/not-found-screen';

export default function NotFoundRoute() {
  return <NotFoundScreen />;
}
