/** The site root: the builds list (the signed-in layout sends anonymous visitors on to sign in). */
import { Redirect } from 'expo-router';

export default function Index() {
  return <Redirect href="/builds" />;
}
