import { SuitsScreen } from '@/components/crew/SuitsScreen';

export default function CrewSuitsRoute() {
  return <SuitsScreen />;
}
