import { Alert, Link, List } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink } from 'react-router';
import { paths } from '@/lib/config/paths';
import { referenceMaterialsQueries } from '../api/reference-materials-queries';
import { expiryWords } from './material-status';

/** For the overview: reference materials in use that reach their expiry date within 30 days. */
export function ExpiringMaterialsNotice() {
  const expiring = useQuery(referenceMaterialsQueries.expiring());
  if (!expiring.data?.length) return null;
  return (
    <Alert.Root status="warning" variant="surface" maxW="4xl">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>Reference materials expiring within 30 days</Alert.Title>
        <Alert.Description>
          <List.Root ps="4" mt="1">
            {expiring.data.map((m) => (
              <List.Item key={m.id}>
                {m.name}, lot {m.lot}: {expiryWords(m)} ({m.expiresOn})
              </List.Item>
            ))}
          </List.Root>
          <Link asChild variant="underline" mt="1">
            <RouterLink to={paths.referenceMaterials.getHref()}>Open the register</RouterLink>
          </Link>
        </Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}
