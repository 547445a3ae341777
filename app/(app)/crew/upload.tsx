import { lazyScreen } from '@/components/shell/lazy-screen';

const UploadScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.UploadScreen), 'Loading the upload…');

export default function CrewUploadRoute() {
  return <UploadScreen />;
}
