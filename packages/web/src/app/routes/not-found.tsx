import { Body1, Title3 } from '@fluentui/react-components';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';

export function NotFoundRoute() {
  return (
    <main>
      <Title3 as="h1">Page not found</Title3>
      <Body1 as="p">
        <RouterLink to={paths.events}>Go to the events</RouterLink>
      </Body1>
    </main>
  );
}
