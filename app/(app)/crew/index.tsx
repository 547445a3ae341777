import { CrewScreen } from '@/components/crew/CrewScreen';

export default function CrewRoute() {
  return <CrewScreen />;
}
