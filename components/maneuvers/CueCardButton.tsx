import { Linking, Platform } from 'react-native';

import { apiUrl } from '@/components/api/client';
import { Button } from '@/components/ui/Button';

/** The download address of a cleared version's printable cue card (the session cookie authorises it). */
export function cueCardUrl(versionId: string): string {
  return apiUrl(`/sequences/versions/${versionId}/cue-card.pdf`);
}

/** Props of {@link CueCardButton}. */
export interface CueCardButtonProps {
  /** A cleared version's id (others have no card: the server answers 409). */
  versionId: string;
}

/** "Cue card (PDF)": downloads the printable card of a cleared version. */
export function CueCardButton({ versionId }: CueCardButtonProps) {
  const open = () => {
    const url = cueCardUrl(versionId);
    // On the web the response is an attachment, so the page stays where it is while the file downloads.
    if (Platform.OS === 'web') window.location.assign(url);
    else void Linking.openURL(url);
  };
  return <Button label="Cue card (PDF)" icon="printer" variant="secondary" size="sm" onPress={open} accessibilityLabel="Download the printable cue card (PDF)" testID="cue-card-button" />;
}
