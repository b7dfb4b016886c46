/** /packs: the public catalogue of pattern packs (no sign-in). */
import { CatalogueScreen } from '../../components/packs/catalogue-screen';

export default function PacksRoute() {
  return <CatalogueScreen />;
}
