/** The members page of the current shop: the members panel with a page title. */
import { useCurrentShop } from '../../hooks/current-shop';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { MembersPanel } from './members-panel';

/** Renders the panel for the shop chosen in the navigation. */
export function MembersScreen() {
  const { membership } = useCurrentShop();
  return (
    <Screen>
      <PageTitle title="Crew and clients" />
      <Text variant="title" heading={1} style={{ marginBottom: space.lg }}>
        {membership ? membership.shopName : 'Crew and clients'}
      </Text>
      {membership ? <MembersPanel shopId={membership.shopId} /> : <Notice tone="note">You do not belong to a shop yet.</Notice>}
    </Screen>
  );
}
