import { usePathname, useRouter } from 'expo-router';

import { AuthCard } from '@/components/auth/AuthCard';
import { Button } from '@/components/ui/Button';
import { Text } from '@/components/ui/Text';

/** Any address no screen answers: says so in the product's own frame and leads back to the start. */
export default function NotFound() {
  const router = useRouter();
  const path = usePathname();
  return (
    <AuthCard title="Nothing at this address" subtitle="The link may be mistyped, or the page has moved.">
      <Text variant="caption" tone="muted" selectable>
        {path}
      </Text>
      {/* `/` sends a signed-in person to their first tab and everyone else to sign-in. */}
      <Button label="Go to the start" icon="home" onPress={() => router.replace('/')} />
    </AuthCard>
  );
}
