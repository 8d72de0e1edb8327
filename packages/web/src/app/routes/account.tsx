import { useQueryClient } from '@tanstack/react-query';
import { useSignedIn } from './app-layout';
import { AccountPage } from '@/features/account/components/account-page';
import { meQueryKey } from '@/features/auth/api/get-me';

export function AccountRoute() {
  const { me } = useSignedIn();
  const queryClient = useQueryClient();
  return <AccountPage me={me} onSaved={(saved) => queryClient.setQueryData(meQueryKey, saved)} />;
}
