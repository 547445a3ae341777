import { UploadScreen } from '@/components/crew/UploadScreen';

export default function CrewUploadRoute() {
  return <UploadScreen />;
}
