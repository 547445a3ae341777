import { useRouter } from 'expo-router';

import { Button } from '@/components/ui/Button';
import { Screen } from '@/components/ui/Screen';

import { ReviewDetail } from './ReviewDetail';

/** Props of {@link ReviewScreen}. */
export interface ReviewScreenProps {
  versionId: string;
}

/** A full page for one version under review: the target of the e-mail link `/reviews/<versionId>`. */
export function ReviewScreen({ versionId }: ReviewScreenProps) {
  const router = useRouter();
  return (
    <Screen>
      <Button label="Review queue" icon="chevron-left" variant="ghost" size="sm" onPress={() => router.navigate('/reviews')} />
      <ReviewDetail versionId={versionId} />
    </Screen>
  );
}
